// Reading what people type: size bounds first (no parse at all past them), then the engine's reader
// on its own thread under the solver's caps, so no network or cell can hold up the request thread.
import { Invalid, rethrowSolverStopped, Unprocessable } from "./errors.js";
import type { CapBreach } from "../solver/caps.js";
import type { ReadOutcome } from "../solver/read-task.js";
import { checkExpressionBounds } from "./expression-bounds.js";
import { parseNetwork, type CellDefinition, type Diagnostic, type Network } from "../solver/engine.js";
import type { Services } from "./services.js";

function readCapped(found: CapBreach): Unprocessable {
  const why = found.cap === "time" ? `it took longer than the time cap of ${found.limit / 1000} s` : `it needed more memory than the cap of ${found.limit} MB`;
  return new Unprocessable("read_cap_exceeded", `Portfold stopped reading this input: ${why} (set by ${found.setting}); make its values smaller.`, { details: { cap: found } });
}

// Below this many typed characters, with no cells, a network reads in well under a millisecond: inline.
const inlineReadChars = 256;

function readsInline(kind: ReadOutcome["kind"], input: unknown, typedChars: number): boolean {
  if (kind !== "network" || typedChars > inlineReadChars) return false;
  if (typeof input === "string") return !/\bcell\b|\bwith\b/.test(input);
  const { cells, cellDefinitions } = (input ?? {}) as { cells?: unknown; cellDefinitions?: unknown };
  return cells === undefined && cellDefinitions === undefined;
}

async function read<K extends ReadOutcome["kind"]>(services: Services, kind: K, input: unknown): Promise<Extract<ReadOutcome, { kind: K }>> {
  const typedChars = checkExpressionBounds(input, services.settings.expressions);
  if (readsInline(kind, input, typedChars)) return { kind: "network", ...parseNetwork(input) } as Extract<ReadOutcome, { kind: K }>;
  const outcome = await services.solver.read(kind, input).catch(rethrowSolverStopped);
  if (outcome.kind === "capped") throw readCapped(outcome.breach);
  return outcome as Extract<ReadOutcome, { kind: K }>;
}

/** A network as the engine reads it, with its diagnostics (the solve judges them itself). */
export function readNetwork(services: Services, input: unknown) {
  return read(services, "network", input);
}

// A stored circuit must have the engine's shape; whether it is solvable is the solve's business.
async function readCircuit(services: Services, input: Record<string, unknown>, field = "circuit"): Promise<Network> {
  const { network, diagnostics } = await readNetwork(services, input);
  if (!network) {
    throw new Invalid("invalid_circuit", "The circuit is not in Portfold's network format.", { fields: { [field]: diagnostics[0]?.message ?? "invalid" }, diagnostics });
  }
  return network;
}

/**
 * A circuit and/or its netlist text from a request. Text that is sent must read without errors;
 * the circuit is taken from the text when only the text is sent. Null text: made from JSON.
 */
export async function readCircuitAndText(services: Services, body: { circuit?: Record<string, unknown>; netlist?: string | null }): Promise<{ circuit: Network; netlist: string | null | undefined }> {
  if (typeof body.netlist === "string") {
    const read = await readNetwork(services, body.netlist);
    if (!read.network || read.format !== "text") {
      throw new Invalid("invalid_netlist", "The netlist text has errors; each one names its line and column.", { fields: { netlist: read.diagnostics[0]?.message ?? "not a Portfold netlist" }, diagnostics: read.diagnostics });
    }
    return { circuit: body.circuit !== undefined ? await readCircuit(services, body.circuit) : read.network, netlist: body.netlist };
  }
  if (body.circuit === undefined) throw new Invalid("invalid_circuit", "Send the circuit with its text set to null.", { fields: { circuit: "missing" } });
  return { circuit: await readCircuit(services, body.circuit), netlist: body.netlist };
}

// An uploaded file: our JSON or our text netlist (the engine tells them apart); errors carry line and column.
export async function readNetworkFile(services: Services, text: string): Promise<{ network: Network; format: "json" | "text" }> {
  const { network, diagnostics, format } = await readNetwork(services, text);
  if (!network) {
    const message = format === "text" ? "The netlist has errors; each one names its line and column." : "The file is not a Portfold network in JSON.";
    throw new Invalid("invalid_network_file", message, { diagnostics });
  }
  return { network, format };
}

/** A team's cell definition as the engine reads it (readCellDefinition), off the request thread. */
export async function readCell(services: Services, input: unknown): Promise<{ definition: CellDefinition | null; diagnostics: Diagnostic[] }> {
  const { definition, diagnostics } = await read(services, "cell", input);
  return { definition, diagnostics };
}
