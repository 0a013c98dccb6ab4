export { NetlistEditor, editorDiagnostics } from "./components/netlist-editor";
export { NetworkPanel } from "./components/network-panel";
export type { NetworkTab } from "./components/network-panel";
export { SaveConflict } from "./components/save-conflict";
export { circuitOf, looksLikeJson, netlistOf, readNetlist, readNetworkText } from "./lib/netlist";
