// Design-oriented approximations: under assumptions such as "gm*ro >> 1" or "mu >> 1", drop every
// term of a numerator or denominator that another term of the same sum exceeds by a factor the
// assumptions call large, and show the simplified form beside the exact one.

import { Poly, RationalFunction } from "../algebra";
import type { ResultName, Step } from "../types";

/** "gm*ro >> 1": the product of these symbol stems is much larger than 1. */
export interface Assumption {
  text: string;
  /** Each stem stands for itself and its numbered kin: gm covers gm, gm1, gm_2 (not gmb). */
  stems: string[];
}

export class AssumptionSyntaxError extends Error {}

/** Read an assumption: a product of symbols, ">>" (or "≫"), then 1. */
export function parseAssumption(text: string): Assumption {
  const m = /^\s*(.+?)\s*(?:>>|≫)\s*1\s*$/u.exec(text);
  if (!m) throw new AssumptionSyntaxError(`"${text}": write a product of symbols much larger than 1, e.g. "gm*ro >> 1"`);
  const stems = m[1].split(/\s*[*·]\s*/u);
  for (const s of stems) {
    if (!/^[A-Za-z_][A-Za-z0-9_]*$/.test(s)) throw new AssumptionSyntaxError(`"${text}": "${s}" is not a symbol name`);
  }
  return { text: `${stems.join("*")} >> 1`, stems };
}

/** Whether a symbol belongs to a stem: the stem itself, or the stem with a number or an underscore suffix. */
function belongsToStem(symbol: string, stem: string): boolean {
  if (symbol === stem) return true;
  if (!symbol.startsWith(stem)) return false;
  return /^(_?\d+|_[A-Za-z0-9]+)$/.test(symbol.slice(stem.length));
}

type Monomial = Record<string, number>;

// A ratio of monomials is "large" when it is a product of units, one unit being one symbol per stem of one assumption.
function isLargeRatio(ratio: Monomial, assumptions: readonly Assumption[], memo: Map<string, boolean>): boolean {
  const key = Object.keys(ratio).filter((v) => ratio[v] > 0).sort().map((v) => `${v}^${ratio[v]}`).join("*");
  if (key === "") return true;
  const known = memo.get(key);
  if (known !== undefined) return known;
  let found = false;
  const removeUnit = (a: Assumption, i: number, r: Monomial): void => {
    if (found) return;
    if (i === a.stems.length) {
      found = isLargeRatio(r, assumptions, memo);
      return;
    }
    for (const v of Object.keys(r)) {
      if (r[v] > 0 && belongsToStem(v, a.stems[i])) removeUnit(a, i + 1, { ...r, [v]: r[v] - 1 });
    }
  };
  for (const a of assumptions) removeUnit(a, 0, ratio);
  memo.set(key, found);
  return found;
}

function ratioOf(big: Monomial, small: Monomial): Monomial | null {
  const out: Monomial = {};
  let any = false;
  for (const v of new Set([...Object.keys(big), ...Object.keys(small)])) {
    const e = (big[v] ?? 0) - (small[v] ?? 0);
    if (e < 0) return null;
    if (e > 0) any = true;
    out[v] = e;
  }
  return any ? out : null;
}

/** The terms of p that no other term of p exceeds by a large factor; and how many were dropped. */
function dominantTerms(p: Poly, assumptions: readonly Assumption[]): { poly: Poly; dropped: number } {
  const terms = p.terms();
  const memo = new Map<string, boolean>();
  const keep = terms.filter((t, i) => !terms.some((u, j) => j !== i && isDominatedBy(t.monomial, u.monomial, assumptions, memo)));
  return { poly: keep.length === terms.length ? p : Poly.fromTerms(keep), dropped: terms.length - keep.length };
}

function isDominatedBy(small: Monomial, big: Monomial, assumptions: readonly Assumption[], memo: Map<string, boolean>): boolean {
  const r = ratioOf(big, small);
  return r !== null && isLargeRatio(r, assumptions, memo);
}

export interface Approximation {
  exact: RationalFunction;
  approximate: RationalFunction;
  dropped: { numerator: number; denominator: number };
}

/** Keep the dominant terms of N and D under the assumptions, then reduce to lowest terms. */
export function approximate(f: RationalFunction, assumptions: readonly Assumption[]): Approximation {
  const n = dominantTerms(f.num, assumptions);
  const d = dominantTerms(f.den, assumptions);
  const approximate = n.dropped + d.dropped === 0 ? f : RationalFunction.from(n.poly, d.poly);
  return { exact: f, approximate, dropped: { numerator: n.dropped, denominator: d.dropped } };
}

/** One approximated result as printed for the output. */
export interface ApproximationEntry {
  exact: string;
  approximate: string;
  approximateTex: string;
  compact: string;
  dropped: { numerator: number; denominator: number };
}

export interface ApproximationReport {
  assumptions: string[];
  results: Partial<Record<ResultName, ApproximationEntry>>;
}

const TEX_NAME: Record<ResultName, string> = { vth: "V_{th}", isc: "I_{sc}", rth: "R_{th}", rthFromVocIsc: "V_{oc}/I_{sc}" };
const LABEL: Record<ResultName, string> = { vth: "Vth", isc: "Isc", rth: "Rth", rthFromVocIsc: "Voc/Isc" };

/** Approximate Vth, Rth and Isc, with one ledger step of kind "approximation" per result. */
export function approximationsOf(
  results: Partial<Record<ResultName, RationalFunction | null>>,
  assumptions: readonly Assumption[],
): { report: ApproximationReport; steps: Step[] } {
  const report: ApproximationReport = { assumptions: assumptions.map((a) => a.text), results: {} };
  const steps: Step[] = [];
  const stated = assumptions.map((a) => a.stems.map(texStem).join("\\,") + " \\gg 1").join(",\\; ");
  for (const r of ["vth", "rth", "isc"] as const) {
    const f = results[r];
    // A zero result has nothing to drop; a step saying 0 ≈ 0 would only add noise to the ledger.
    if (!f || f.isZero()) continue;
    const a = approximate(f, assumptions);
    const dropped = a.dropped.numerator + a.dropped.denominator;
    report.results[r] = {
      exact: f.toInfix(),
      approximate: a.approximate.toInfix(),
      approximateTex: a.approximate.toTex(),
      compact: a.approximate.compactInfix(),
      dropped: a.dropped,
    };
    steps.push({
      id: `approx.${r}`,
      kind: "approximation",
      title: `${LABEL[r]} when ${report.assumptions.join(" and ")}`,
      explanation:
        dropped === 0
          ? `Assuming ${report.assumptions.join(" and ")}, no term of ${LABEL[r]} is small beside another: the exact form stands.`
          : `Assuming ${report.assumptions.join(" and ")}, each term that another term of the same sum exceeds by such a factor is dropped (${a.dropped.numerator} in the numerator, ${a.dropped.denominator} in the denominator).`,
      tex: `${TEX_NAME[r]} = ${f.toTex()} \\;\\approx\\; ${a.approximate.toTex()} \\quad (${stated})`,
      data: { result: r, assumptions: report.assumptions, exact: f.toInfix(), approximate: a.approximate.toInfix(), dropped: a.dropped },
    });
  }
  return { report, steps };
}

function texStem(stem: string): string {
  return RationalFunction.variable(stem).toTex();
}
