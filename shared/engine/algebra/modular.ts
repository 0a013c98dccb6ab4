// Arithmetic modulo one word-size prime, for the modular images that bound gcd degrees and
// matrix ranks: residues of BigInt coefficients, powers, inverses and a reproducible random point.

/** A prime below 2^26: the product of two residues stays below 2^53, exact in doubles. */
export const PRIME = 67108859;
const PRIME_BIG = BigInt(PRIME);

/** c mod PRIME in [0, PRIME). */
export function residue(c: bigint): number {
  const r = c >= -9007199254740991n && c <= 9007199254740991n ? Number(c) % PRIME : Number(c % PRIME_BIG);
  return r < 0 ? r + PRIME : r;
}

/** b^e mod PRIME for a residue b and e >= 0. */
export function powMod(b: number, e: number): number {
  let r = 1;
  b %= PRIME;
  while (e > 0) {
    if (e & 1) r = (r * b) % PRIME;
    b = (b * b) % PRIME;
    e >>= 1;
  }
  return r;
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
