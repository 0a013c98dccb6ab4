// Calculus on polynomials: derivative, exact substitution, floating-point evaluation.

import { Rational } from "./rational";
import { RationalTermSum, canonicalFields, ZERO_FIELDS, type PolyFields } from "./polynomial-build";
import type { Poly } from "./polynomial";

/** d/dv of p. */
export function derivativeFields(p: Poly, v: string): PolyFields {
  const j = p.vars.indexOf(v);
  if (j < 0) return ZERO_FIELDS;
  const nv = p.vars.length;
  const exps: number[] = [];
  const coefs: bigint[] = [];
  for (let t = 0; t < p.coefs.length; t++) {
    const k = p.exps[t * nv + j];
    if (k === 0) continue;
    for (let u = 0; u < nv; u++) exps.push(u === j ? k - 1 : p.exps[t * nv + u]);
    coefs.push(p.coefs[t] * BigInt(k));
  }
  return canonicalFields(p.vars, exps, coefs, p.den);
}

/** p with the given variables replaced by exact values; the others stay symbolic. */
export function substitutedFields(p: Poly, values: Record<string, Rational>): PolyFields {
  const nv = p.vars.length;
  const sub = p.vars.map((v) => (Object.prototype.hasOwnProperty.call(values, v) ? values[v] : undefined));
  const degs = p.degrees();
  // Powers of each substituted value, as numerator/denominator BigInts.
  const powers = sub.map((s, v) => {
    if (s === undefined) return null;
    const pw: Rational[] = [Rational.ONE];
    for (let k = 1; k <= degs[v]; k++) pw.push(pw[k - 1].mul(s));
    return pw;
  });
  const sum = new RationalTermSum();
  const e = new Array<number>(nv);
  for (let t = 0; t < p.coefs.length; t++) {
    let c = Rational.of(p.coefs[t], p.den);
    for (let v = 0; v < nv; v++) {
      const k = p.exps[t * nv + v];
      const pw = powers[v];
      if (pw) {
        e[v] = 0;
        if (k > 0) c = c.mul(pw[k]);
      } else e[v] = k;
    }
    if (!c.isZero()) sum.add(e, c);
  }
  return sum.fields(p.vars);
}

/** Floating-point value of p; every variable must be given. */
export function evaluatePoly(p: Poly, values: Record<string, number>): number {
  const nv = p.vars.length;
  const x = p.vars.map((v) => {
    const val = values[v];
    if (typeof val !== "number") throw new Error(`no value for ${v}`);
    return val;
  });
  const den = Number(p.den);
  let sum = 0;
  for (let t = 0; t < p.coefs.length; t++) {
    let m = Number(p.coefs[t]);
    for (let v = 0; v < nv; v++) {
      const k = p.exps[t * nv + v];
      if (k === 1) m *= x[v];
      else if (k > 1) m *= x[v] ** k;
    }
    sum += m;
  }
  return Number.isFinite(den) ? sum / den : Rational.of(1n, p.den).toNumber() * sum;
}
