// Cheap factorizations for display: rational content, monomial factor, and splitting by
// contents with respect to single variables (P = content_x(P) * primitive_x(P)).
// Not a full factorization; it finds what grouping by one variable reveals.

import { Rational } from "./rational";
import { Poly } from "./polynomial";
import { polyGcdList } from "./gcd";
import { polyDivide } from "./division";

export interface CheapFactorization {
  /** Rational constant (carries the sign). */
  readonly constant: Rational;
  /** Monomial factor as variable -> exponent. */
  readonly monomial: Record<string, number>;
  /** Non-monomial primitive factors with multiplicities, in canonical print order. */
  readonly factors: ReadonlyArray<{ readonly base: Poly; readonly exponent: number }>;
}

/** Above these sizes the grouping search is skipped: it costs a gcd per variable. */
const SPLIT_MAX_TERMS = 400;
const SPLIT_MAX_VARS = 16;

/** One factorization per polynomial object: results share their N and D among many printed forms. */
const cache = new WeakMap<Poly, CheapFactorization>();
const cacheUngrouped = new WeakMap<Poly, CheapFactorization>();

/** grouping: false keeps to content and monomial (no gcd search), for forms printed by the dozen. */
export function factorCheap(p: Poly, grouping = true): CheapFactorization {
  const store = grouping ? cache : cacheUngrouped;
  let f = store.get(p);
  if (f === undefined) {
    f = computeFactorCheap(p, grouping);
    store.set(p, f);
  }
  return f;
}

function computeFactorCheap(p: Poly, grouping: boolean): CheapFactorization {
  if (p.isZero()) return { constant: Rational.ZERO, monomial: {}, factors: [] };
  const c = p.content();
  const prim = p.scale(c.inverse());
  const low = prim.lowDegrees();
  const monomial: Record<string, number> = {};
  prim.vars.forEach((v, i) => {
    if (low[i] > 0) monomial[v] = low[i];
  });
  let rest = prim.divideByMonomial(monomial);
  let constant = c;
  if (rest.isConstant()) {
    constant = constant.mul(rest.constantValue()!);
    return { constant, monomial, factors: [] };
  }
  if (rest.coefs[0] < 0n) {
    constant = constant.neg();
    rest = rest.neg();
  }
  const parts = grouping && rest.termCount() <= SPLIT_MAX_TERMS && rest.vars.length <= SPLIT_MAX_VARS ? splitByGrouping(rest) : [rest];
  // Merge equal factors into powers; print order: fewer terms first, then canonical text.
  const merged: Array<{ base: Poly; exponent: number }> = [];
  for (const f of parts) {
    const m = merged.find((x) => x.base.equals(f));
    if (m) m.exponent++;
    else merged.push({ base: f, exponent: 1 });
  }
  const factors =
    merged.length < 2 ? merged : merged.sort((a, b) => a.base.termCount() - b.base.termCount() || (a.base.toInfix() < b.base.toInfix() ? -1 : 1));
  return { constant, monomial, factors };
}

/** Split a primitive, monomial-free polynomial (positive leading coefficient) into factors found by grouping. */
function splitByGrouping(p: Poly): Poly[] {
  if (p.vars.length <= 1) return [p];
  for (const x of p.vars) {
    const coeffs = p.coefficientsIn(x).filter((q) => !q.isZero());
    if (coeffs.length < 2) continue;
    const g = polyGcdList(coeffs);
    if (g.isConstant()) continue;
    const q = polyDivide(p, g);
    if (q === null) continue;
    const qn = q.coefs[0] < 0n ? q.neg() : q;
    return [...splitByGrouping(g), ...splitByGrouping(qn.primitivePart())];
  }
  return [p];
}
