// Portfold's engine: read a network (JSON or Portfold netlist), solve its port exactly.
// Pure: no I/O, usable by the server and the client alike.

import { attributeToCells, expandCells } from "./circuit/cells";
import { diagnostic } from "./circuit/diagnostics";
import { jsonErrorOffset } from "./circuit/json-position";
import { parseNetlistText } from "./circuit/netlist-text";
import { normalizeNetwork, validateNetworkJson } from "./circuit/schema";
import { checkNetwork, emptyResult, solveParsedNetwork, solvePortExact, type ExactPort } from "./circuit/solve";
import { independentSources, type IndependentSource } from "./circuit/sources";
import type { Diagnostic, Network, NetworkInput, ParseResult, SolveOptions, SolveResult } from "./types";

export * from "./types";
export { DIAGNOSTIC_CODES, type DiagnosticCode } from "./circuit/diagnostics";
export { NETLIST_EXTENSION, parseNetlistText, printNetlistText } from "./circuit/netlist-text";
export { networkSchema } from "./circuit/schema";
export { toSolveOutput, type SolveOutput } from "./circuit/output";
export { AMPLIFIER, BJT_HYBRID_PI, BUILT_IN_CELLS, MOSFET, checkCellDefinition, expandCells, printCellLine } from "./circuit/cells";
export { frequencyLimit, frequencyReport, frequencyResponse, frequencySpan, logFrequencies, numericCoefficientsInS, openCircuitTransfer, polesAndZeros, polynomialRoots, type OpenCircuitTransfer } from "./circuit/frequency";
export { approximate, parseAssumption, type Assumption } from "./circuit/approximations";
export { designSolve, type DesignSolveAnswer, type DesignSolveRequest } from "./circuit/design-solve";

/**
 * Read a network from the text netlist, from JSON text, or from an already-parsed JSON value.
 * Text starting with "{" is taken as JSON.
 */
export function parseNetwork(input: string | unknown): ParseResult {
  if (typeof input !== "string") {
    const v = validateNetworkJson(input);
    return { network: v.network, diagnostics: v.diagnostics, format: "json" };
  }
  if (input.trimStart().startsWith("{")) {
    let value: unknown;
    try {
      value = JSON.parse(input);
    } catch (e) {
      const message = e instanceof Error ? e.message : String(e);
      const at = jsonErrorPosition(input);
      const where = at.line !== undefined ? ` (line ${at.line}, column ${at.column})` : "";
      return { network: null, diagnostics: [diagnostic("invalid-json", `the input is not valid JSON${where}: ${message}`, at)], format: "json" };
    }
    const v = validateNetworkJson(value);
    return { network: v.network, diagnostics: v.diagnostics, format: "json" };
  }
  return parseNetlistText(input);
}

/** Solve a network's port: Vth, Isc, Rth (test source and Voc/Isc), with the ledger and diagnostics. */
export function solveNetwork(input: string | NetworkInput | Network, options: SolveOptions = {}): SolveResult {
  const parsed = parseNetwork(input);
  if (!parsed.network) return emptyResult(null, parsed.diagnostics);
  return solveParsedNetwork(normalizeNetwork(parsed.network), options, parsed.positions);
}

/**
 * The exact results only, as rational functions (no printing, no ledger): for callers that evaluate
 * or compare results themselves, and for the benchmark. `port` is null when a check failed.
 */
export function solveNetworkExact(input: string | NetworkInput | Network): { network: Network | null; diagnostics: Diagnostic[]; port: ExactPort | null } {
  const parsed = parseNetwork(input);
  if (!parsed.network) return { network: null, diagnostics: parsed.diagnostics, port: null };
  const expanded = expandCells(normalizeNetwork(parsed.network), parsed.positions);
  if (expanded.network === null) return { network: null, diagnostics: expanded.diagnostics, port: null };
  const network = expanded.network;
  const checked = checkNetwork(network, expanded.positions);
  if (checked.values === null) return { network, diagnostics: attributeToCells(checked.diagnostics, expanded.origin, parsed.network.cells), port: null };
  return { network, diagnostics: attributeToCells(checked.diagnostics, expanded.origin, parsed.network.cells), port: solvePortExact(network, checked.values, checked.terms) };
}

export type { ExactPort, IndependentSource };

/** The independent sources of a network, its cells expanded; null when it does not read (or a cell is unknown). */
export function independentSourcesOf(input: string | NetworkInput | Network): IndependentSource[] | null {
  const parsed = parseNetwork(input);
  if (!parsed.network) return null;
  const expanded = expandCells(normalizeNetwork(parsed.network), parsed.positions);
  return expanded.network ? independentSources(expanded.network) : null;
}

/**
 * Everything a solve would refuse the network for, without solving: reading, cells, names,
 * values, controls and topology (floating nodes, source loops and cutsets). For live checking.
 */
export function checkNetworkInput(input: string | NetworkInput | Network): Diagnostic[] {
  const parsed = parseNetwork(input);
  if (!parsed.network) return parsed.diagnostics;
  const expanded = expandCells(normalizeNetwork(parsed.network), parsed.positions);
  if (expanded.network === null) return [...parsed.diagnostics, ...expanded.diagnostics];
  const checked = checkNetwork(expanded.network, expanded.positions);
  return [...parsed.diagnostics, ...attributeToCells(checked.diagnostics, expanded.origin, parsed.network.cells)];
}

// JSON.parse does not always say where; find the offset ourselves and turn it into a line and column.
function jsonErrorPosition(text: string): { line?: number; column?: number } {
  const at = jsonErrorOffset(text);
  if (at === null) return {};
  const lines = text.slice(0, at).split("\n");
  return { line: lines.length, column: lines[lines.length - 1].length + 1 };
}
