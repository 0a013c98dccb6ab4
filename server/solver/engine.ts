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
} from "../../shared/engine/index.js";

export { BUILT_IN_CELLS, NETLIST_EXTENSION, solveNetwork };
export type { CellDefinition, Diagnostic, Network, SolveOptions };

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
