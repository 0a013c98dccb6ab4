// The netlist reader and printer of the shared engine, apart from the algebra so the team
// screen can read a netlist without loading the exact-algebra bundle.
export { parseNetlistText, printElementLine, printNetlistText, NETLIST_EXTENSION } from "../../shared/engine/circuit/netlist-text";
export { validateNetworkJson } from "../../shared/engine/circuit/schema";
export { ELEMENT_KINDS } from "../../shared/engine/types";
export { isControlled } from "../../shared/engine/circuit/elements";
export type { Element, ElementKind, Network as EngineNetwork, Quantity } from "../../shared/engine/types";
export { BUILT_IN_CELLS, CELL_GROUND } from "../../shared/engine/circuit/cells";
export type { CellDefinition, CellInstance } from "../../shared/engine/types";
