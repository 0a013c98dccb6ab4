// Arithmetic modulo one word-size prime, for the modular images that bound gcd degrees and
// matrix ranks and for the results check: residues of BigInt coefficients, inverses, a
// polynomial's value at a point and a reproducible random point.

import type { Poly } from "./polynomial";
import { onceEach } from "./memo";
import { CHAIN_MIN_TERMS, productChain } from "./polynomial-calculus";

/** A prime below 2^26: the product of two residues stays below 2^53, exact in doubles. */
export const PRIME = 67108859;
const PRIME_BIG = BigInt(PRIME);

/** c mod PRIME in [0, PRIME). */
export function residue(c: bigint): number {
  // Number(c) is exact exactly when it is a safe integer (a larger c rounds to at least 2^53).
  const x = Number(c);
  const r = Number.isSafeInteger(x) ? x % PRIME : Number(c % PRIME_BIG);
  return r < 0 ? r + PRIME : r;
}

/** Inverse of a nonzero residue, by the extended Euclidean algorithm. */
export function invMod(a: number): number {
  let [r0, r1] = [PRIME, a];
  let [t0, t1] = [0, 1];
  while (r1 !== 0) {
    const q = Math.floor(r0 / r1);
    [r0, r1] = [r1, r0 - q * r1];
    [t0, t1] = [t1, t0 - q * t1];
  }
  return t0 < 0 ? t0 + PRIME : t0;
}

/** Small deterministic generator (xorshift32) of nonzero residues, so a run is reproducible. */
export function makeRandom(seed: number): () => number {
  let s = seed | 0 || 0x9e3779b9;
  return () => {
    s ^= s << 13;
    s ^= s >>> 17;
    s ^= s << 5;
    return 1 + ((s >>> 0) % (PRIME - 1));
  };
}

/** p's coefficients modulo PRIME, computed once per polynomial (images of one p are taken at many points). */
export const coefficientResidues = onceEach((p: Poly): Float64Array => {
  const out = new Float64Array(p.coefs.length);
  for (let t = 0; t < out.length; t++) out[t] = residue(p.coefs[t]);
  return out;
});

/** a·b mod PRIME for residues a, b: the product is below 2^52, exact in a double; no fmod. */
export function mulMod(a: number, b: number): number {
  const ab = a * b;
  const r = ab - Math.floor(ab / PRIME) * PRIME;
  return r < 0 ? r + PRIME : r >= PRIME ? r - PRIME : r;
}

/** p at a point (one residue per variable), modulo PRIME; null when p's common denominator vanishes there. */
export function evalMod(p: Poly, point: ReadonlyMap<string, number>): number | null {
  const d = residue(p.den);
  if (d === 0) return null;
  const nv = p.vars.length;
  const x = p.vars.map((v) => point.get(v)!);
  // Powers by exponent, each computed once per variable.
  const powers = p.vars.map(() => [1]);
  const power = (v: number, e: number): number => {
    const table = powers[v];
    for (let k = table.length; k <= e; k++) table.push(mulMod(table[k - 1], x[v]));
    return table[e];
  };
  const cs = coefficientResidues(p);
  let s = 0;
  if (cs.length >= CHAIN_MIN_TERMS) {
    const { shared, start, factorVar, factorExp, depth } = productChain(p);
    const running = new Float64Array(depth + 1);
    running[0] = 1;
    for (let t = 0; t < cs.length; t++) {
      let j = shared[t];
      for (let f = start[t], end = start[t + 1]; f < end; f++, j++) {
        const k = factorExp[f];
        running[j + 1] = mulMod(running[j], k === 1 ? x[factorVar[f]] : power(factorVar[f], k));
      }
      s += mulMod(cs[t], running[j]);
      if (s >= PRIME) s -= PRIME;
    }
  } else {
    for (let t = 0; t < cs.length; t++) {
      let m = cs[t];
      for (let v = 0; v < nv && m !== 0; v++) {
        const e = p.exps[t * nv + v];
        if (e !== 0) m = mulMod(m, power(v, e));
      }
      s += m;
      if (s >= PRIME) s -= PRIME;
    }
  }
  return mulMod(s, invMod(d));
}
