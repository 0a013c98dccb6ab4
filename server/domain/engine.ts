// The one door from the server into the engine: reading circuits and netlists, solving.
import { parseValue } from "../../shared/engine/algebra/index.js";
import {
  BUILT_IN_CELLS,
  NETLIST_EXTENSION,
  checkCellDefinition,
  parseNetwork as engineParse,
  solveNetwork,
  type CellDefinition,
  type Diagnostic,
  type Network,
  type ParseResult,
  type SolveOptions,
  type SolveResult,
} from "../../shared/engine/index.js";
import { HttpError } from "../lib/errors.js";

export { BUILT_IN_CELLS, NETLIST_EXTENSION, solveNetwork };
export type { CellDefinition, Diagnostic, Network, SolveOptions, SolveResult };

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

/**
 * A circuit and/or its netlist text from a request. Text that is sent must read without errors;
 * the circuit is taken from the text when only the text is sent. Null text: made from JSON.
 */
export function readCircuitAndText(body: { circuit?: Record<string, unknown>; netlist?: string | null }): { circuit: Network; netlist: string | null | undefined } {
  if (typeof body.netlist === "string") {
    const read = parseNetwork(body.netlist);
    if (!read.network || read.format !== "text") {
      throw new HttpError(400, "invalid_netlist", "The netlist text has errors; each one names its line and column.", { netlist: read.diagnostics[0]?.message ?? "not a Portfold netlist" }, read.diagnostics);
    }
    return { circuit: body.circuit !== undefined ? readCircuit(body.circuit) : read.network, netlist: body.netlist };
  }
  if (body.circuit === undefined) throw new HttpError(400, "invalid_circuit", "Send the circuit with its text set to null.", { circuit: "missing" });
  return { circuit: readCircuit(body.circuit), netlist: body.netlist };
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

const definitionProblem = (message: string, path: (string | number)[], elements: string[] = []): Diagnostic => ({ code: "schema-invalid", severity: "error", message, elements, nodes: [], path });

/**
 * A team's cell definition as the engine reads it: its shape (the engine's own schema, reached
 * through a network that carries only the definition), checkCellDefinition, and every value's
 * syntax. Diagnostics have paths under "definition".
 */
export function readCellDefinition(input: unknown): { definition: CellDefinition | null; diagnostics: Diagnostic[] } {
  const terminals = (input as { terminals?: unknown })?.terminals;
  const [plus, minus] = Array.isArray(terminals) && terminals.length >= 2 ? terminals : ["a", "b"];
  const probe = parseNetwork({ port: { plus, minus }, elements: [], cellDefinitions: [input] });
  if (!probe.network) {
    const diagnostics = probe.diagnostics.map((d) => {
      const rest = d.path?.[0] === "cellDefinitions" ? d.path.slice(2) : (d.path ?? []);
      return { ...d, message: d.message.replace(/^cellDefinitions\[0\]\.?/, "definition."), path: ["definition", ...rest] };
    });
    return { definition: null, diagnostics };
  }
  const definition = probe.network.cellDefinitions![0];
  const diagnostics = checkCellDefinition(definition).map((m) => definitionProblem(m, ["definition"]));
  definition.elements.forEach((e, i) => {
    if (!("value" in e)) return;
    try {
      parseValue(e.value);
    } catch (error) {
      const why = error instanceof Error ? error.message : String(error);
      diagnostics.push({ ...definitionProblem(`element "${e.name}": the value "${e.value}" cannot be read (${why})`, ["definition", "elements", i, "value"], [e.name]), code: "value-syntax" });
    }
  });
  return diagnostics.length > 0 ? { definition: null, diagnostics } : { definition, diagnostics };
}

/** Ids of the cells a circuit places that neither are built in nor come with the circuit. */
export function externalCellIds(circuit: Network): string[] {
  const own = new Set((circuit.cellDefinitions ?? []).map((d) => d.id));
  return [...new Set((circuit.cells ?? []).map((c) => c.cell))].filter((id) => !BUILT_IN_CELLS.has(id) && !own.has(id));
}
