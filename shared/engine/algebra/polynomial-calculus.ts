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
 * p's terms as a chain of products, for evaluating a long polynomial at many points: term t is
 * its coefficient times the first `shared[t]` factors of term t − 1 (a factor is one variable to a
 * power, in variable order) times its own factors `factorVar/factorExp[start[t] .. start[t+1])`.
 * Neighbours in graded lexicographic order share long prefixes, so a value needs a few products
 * per term instead of one per variable.
 */
export interface ProductChain {
  shared: Uint16Array;
  start: Uint32Array;
  factorVar: Uint16Array;
  factorExp: Uint16Array;
  /** The most factors of any term (the depth of the running products). */
  depth: number;
  /** The largest total degree of any term. */
  degree: number;
}

/** Below this many terms a chain costs more to build than it saves. */
export const CHAIN_MIN_TERMS = 64;

export const productChain = onceEach((p: Poly): ProductChain => {
  const nv = p.vars.length;
  const n = p.coefs.length;
  const e = p.exps;
  const shared = new Uint16Array(n);
  const start = new Uint32Array(n + 1);
  let vars = new Uint16Array(n * 4 + nv);
  let exps = new Uint16Array(vars.length);
  let w = 0;
  let depth = 0;
  let degree = 0;
  for (let t = 0; t < n; t++) {
    const row = t * nv;
    // The factors of term t before the first variable where it differs from term t − 1.
    let v = 0;
    let same = 0;
    let d = 0;
    if (t > 0) {
      for (; v < nv; v++) {
        const k = e[row + v];
        if (k !== e[row - nv + v]) break;
        if (k !== 0) {
          same++;
          d += k;
        }
      }
    }
    shared[t] = same;
    start[t] = w;
    if (w + nv > vars.length) {
      const grown = new Uint16Array(vars.length * 2 + nv);
      grown.set(vars);
      vars = grown;
      const grownExps = new Uint16Array(grown.length);
      grownExps.set(exps);
      exps = grownExps;
    }
    for (; v < nv; v++) {
      const k = e[row + v];
      if (k === 0) continue;
      vars[w] = v;
      exps[w] = k;
      w++;
      d += k;
    }
    const count = same + w - start[t];
    if (count > depth) depth = count;
    if (d > degree) degree = d;
  }
  start[n] = w;
  return { shared, start, factorVar: vars.subarray(0, w), factorExp: exps.subarray(0, w), depth, degree };
});

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
  if (cs.length >= CHAIN_MIN_TERMS) {
    const chain = productChain(p);
    degree = chain.degree;
    const { shared, start, factorVar, factorExp } = chain;
    const running = new Float64Array(chain.depth + 1);
    running[0] = 1;
    for (let t = 0; t < cs.length; t++) {
      let j = shared[t];
      for (let f = start[t], end = start[t + 1]; f < end; f++, j++) {
        const k = factorExp[f];
        const xv = x[factorVar[f]];
        running[j + 1] = running[j] * (k === 1 ? xv : xv ** k);
      }
      const m = cs[t] * running[j];
      sum += m;
      magnitude += Math.abs(m);
    }
  } else {
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
  }
  const bound = (p.coefs.length + degree + 2) * 2 ** -53 * magnitude;
  const den = Number(p.den);
  if (Number.isFinite(den)) return { value: sum / den, error: bound / den };
  const scale = Rational.of(1n, p.den).toNumber();
  return { value: scale * sum, error: scale * bound };
}
