// The one door from the server into the engine: reading circuits and netlists, solving.
import { NETLIST_EXTENSION, parseNetwork as engineParse, solveNetwork, type Diagnostic, type Network, type ParseResult, type SolveOptions, type SolveResult } from "../../shared/engine/index.js";
import { HttpError } from "../lib/errors.js";

export { NETLIST_EXTENSION, solveNetwork };
export type { Diagnostic, Network, SolveOptions, SolveResult };

/**
 * The engine's reader, held to its contract: whatever the input, an answer with diagnostics. Should
 * the reader itself fail on some input, that is reported as a diagnostic of the input (a 400), not
 * as a server fault.
 */
export function parseNetwork(input: unknown): ParseResult {
  try {
    return engineParse(input);
  } catch {
    const format = typeof input === "string" && !input.trimStart().startsWith("{") ? "text" : "json";
    const message = "Portfold could not read this network: its reader stopped at an unexpected construct. Check each line against the netlist form.";
    return { network: null, format, diagnostics: [{ code: "parse-error", severity: "error", message, elements: [], nodes: [] }] };
  }
}

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
