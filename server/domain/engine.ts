// The one door from the server into the engine: reading circuits and netlists, solving.
import { parseValue } from "../../shared/engine/algebra/index.js";
import { expressionBreach, type ExpressionBounds, type ExpressionBreach } from "../../shared/engine/algebra/expression-bounds.js";
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
import { Unprocessable } from "./errors.js";

export { BUILT_IN_CELLS, NETLIST_EXTENSION, solveNetwork };
export type { CellDefinition, Diagnostic, Network, SolveOptions, SolveResult };

const boundSetting: Record<ExpressionBreach["bound"], string> = {
  characters: "EXPRESSION_MAX_CHARS",
  terms: "EXPRESSION_MAX_TERMS",
  depth: "EXPRESSION_MAX_DEPTH",
  exponent: "EXPRESSION_MAX_EXPONENT",
};

const boundWords: Record<ExpressionBreach["bound"], string> = {
  characters: "characters",
  terms: "terms (numbers and names)",
  depth: "levels of nested brackets",
  exponent: "as the power it reaches (exponents multiply through nested brackets)",
};

/** Every user-typed expression of a network (JSON or netlist text) or a cell definition, with where it sits. */
function typedExpressions(input: unknown): { where: string; text: string }[] {
  if (typeof input === "string" && input.trimStart().startsWith("{")) {
    try {
      return typedExpressions(JSON.parse(input));
    } catch {
      return [];
    }
  }
  if (typeof input === "string") {
    return input.split(/\r?\n/).flatMap((line, i) => {
      const eq = line.indexOf("=");
      return eq < 0 ? [] : [{ where: `line ${i + 1}`, text: line.slice(eq + 1) }];
    });
  }
  const found: { where: string; text: string }[] = [];
  const elementValues = (elements: unknown, prefix: string) => {
    if (!Array.isArray(elements)) return;
    elements.slice(0, 10_000).forEach((e, i) => {
      const value = (e as { value?: unknown })?.value;
      if (typeof value === "string") found.push({ where: `${prefix}elements[${i}].value`, text: value });
    });
  };
  const network = (input ?? {}) as { elements?: unknown; cellDefinitions?: unknown; cells?: unknown };
  elementValues(network.elements, "");
  if (Array.isArray(network.cellDefinitions)) network.cellDefinitions.slice(0, 1_000).forEach((d, j) => elementValues((d as { elements?: unknown })?.elements, `cellDefinitions[${j}].`));
  if (Array.isArray(network.cells)) {
    network.cells.slice(0, 10_000).forEach((c, k) => {
      const symbols = (c as { symbols?: unknown })?.symbols;
      if (symbols && typeof symbols === "object") for (const [name, text] of Object.entries(symbols)) if (typeof text === "string") found.push({ where: `cells[${k}].symbols.${name}`, text });
    });
  }
  return found;
}

/**
 * Refuses, before anything parses it, a network or cell whose typed expressions go past a size bound:
 * 422 `expression_too_large` naming the bound, its setting and where the expression sits. Returns
 * how many typed characters it checked.
 */
export function checkExpressionBounds(input: unknown, bounds: ExpressionBounds): number {
  let typedChars = 0;
  for (const { where, text } of typedExpressions(input)) {
    typedChars += text.length;
    const found = expressionBreach(text, bounds);
    if (!found) continue;
    const setting = boundSetting[found.bound];
    throw new Unprocessable(
      "expression_too_large",
      `The expression at ${where} is too large to read: it has ${found.actual} ${boundWords[found.bound]}, over the bound of ${found.limit} set by ${setting}.`,
      { fields: { [where]: `over the ${found.bound} bound of ${found.limit}` }, details: { bound: { ...found, setting, where } } },
    );
  }
  return typedChars;
}

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
