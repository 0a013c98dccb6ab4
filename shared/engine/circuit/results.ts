// What is done with an exact result once it exists: printing, limits, values, sensitivities,
// and solving result = target for one symbol.

import { Rational, RationalFunction, formatSI, parseValue } from "../algebra";
import type {
  Diagnostic,
  ExactExpression,
  LimitEntry,
  LimitPoint,
  LimitResult,
  ResultName,
  SolveForResult,
  SolveOptions,
  ValueEntry,
  ValuesResult,
} from "../types";
import { diagnostic } from "./diagnostics";
import { LAPLACE } from "./values";

export type Results = Partial<Record<ResultName, RationalFunction | null>>;

export const RESULT_NAMES: readonly ResultName[] = ["vth", "isc", "rth", "rthFromVocIsc"];

const UNIT: Record<ResultName, string> = { vth: "V", isc: "A", rth: "Ω", rthFromVocIsc: "Ω" };

export function exactExpression(f: RationalFunction, printTermLimit = Infinity): ExactExpression {
  const small = f.num.termCount() + f.den.termCount() <= printTermLimit;
  return {
    infix: f.toInfix(),
    tex: small ? f.toTex() : null,
    compact: small ? f.compactInfix() : null,
    compactTex: small ? f.compactTex() : null,
    terms: { numerator: f.num.termCount(), denominator: f.den.termCount() },
    symbols: f.variables(),
  };
}

const IDENTIFIER = /^[A-Za-z_][A-Za-z0-9_]*$/;

export function limitsOf(results: Results, limits: NonNullable<SolveOptions["limits"]>): { limits: LimitResult[]; diagnostics: Diagnostic[] } {
  const out: LimitResult[] = [];
  const diagnostics: Diagnostic[] = [];
  for (const { symbol, to } of limits) {
    if (!IDENTIFIER.test(symbol) || (to !== "inf" && to !== "zero")) {
      diagnostics.push(diagnostic("option-invalid", `limit "${symbol} -> ${String(to)}": give a symbol name and inf or 0`));
      continue;
    }
    const entry: LimitResult = { symbol, to, key: `${symbol}=${to === "inf" ? "inf" : "0"}`, results: {} };
    for (const r of RESULT_NAMES) {
      const f = results[r];
      if (f === undefined) continue;
      entry.results[r] = f === null ? { kind: "none", value: null, valueTex: null, leading: null, leadingTex: null } : limitEntry(f, symbol, to);
    }
    out.push(entry);
  }
  return { limits: out, diagnostics };
}

function limitEntry(f: RationalFunction, symbol: string, to: LimitPoint): LimitEntry {
  const lim = f.limit(symbol, to);
  const leading = f.leadingOrder(symbol, to);
  const base = { leading: leading.toInfix(), leadingTex: leading.toTex() };
  if (lim.kind === "finite") return { kind: "finite", value: lim.value.toInfix(), valueTex: lim.value.toTex(), ...base };
  return { kind: "infinite", value: null, valueTex: null, sign: lim.sign, ...base };
}

/** Parse --set style values: exact numbers (SI prefixes allowed) or expressions in other symbols. */
export function parseAssignments(values: NonNullable<SolveOptions["values"]>): {
  exact: Record<string, Rational>;
  expressions: Record<string, RationalFunction>;
  given: Record<string, string>;
  diagnostics: Diagnostic[];
} {
  const exact: Record<string, Rational> = {};
  const expressions: Record<string, RationalFunction> = {};
  const given: Record<string, string> = {};
  const diagnostics: Diagnostic[] = [];
  for (const [name, raw] of Object.entries(values)) {
    const text = typeof raw === "number" ? String(raw) : raw;
    if (!IDENTIFIER.test(name)) {
      diagnostics.push(diagnostic("option-invalid", `value for "${name}": not a symbol name`));
      continue;
    }
    try {
      const v = parseValue(text);
      const c = v.constantValue();
      if (c !== null) exact[name] = c;
      else expressions[name] = v;
      given[name] = v.toInfix();
    } catch (e) {
      diagnostics.push(diagnostic("option-invalid", `value for "${name}": "${text}" is not a number or expression (${e instanceof Error ? e.message : String(e)})`));
    }
  }
  return { exact, expressions, given, diagnostics };
}

export function valuesOf(results: Results, values: NonNullable<SolveOptions["values"]>, float: boolean): { values: ValuesResult; diagnostics: Diagnostic[] } {
  const { exact, expressions, given, diagnostics } = parseAssignments(values);
  const out: ValuesResult = { given, results: {} };
  for (const r of RESULT_NAMES) {
    const f = results[r];
    if (f === undefined || f === null) continue;
    let entry: ValueEntry;
    try {
      let v = Object.keys(expressions).length > 0 ? f.substituteExpressions(expressions) : f;
      v = v.substitute(exact);
      const c = v.constantValue();
      const x = c === null ? null : c.toNumber();
      entry = { exact: v.toInfix(), float: float && x !== null ? x : null, display: x === null ? null : formatSI(x, UNIT[r]) };
    } catch {
      entry = { exact: null, float: null, display: null };
    }
    out.results[r] = entry;
  }
  return { values: out, diagnostics };
}

/**
 * Default SolveOptions.sensitivitySizeLimit (numerator × denominator terms). A network of 14
 * elements and 14 symbols stays under it: the benchmark's densest, the 3×3 grid (Rth 312/480
 * terms, 149,760), gets every sensitivity in about 0.4 s.
 */
export const SENSITIVITY_SIZE_LIMIT = 200_000;

export function sensitivitiesOf(
  results: Results,
  which: boolean | string[],
  sizeLimit: number,
): { sensitivities: Partial<Record<ResultName, Record<string, string>>>; skipped: ResultName[] } {
  const sensitivities: Partial<Record<ResultName, Record<string, string>>> = {};
  const skipped: ResultName[] = [];
  if (which === false) return { sensitivities, skipped };
  for (const r of RESULT_NAMES) {
    const f = results[r];
    if (!f || f.isZero()) continue;
    // Voc/Isc that agrees is Rth itself, so its sensitivities are Rth's (equal functions print equally).
    if (r === "rthFromVocIsc" && sensitivities.rth && results.rth && f.equals(results.rth)) {
      sensitivities[r] = sensitivities.rth;
      continue;
    }
    // (x/F) dF/dx has the denominator N·D before reduction: its size bounds the work.
    if (f.num.termCount() * f.den.termCount() > sizeLimit) {
      skipped.push(r);
      continue;
    }
    const symbols = f.variables().filter((s) => s !== LAPLACE && (which === true || which.includes(s)));
    const entry: Record<string, string> = {};
    for (const s of symbols) entry[s] = f.sensitivity(s).compactInfix();
    sensitivities[r] = entry;
  }
  return { sensitivities, skipped };
}

export function solveForTargets(results: Results, targets: NonNullable<SolveOptions["solveFor"]>): { solved: SolveForResult[]; diagnostics: Diagnostic[] } {
  const solved: SolveForResult[] = [];
  const diagnostics: Diagnostic[] = [];
  for (const t of targets) {
    if (!RESULT_NAMES.includes(t.result) || !IDENTIFIER.test(t.symbol)) {
      diagnostics.push(diagnostic("option-invalid", `solve ${t.symbol} for ${t.result} = ${t.target}: give one of ${RESULT_NAMES.join(", ")} and a symbol`));
      continue;
    }
    let target: RationalFunction;
    try {
      target = parseValue(t.target);
    } catch (e) {
      diagnostics.push(diagnostic("option-invalid", `target "${t.target}" is not a number or expression (${e instanceof Error ? e.message : String(e)})`));
      continue;
    }
    const f = results[t.result];
    const base = { result: t.result, symbol: t.symbol, target: target.toInfix() };
    if (!f) {
      solved.push({ ...base, value: null, reason: `${t.result} does not exist for this port` });
      continue;
    }
    const x = f.solveFor(t.symbol, target);
    if (x === null) {
      const degN = f.num.degreeIn(t.symbol);
      const degD = f.den.degreeIn(t.symbol);
      const reason =
        degN <= 0 && degD <= 0
          ? `${t.result} does not depend on ${t.symbol}`
          : degN > 1 || degD > 1
            ? `${t.result} is not linear-fractional in ${t.symbol} (degree ${Math.max(degN, degD)})`
            : `no unique value of ${t.symbol} gives ${t.result} = ${target.toInfix()}`;
      solved.push({ ...base, value: null, reason });
    } else solved.push({ ...base, value: x.toInfix() });
  }
  return { solved, diagnostics };
}
