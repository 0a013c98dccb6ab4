// Polynomial matrices: products, identity, and rank.

import { Poly } from "./polynomial";
import { matrixRankBareiss } from "./determinant";
import { PRIME, evalMod, invMod, makeRandom } from "./modular";

type Matrix = readonly (readonly Poly[])[];

export function matrixMultiply(a: Matrix, b: Matrix): Poly[][] {
  const n = a.length;
  const k = b.length;
  const m = k === 0 ? 0 : b[0].length;
  return Array.from({ length: n }, (_, i) =>
    Array.from({ length: m }, (_, j) => {
      let s = Poly.zero();
      for (let t = 0; t < k; t++) if (!a[i][t].isZero() && !b[t][j].isZero()) s = s.add(a[i][t].mul(b[t][j]));
      return s;
    }),
  );
}

export function matrixVector(a: Matrix, x: readonly Poly[]): Poly[] {
  return a.map((row) => row.reduce((s, e, j) => (e.isZero() || x[j].isZero() ? s : s.add(e.mul(x[j]))), Poly.zero()));
}

export function identityMatrix(n: number): Poly[][] {
  return Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => (i === j ? Poly.one() : Poly.zero())));
}


function rankMod(a: number[][]): number {
  const rows = a.length;
  const cols = rows === 0 ? 0 : a[0].length;
  let r = 0;
  for (let c = 0; c < cols && r < rows; c++) {
    let p = r;
    while (p < rows && a[p][c] === 0) p++;
    if (p === rows) continue;
    [a[p], a[r]] = [a[r], a[p]];
    const inv = invMod(a[r][c]);
    for (let i = r + 1; i < rows; i++) {
      if (a[i][c] === 0) continue;
      const f = (a[i][c] * inv) % PRIME;
      for (let j = c; j < cols; j++) a[i][j] = (a[i][j] - ((f * a[r][j]) % PRIME) + PRIME) % PRIME;
    }
    r++;
  }
  return r;
}

/**
 * Exact rank over the field of rational functions in the symbols.
 * An image at a random point modulo a prime never exceeds the true rank; when it reaches
 * min(rows, cols) that settles it. Otherwise the rank is confirmed by fraction-free elimination.
 */
export function matrixRank(a: Matrix): number {
  const rows = a.length;
  const cols = rows === 0 ? 0 : a[0].length;
  if (rows === 0 || cols === 0) return 0;
  const vars = new Set<string>();
  for (const row of a) for (const e of row) for (const v of e.vars) vars.add(v);
  const random = makeRandom(0x2545f491);
  let best = 0;
  for (let attempt = 0; attempt < 2; attempt++) {
    const point = new Map([...vars].map((v) => [v, random()]));
    const img = a.map((row) => row.map((e) => evalMod(e, point)));
    if (img.some((row) => row.some((x) => x === null))) continue;
    best = Math.max(best, rankMod(img as number[][]));
    if (best === Math.min(rows, cols)) return best;
  }
  return matrixRankBareiss(a);
}
