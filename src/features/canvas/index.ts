export { DrawingView } from "./components/drawing-view";
export { Schematic } from "./components/schematic";
export type { Layout } from "./model/drawing";
export { layoutFor } from "./model/sync";
