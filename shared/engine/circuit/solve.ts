// The whole solve of one network and port: checks, nodal system, the three port set-ups,
// the cross-checks, and everything derived from the exact results.

import type { RationalFunction } from "../algebra";
import type { Diagnostic, Network, NumericCheck, ParseResult, PortStatement, SolveOptions, SolveResult } from "../types";
import { approximationsOf, AssumptionSyntaxError, parseAssumption, type Assumption } from "./approximations";
import { attributeToCells, expandCells } from "./cells";
import { checkDimensions } from "./dimensions";
import { diagnostic, hasErrors } from "./diagnostics";
import { assembleNodalSystem, type NodalSystem } from "./mna";
import { floatPortValues, hashString, seededRandom } from "./numeric";
import { solveOpenPort, solveShortedPort, type OpenPortSolution, type ShortPortSolution } from "./port-solution";
import { frequencyReport } from "./frequency";
import { exactExpression, limitsOf, parseAssignments, sensitivitiesOf, solveForTargets, valuesOf, type Results } from "./results";
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
    checks: { testSource: null, vocIsc: null, numeric: null },
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
  if (open.singular && short.singular) {
    const suspects = suspectStructures(network);
    const why = suspects.length > 0 ? ` Look at: ${suspects.map((s) => s.note).join("; ")}.` : "";
    diagnostics.push(
      diagnostic(
        "singular-system",
        `the nodal equations have no unique solution, with the port open or shorted (det A = 0 for any values of the symbols).${why}`,
        { elements: [...new Set(suspects.flatMap((s) => s.elements))] },
      ),
    );
  }

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

  const seed = hashString(JSON.stringify(network));
  if (!(open.singular && short.singular)) result.numericCheck = numericCheck(sys, network, results, seed);

  result.checks = {
    testSource: rth !== null ? true : null,
    vocIsc: agree,
    numeric: result.numericCheck?.agree ?? null,
  };

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
  const sens = sensitivitiesOf(results, options.sensitivities ?? true, options.sensitivitySizeLimit ?? 20000);
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
  result.statements = statements;
  result.diagnostics = placeDiagnostics(diagnostics, positions);
  result.ok = !hasErrors(result.diagnostics);
  return result;
}

/** Evaluate the exact results at a seeded point and compare with a floating-point solve. */
function numericCheck(sys: NodalSystem, network: Network, results: Results, seed: number): NumericCheck {
  const random = seededRandom(seed ^ 0x5eed);
  const symbols = new Set<string>();
  for (const s of sys.internals) for (const v of s.value.variables()) symbols.add(v);
  for (const row of sys.a) for (const p of row) for (const v of p.variables()) if (!v.startsWith("$")) symbols.add(v);
  for (const p of sys.b) for (const v of p.variables()) if (!v.startsWith("$")) symbols.add(v);
  symbols.add(LAPLACE);
  const point: Record<string, number> = {};
  for (const s of [...symbols].sort()) point[s] = Number((0.5 + 1.5 * random()).toFixed(6));
  const float = floatPortValues(sys, network.port, point);
  let worst = 0;
  let compared = 0;
  for (const r of ["vth", "rth", "isc"] as const) {
    const f = results[r];
    const x = float[r];
    if (!f || x === null) continue;
    const exact = f.evaluate(point);
    if (!Number.isFinite(exact)) continue;
    const err = Math.abs(exact - x) / Math.max(1e-12, Math.abs(exact), Math.abs(x));
    worst = Math.max(worst, err);
    compared++;
  }
  return { agree: compared === 0 ? null : worst < 1e-6, relativeError: compared === 0 ? null : worst, point };
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
  let rthFromVocIsc: RationalFunction | null = null;
  let agree: boolean | null = null;
  if (!open.singular && short.singular) {
    statements.push({ code: "rth-zero", message: "Rth = 0: the port is an ideal voltage source Vth; it has no Norton form (Isc is unbounded)." });
  }
  if (open.singular && !short.singular) {
    statements.push({ code: "rth-infinite", message: "Rth is infinite: the port is an ideal current source Isc; it has no Thevenin form (Voc is unbounded)." });
  }
  if (vth && vth.isZero()) statements.push({ code: "vth-zero", message: "Vth = 0: the network holds no source the port can see; it is Rth alone." });
  if (isc && isc.isZero()) statements.push({ code: "isc-zero", message: "Isc = 0: no current flows through a short across the port." });
  if (vth && isc) {
    if (isc.isZero()) {
      if (vth.isZero()) statements.push({ code: "voc-isc-undefined", message: "Vth and Isc are both 0, so Voc/Isc is undefined; Rth comes from the test source alone." });
      else agree = false;
    } else {
      rthFromVocIsc = vth.div(isc);
      // Mathematical equality (the difference cancels), not just equal printed forms.
      if (rth) agree = rthFromVocIsc.equals(rth) || rthFromVocIsc.sub(rth).isZero();
    }
  }
  if (agree === true) statements.push({ code: "rth-agree", message: "Rth from the test source equals Voc/Isc exactly." });
  if (agree === false) statements.push({ code: "rth-disagree", message: "Rth from the test source differs from Voc/Isc; the derivation is inconsistent." });

  return { system: sys, open, short, vth, rth, isc, rthFromVocIsc, agree, statements };
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
