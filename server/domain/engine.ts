// The one door from the server into the engine: reading circuits and netlists, solving.
import { NETLIST_EXTENSION, parseNetwork, solveNetwork, type Diagnostic, type Network, type SolveOptions, type SolveResult } from "../../shared/engine/index.js";
import { HttpError } from "../lib/errors.js";

export { NETLIST_EXTENSION, parseNetwork, solveNetwork };
export type { Diagnostic, Network, SolveOptions, SolveResult };

// A stored circuit must have the engine's shape; whether it is solvable is the solve's business.
export function readCircuit(input: Record<string, unknown>, field = "circuit"): Network {
  const { network, diagnostics } = parseNetwork(input);
  if (!network) {
    throw new HttpError(400, "invalid_circuit", "The circuit is not in Portfold's network format.", { [field]: diagnostics[0]?.message ?? "invalid" }, diagnostics);
  }
  return network;
}

// An uploaded file: our JSON or our text netlist (the engine tells them apart); errors carry line and column.
export function readNetworkFile(text: string): { network: Network; format: "json" | "text" } {
  const { network, diagnostics, format } = parseNetwork(text);
  if (!network) {
    const message = format === "text" ? "The netlist has errors; each one names its line and column." : "The file is not a Portfold network in JSON.";
    throw new HttpError(400, "invalid_network_file", message, undefined, diagnostics);
  }
  return { network, format };
}
