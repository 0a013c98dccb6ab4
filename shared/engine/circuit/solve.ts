// The whole solve of one network and port: checks, nodal system, the three port set-ups,
// the cross-checks, and everything derived from the exact results.

import type { RationalFunction } from "../algebra";
import type { Diagnostic, Network, ParseResult, PortStatement, SolveOptions, SolveResult } from "../types";
import { approximationsOf, AssumptionSyntaxError, parseAssumption, type Assumption } from "./approximations";
import { attributeToCells, expandCells } from "./cells";
import { checkDimensions } from "./dimensions";
import { boundedApproximationsOf } from "./error-bound";
import { diagnostic, hasErrors } from "./diagnostics";
import { assembleNodalSystem, type NodalSystem } from "./mna";
import { checkResults, uncheckedMarks, undeterminedParts, vocIscAgreement } from "./checks";
import { isControlled } from "./elements";
import { hashString } from "./numeric";
import { solveOpenPort, solveShortedPort, type OpenPortSolution, type ShortPortSolution } from "./port-solution";
import { frequencyReport } from "./frequency";
import { exactExpression, limitsOf, parseAssignments, SENSITIVITY_SIZE_LIMIT, sensitivitiesOf, solveForTargets, valuesOf, type Results } from "./results";
import { buildLedger } from "./steps";
import { checkTopology, suspectStructures } from "./topology";
import { checkStructure } from "./validate";
import { LAPLACE, parseElementValues, type SourceTerms } from "./values";

export function emptyResult(network: Network | null, diagnostics: Diagnostic[]): SolveResult {
  return {
    ok: !hasErrors(diagnostics),
    network,
    vth: null,
    isc: null,
    rth: null,
    rthFromVocIsc: null,
    agree: null,
    numericCheck: null,
    checks: uncheckedMarks(),
    thevenin: null,
    norton: null,
    statements: [],
    limits: [],
    values: null,
    sensitivities: {},
    solved: [],
    dimensions: null,
    steps: [],
    diagnostics,
  };
}

/** Attach text-netlist line numbers to diagnostics that name an element. */
function placeDiagnostics(diagnostics: Diagnostic[], positions: ParseResult["positions"]): Diagnostic[] {
  if (!positions) return diagnostics;
  return diagnostics.map((d) => {
    if (d.line !== undefined || d.elements.length === 0) return d;
    const pos = positions[d.elements[0]];
    return pos ? { ...d, line: pos.line, column: d.column ?? 1 } : d;
  });
}

/** Every check that needs no determinant: structure, values, topology. Values are null when any fails. */
export function checkNetwork(
  network: Network,
  positions?: ParseResult["positions"],
): { values: Map<string, RationalFunction> | null; terms: SourceTerms; diagnostics: Diagnostic[] } {
  const structural = checkStructure(network);
  if (hasErrors(structural)) return { values: null, terms: new Map(), diagnostics: placeDiagnostics(structural, positions) };
  const parsed = parseElementValues(network, positions);
  const diagnostics = [...structural, ...parsed.diagnostics];
  if (hasErrors(parsed.diagnostics)) return { values: null, terms: parsed.terms, diagnostics: placeDiagnostics(diagnostics, positions) };
  diagnostics.push(...checkTopology(network));
  return { values: hasErrors(diagnostics) ? null : parsed.values, terms: parsed.terms, diagnostics: placeDiagnostics(diagnostics, positions) };
}

export function solveParsedNetwork(input: Network, options: SolveOptions = {}, inputPositions?: ParseResult["positions"]): SolveResult {
  // Cell instances become elements first; diagnostics then name the instance as well.
  const expanded = expandCells(input, inputPositions);
  if (expanded.network === null) return emptyResult(input, expanded.diagnostics);
  const result = solveExpandedNetwork(expanded.network, options, expanded.positions);
  return { ...result, network: input, diagnostics: attributeToCells(result.diagnostics, expanded.origin, input.cells) };
}

function solveExpandedNetwork(network: Network, options: SolveOptions, positions?: ParseResult["positions"]): SolveResult {
  const checked = checkNetwork(network, positions);
  const diagnostics: Diagnostic[] = checked.diagnostics;
  if (checked.values === null) return emptyResult(network, diagnostics);
  const values = checked.values;
  const terms = checked.terms;

  const port = solvePortExact(network, values, terms);
  const { system: sys, open, short, vth, rth, isc, rthFromVocIsc, agree } = port;
  const statements = [...port.statements];
  const seed = hashString(JSON.stringify(network));
  if (open.singular && short.singular) diagnostics.push(singularSystem(network, values, terms, seed));

  const results: Results = { vth, isc, rth, rthFromVocIsc };
  const result = emptyResult(network, diagnostics);
  const printLimit = options.printTermLimit ?? 5000;
  result.vth = vth && exactExpression(vth, printLimit);
  result.isc = isc && exactExpression(isc, printLimit);
  result.rth = rth && exactExpression(rth, printLimit);
  // Equal rational functions print equally, so an agreeing Voc/Isc reuses the printed Rth.
  result.rthFromVocIsc = rthFromVocIsc && (agree && result.rth ? result.rth : exactExpression(rthFromVocIsc, printLimit));
  const unprinted = (["vth", "isc", "rth"] as const).filter((k) => result[k] !== null && result[k]!.tex === null);
  if (unprinted.length > 0) {
    statements.push({
      code: "forms-skipped",
      message: `${unprinted.join(", ")} ${unprinted.length > 1 ? "are" : "is"} larger than ${printLimit} terms: only the expanded infix form is given (no TeX, no compact form).`,
    });
  }
  result.agree = agree;
  result.thevenin = vth && rth ? { vth: vth.toInfix(), rth: rth.toInfix() } : null;
  result.norton = isc && rth && !rth.isZero() ? { isc: isc.toInfix(), rth: rth.toInfix() } : null;

  if (!(open.singular && short.singular)) {
    const checked = checkResults({ network, values, terms, vth, isc, rth, agree, seed });
    result.checks = checked.checks;
    result.numericCheck = checked.numericCheck;
  }

  if (options.limits && options.limits.length > 0) {
    const l = limitsOf(results, options.limits);
    result.limits = l.limits;
    diagnostics.push(...l.diagnostics);
  }
  if (options.values && Object.keys(options.values).length > 0) {
    const v = valuesOf(results, options.values, options.float ?? false);
    result.values = v.values;
    diagnostics.push(...v.diagnostics);
  }
  const sens = sensitivitiesOf(results, options.sensitivities ?? true, options.sensitivitySizeLimit ?? SENSITIVITY_SIZE_LIMIT);
  result.sensitivities = sens.sensitivities;
  if (sens.skipped.length > 0) {
    statements.push({
      code: "sensitivity-skipped",
      message: `Sensitivities of ${sens.skipped.join(", ")} were skipped: numerator × denominator terms exceed the size limit (SolveOptions.sensitivitySizeLimit).`,
    });
  }
  if (options.solveFor && options.solveFor.length > 0) {
    const s = solveForTargets(results, options.solveFor);
    result.solved = s.solved;
    diagnostics.push(...s.diagnostics);
  }
  if (options.dimensions ?? true) {
    const declared = { ...(network.quantities ?? {}), ...(options.quantities ?? {}) };
    const d = checkDimensions(network, values, terms, { vth, isc, rth, rthFromVocIsc }, declared, seed);
    result.dimensions = d.report;
    diagnostics.push(...d.diagnostics);
  }
  if (options.steps ?? true) {
    result.steps = buildLedger({ network, system: sys, values, terms, open, short, vth, rth, isc, rthFromVocIsc, agree });
  }
  const { [LAPLACE]: _s, ...given } = options.values ? parseAssignments(options.values).exact : {};
  const frequency = frequencyReport(results, given);
  if (frequency) result.frequency = frequency;
  // Assumptions written with the network and those asked for by the caller apply alike.
  const assume = [...(network.assumptions ?? []), ...(options.assume ?? [])];
  if (assume.length > 0) {
    const a = assumptionsOf(assume);
    diagnostics.push(...a.diagnostics);
    if (a.assumptions.length > 0) {
      const approximated = approximationsOf(results, a.assumptions);
      result.approximations = approximated.report;
      if (options.steps ?? true) result.steps = [...result.steps, ...approximated.steps];
    }
  }
  if (options.approximate) {
    const nominal = Object.fromEntries(Object.entries(options.values ? parseAssignments(options.values).exact : {}).map(([k, v]) => [k, v.toNumber()]));
    const b = boundedApproximationsOf(results, nominal, options.approximate);
    result.boundedApproximations = b.report;
    if (options.steps ?? true) result.steps = [...result.steps, ...b.steps];
    if (b.missing.length > 0) diagnostics.push(diagnostic("option-invalid", `approximation within a bound needs a value for ${b.missing.join(", ")} (the design point)`));
    if (b.needsBand) statements.push({ code: "approximation-needs-band", message: "Results in s are approximated only over a frequency band (approximate.band)." });
  }
  result.statements = statements;
  result.diagnostics = placeDiagnostics(diagnostics, positions);
  result.ok = !hasErrors(result.diagnostics);
  return result;
}

export interface ExactPort {
  system: NodalSystem;
  open: OpenPortSolution;
  short: ShortPortSolution;
  vth: RationalFunction | null;
  rth: RationalFunction | null;
  isc: RationalFunction | null;
  rthFromVocIsc: RationalFunction | null;
  agree: boolean | null;
  statements: PortStatement[];
}

/** The exact port results of a checked network (no printing): open port, test source, short, Voc/Isc. */
export function solvePortExact(network: Network, values: ReadonlyMap<string, RationalFunction>, terms: SourceTerms = new Map()): ExactPort {
  const sys = assembleNodalSystem(network, values, terms);
  const open = solveOpenPort(sys, network.port);
  const short = solveShortedPort(sys, network.port);

  const statements: PortStatement[] = [];

  const vth = open.vth;
  const rth = open.rth;
  const isc = short.isc;
  const { rthFromVocIsc, agree } = vocIscAgreement(vth, isc, rth);
  if (!open.singular && short.singular) {
    statements.push({ code: "rth-zero", message: "Rth = 0: the port is an ideal voltage source Vth; it has no Norton form (Isc is unbounded)." });
  }
  if (open.singular && !short.singular) {
    statements.push({ code: "rth-infinite", message: "Rth is infinite: the port is an ideal current source Isc; it has no Thevenin form (Voc is unbounded)." });
  }
  if (vth && vth.isZero()) statements.push({ code: "vth-zero", message: "Vth = 0: the network holds no source the port can see; it is Rth alone." });
  if (isc && isc.isZero()) statements.push({ code: "isc-zero", message: "Isc = 0: no current flows through a short across the port." });
  if (vth && isc && isc.isZero() && vth.isZero()) {
    statements.push({ code: "voc-isc-undefined", message: "Vth and Isc are both 0, so Voc/Isc is undefined; Rth comes from the test source alone." });
  }
  if (agree === true) statements.push({ code: "rth-agree", message: "Rth from the test source equals Voc/Isc exactly." });
  if (agree === false) statements.push({ code: "rth-disagree", message: "Rth from the test source differs from Voc/Isc; the derivation is inconsistent." });

  return { system: sys, open, short, vth, rth, isc, rthFromVocIsc, agree, statements };
}

/** Why det A = 0: the structures topology knows, and the elements and nodes left free (often a controlled-source loop of unity gain). */
function singularSystem(network: Network, values: ReadonlyMap<string, RationalFunction>, terms: SourceTerms, seed: number): Diagnostic {
  const suspects = suspectStructures(network);
  const free = undeterminedParts(network, values, terms, seed);
  const notes = suspects.map((s) => s.note);
  if (free && free.elements.length + free.nodes.length > 0) {
    const parts = [
      free.elements.length > 0 ? `the currents of ${quoteList(free.elements)}` : "",
      free.nodes.length > 0 ? `the voltage${free.nodes.length > 1 ? "s" : ""} of node${free.nodes.length > 1 ? "s" : ""} ${quoteList(free.nodes)}` : "",
    ].filter((p) => p !== "");
    const controlled = network.elements.filter((e) => free.elements.includes(e.name) && isControlled(e)).map((e) => `"${e.name}" = ${"value" in e ? e.value : ""}`);
    const loop =
      controlled.length > 0
        ? ` Controlled source${controlled.length > 1 ? "s" : ""} ${controlled.join(", ")} ${controlled.length > 1 ? "are" : "is"} among them: a loop whose gain exactly cancels what it controls leaves it undetermined; check the gain and the direction of the loop.`
        : "";
    const sentence = parts.join(" and ");
    notes.unshift(`${sentence.charAt(0).toUpperCase()}${sentence.slice(1)} can take any value together, driven by nothing.${loop}`);
  }
  const why = notes.length > 0 ? ` ${notes.join(" Also: ")}` : "";
  return diagnostic("singular-system", `the nodal equations have no unique solution, with the port open or shorted (det A = 0 for any values of the symbols).${why}`, {
    elements: network.elements.map((e) => e.name).filter((n) => free?.elements.includes(n) || suspects.some((s) => s.elements.includes(n))),
    nodes: free?.nodes ?? [],
  });
}

function quoteList(names: string[]): string {
  return names.map((n) => `"${n}"`).join(", ");
}

function assumptionsOf(texts: readonly string[]): { assumptions: Assumption[]; diagnostics: Diagnostic[] } {
  const assumptions: Assumption[] = [];
  const diagnostics: Diagnostic[] = [];
  for (const t of texts) {
    try {
      assumptions.push(parseAssumption(t));
    } catch (e) {
      if (!(e instanceof AssumptionSyntaxError)) throw e;
      diagnostics.push(diagnostic("option-invalid", `assumption ${e.message}`));
    }
  }
  return { assumptions, diagnostics };
}
