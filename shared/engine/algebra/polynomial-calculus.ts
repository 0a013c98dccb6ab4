// Calculus on polynomials: derivative, exact substitution, floating-point evaluation.

import { Rational } from "./rational";
import { RationalTermSum, canonicalFields, ZERO_FIELDS, type PolyFields } from "./polynomial-build";
import type { Poly } from "./polynomial";
import { onceEach } from "./memo";

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

/** p's coefficients as doubles, converted once per polynomial (it is evaluated at several points). */
const coefficientDoubles = onceEach((p: Poly): Float64Array => Float64Array.from(p.coefs, Number));

/**
 * Floating-point value of p, and a bound on its rounding error; every variable must be given.
 * Each term is a product of at most degree + 2 roundings and summing n terms adds at most n more,
 * so the error is at most (n + degree + 2)·ε·Σ|term| with ε = 2^-53 (the standard bound for
 * recursive summation), divided by p's denominator like the value.
 */
export function evaluatePoly(p: Poly, values: Record<string, number>): { value: number; error: number } {
  const nv = p.vars.length;
  const x = p.vars.map((v) => {
    const val = values[v];
    if (typeof val !== "number") throw new Error(`no value for ${v}`);
    return val;
  });
  const cs = coefficientDoubles(p);
  let sum = 0;
  let magnitude = 0;
  let degree = 0;
  for (let t = 0; t < cs.length; t++) {
    let m = cs[t];
    let d = 0;
    for (let v = 0; v < nv; v++) {
      const k = p.exps[t * nv + v];
      if (k === 0) continue;
      m *= k === 1 ? x[v] : x[v] ** k;
      d += k;
    }
    if (d > degree) degree = d;
    sum += m;
    magnitude += Math.abs(m);
  }
  const bound = (p.coefs.length + degree + 2) * 2 ** -53 * magnitude;
  const den = Number(p.den);
  if (Number.isFinite(den)) return { value: sum / den, error: bound / den };
  const scale = Rational.of(1n, p.den).toNumber();
  return { value: scale * sum, error: scale * bound };
}
