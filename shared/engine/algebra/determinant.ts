// Exact determinants, cofactors and Cramer's rule over polynomial matrices.
//
// Division-free cofactor (Laplace) expansion along rows, with every minor memoized by the
// set of columns still free: the idea behind determinant decision diagrams (Shi and Tan,
// IEEE Trans. CAD, 2000). For the sparse, banded matrices of nodal analysis only a few
// column sets are reachable, so the cost is close to linear in the size of the result.
// Rows and columns are first renumbered by reverse Cuthill-McKee to keep the band narrow
// (a symmetric permutation leaves the determinant unchanged).
// Bareiss's fraction-free elimination is kept alongside for comparison and for rank.

import { Rational, bigLcm } from "./rational";
import { Poly } from "./polynomial";
import { fieldsFromKeys } from "./polynomial-build";
import { addKeys, keysIn, makeLayout, unionVars, varMap, type Key, type Layout } from "./monomial-layout";
import { polyDivideExact } from "./division";
import { TermTable, smallCoefficients } from "./term-table";

type Matrix = readonly (readonly Poly[])[];

function checkSquare(m: Matrix): number {
  const n = m.length;
  for (const row of m) if (row.length !== n) throw new RangeError("determinant of a non-square matrix");
  return n;
}

/**
 * Reverse Cuthill-McKee order of the symmetrized sparsity pattern. With a lead row, the
 * Cuthill-McKee order from that row instead (not reversed), so the lead comes first.
 */
function bandOrder(m: Matrix, lead = -1): number[] {
  const n = m.length;
  const adj: Set<number>[] = Array.from({ length: n }, () => new Set<number>());
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      if (i !== j && !m[i][j].isZero()) {
        adj[i].add(j);
        adj[j].add(i);
      }
    }
  }
  const degree = adj.map((s) => s.size);
  const seen = new Array<boolean>(n).fill(false);
  const order: number[] = [];
  while (order.length < n) {
    let start = lead >= 0 && !seen[lead] ? lead : -1;
    if (start < 0) for (let i = 0; i < n; i++) if (!seen[i] && (start < 0 || degree[i] < degree[start])) start = i;
    seen[start] = true;
    const queue = [start];
    for (let q = 0; q < queue.length; q++) {
      const u = queue[q];
      order.push(u);
      const next = [...adj[u]].filter((v) => !seen[v]).sort((a, b) => degree[a] - degree[b] || a - b);
      for (const v of next) {
        seen[v] = true;
        queue.push(v);
      }
    }
  }
  return lead >= 0 ? order : order.reverse();
}

// ---- arithmetic used by the expansion: packed keys in one layout for the whole matrix ----

/** Terms in the matrix's layout: doubles while every coefficient is a safe integer, BigInt after. */
type PackedPoly =
  | { readonly small: true; readonly keys: Float64Array; readonly coefs: Float64Array }
  | { readonly small: false; readonly keys: Key[]; readonly coefs: bigint[] };

interface Arith<T> {
  readonly one: T;
  isZero(t: T): boolean;
  /** sum over i of sign_i * entry_i * minor_i */
  combine(entries: readonly number[], signs: readonly number[], minors: readonly T[]): T;
  toPoly(t: T): Poly;
}

/** The matrix with integer rows (row r scaled by scale[r]) in one packed layout. */
interface PreparedMatrix {
  readonly n: number;
  readonly layout: Layout;
  /** entry (i, j) as packed terms, null when zero */
  readonly entries: (PackedPoly | null)[][];
  /** det(original) = det(prepared) / prod(scale) */
  readonly scale: bigint;
}

function packTerms(keys: Key[], coefs: bigint[], packed: boolean): PackedPoly {
  const small = packed ? smallCoefficients(coefs) : null;
  return small ? { small: true, keys: Float64Array.from(keys as number[]), coefs: small } : { small: false, keys, coefs };
}

function toBig(p: PackedPoly): { keys: Key[]; coefs: bigint[] } {
  return p.small ? { keys: Array.from(p.keys), coefs: Array.from(p.coefs, (c) => BigInt(c)) } : p;
}

function prepare(m: Matrix): PreparedMatrix {
  const n = m.length;
  let vars: string[] = [];
  for (const row of m) for (const e of row) vars = e.vars.length ? unionVars(vars, e.vars) : vars;
  // Any minor's degree in v is at most the sum over rows of the row's largest degree in v.
  const maxDeg = new Int32Array(vars.length);
  for (const row of m) {
    const rowMax = new Int32Array(vars.length);
    for (const e of row) {
      const d = e.degrees();
      const map = varMap(e.vars, vars);
      for (let v = 0; v < d.length; v++) if (d[v] > rowMax[map[v]]) rowMax[map[v]] = d[v];
    }
    for (let v = 0; v < vars.length; v++) maxDeg[v] += rowMax[v];
  }
  // Graded keys: every minor's keys sort into canonical order as they are.
  const layout = makeLayout(vars, maxDeg, true);
  let scale = 1n;
  const entries = m.map((row) => {
    let l = 1n;
    for (const e of row) if (!e.isZero() && e.den !== 1n) l = bigLcm(l, e.den);
    scale *= l;
    return row.map((e) => {
      if (e.isZero()) return null;
      const f = l / e.den;
      return packTerms(keysIn(e, layout), f === 1n ? e.coefs.slice() : e.coefs.map((c) => c * f), layout.packed);
    });
  });
  return { n, layout, entries, scale };
}

function packedArith(pm: PreparedMatrix, entriesFlat: (PackedPoly | null)[]): Arith<PackedPoly> {
  const one: PackedPoly = pm.layout.packed
    ? { small: true, keys: Float64Array.of(0), coefs: Float64Array.of(1) }
    : { small: false, keys: [0n], coefs: [1n] };
  return {
    one,
    isZero: (t) => t.coefs.length === 0,
    combine(entries, signs, minors) {
      if (minors.every((mi) => mi.small) && entries.every((e) => entriesFlat[e]!.small)) {
        const r = combineSmall(entries.map((e) => entriesFlat[e]!) as SmallPacked[], signs, minors as SmallPacked[]);
        if (r !== null) return r;
      }
      return combineBig(entries.map((e) => toBig(entriesFlat[e]!)), signs, minors.map(toBig), pm.layout.packed);
    },
    toPoly: (t) => Poly.fromFields(fieldsFromKeys(pm.layout, t.keys, t.coefs, pm.scale)),
  };
}

type SmallPacked = Extract<PackedPoly, { small: true }>;

/** The expansion step in doubles; null when a coefficient would leave the safe-integer range. */
function combineSmall(entries: readonly SmallPacked[], signs: readonly number[], minors: readonly SmallPacked[]): PackedPoly | null {
  let expected = 0;
  for (let i = 0; i < minors.length; i++) expected += minors[i].keys.length * entries[i].keys.length;
  // An entry has a few terms, so the estimate is close: size the table for it (up to 2^20 terms)
  // rather than rehash; a general product (mulSmall) can overestimate by far and starts smaller.
  const table = new TermTable(Math.min(expected, 1 << 20));
  for (let i = 0; i < entries.length; i++) {
    const e = entries[i];
    const mk = minors[i].keys;
    const mc = minors[i].coefs;
    for (let a = 0; a < e.keys.length; a++) {
      const ek = e.keys[a];
      const ec = signs[i] < 0 ? -e.coefs[a] : e.coefs[a];
      for (let b = 0; b < mk.length; b++) table.addProduct(ek + mk[b], ec, mc[b]);
    }
    if (table.overflow) return null;
  }
  const r = table.result();
  return { small: true, keys: r.keys, coefs: r.coefs };
}

function combineBig(
  entries: ReadonlyArray<{ keys: Key[]; coefs: bigint[] }>, signs: readonly number[], minors: ReadonlyArray<{ keys: Key[]; coefs: bigint[] }>, packed: boolean,
): PackedPoly {
  const index = new Map<Key, number>();
  const keys: Key[] = [];
  const coefs: bigint[] = [];
  for (let i = 0; i < entries.length; i++) {
    const e = entries[i];
    const mk = minors[i].keys;
    const mc = minors[i].coefs;
    for (let a = 0; a < e.keys.length; a++) {
      const ek = e.keys[a];
      const ec = signs[i] < 0 ? -e.coefs[a] : e.coefs[a];
      for (let b = 0; b < mk.length; b++) {
        const k = addKeys(ek, mk[b]);
        const at = index.get(k);
        if (at === undefined) {
          index.set(k, keys.length);
          keys.push(k);
          coefs.push(ec * mc[b]);
        } else coefs[at] += ec * mc[b];
      }
    }
  }
  // Drop cancelled terms so memoized minors stay small.
  let w = 0;
  for (let r = 0; r < coefs.length; r++) {
    if (coefs[r] !== 0n) {
      keys[w] = keys[r];
      coefs[w] = coefs[r];
      w++;
    }
  }
  keys.length = w;
  coefs.length = w;
  // Back to doubles when the result fits again (cancellation can shrink coefficients).
  return packTerms(keys, coefs, packed);
}

/**
 * Memoized Laplace expansion over rows 0..n-1 of a prepared matrix, optionally with one row
 * and one column struck out (for cofactors). Minors are shared between calls through the memo.
 */
class Expander {
  private readonly memo = new Map<string, PackedPoly>();
  private readonly arith: Arith<PackedPoly>;
  private readonly flat: (PackedPoly | null)[];
  private readonly rowCols: number[][];

  constructor(private readonly pm: PreparedMatrix) {
    this.flat = pm.entries.flat();
    this.arith = packedArith(pm, this.flat);
    this.rowCols = pm.entries.map((row) => row.flatMap((e, j) => (e ? [j] : [])));
  }

  /** Determinant of the prepared matrix with row `skipRow` and column `skipCol` removed (-1: none), unsigned. */
  minor(skipRow: number, skipCol: number): Poly {
    const used = new Array<boolean>(this.pm.n).fill(false);
    if (skipCol >= 0) used[skipCol] = true;
    return this.arith.toPoly(this.expand(0, skipRow, used));
  }

  private expand(row: number, skipRow: number, used: boolean[]): PackedPoly {
    const n = this.pm.n;
    if (row === skipRow) row++;
    if (row >= n) return this.arith.one;
    const key = `${row > skipRow ? -1 : skipRow}:${used.map((u) => (u ? 1 : 0)).join("")}`;
    const hit = this.memo.get(key);
    if (hit) return hit;
    const entries: number[] = [];
    const signs: number[] = [];
    const minors: PackedPoly[] = [];
    for (const c of this.rowCols[row]) {
      if (used[c]) continue;
      // Sign of the entry within the remaining submatrix: its column's rank among the free columns.
      let rank = 0;
      for (let j = 0; j < c; j++) if (!used[j]) rank++;
      used[c] = true;
      const sub = this.expand(row + 1, skipRow, used);
      used[c] = false;
      if (this.arith.isZero(sub)) continue;
      entries.push(row * n + c);
      signs.push(rank % 2 === 0 ? 1 : -1);
      minors.push(sub);
    }
    const result = this.arith.combine(entries, signs, minors);
    this.memo.set(key, result);
    return result;
  }
}

function permuted(m: Matrix, order: readonly number[]): Poly[][] {
  return order.map((i) => order.map((j) => m[i][j]));
}

/** Exact determinant by memoized cofactor expansion (division-free). */
export function determinant(m: Matrix): Poly {
  const n = checkSquare(m);
  if (n === 0) return Poly.one();
  const order = bandOrder(m);
  const pm = prepare(permuted(m, order));
  return new Expander(pm).minor(-1, -1);
}

/** Cofactor C_ij = (-1)^(i+j) det(m without row i and column j). */
export function cofactor(m: Matrix, i: number, j: number): Poly {
  return cofactorsOf(m).cofactor(i, j);
}

/** Shared-memo access to det and cofactors of one matrix. */
export interface CofactorTable {
  determinant(): Poly;
  cofactor(i: number, j: number): Poly;
}

export function cofactorsOf(m: Matrix, lead = -1): CofactorTable {
  const n = checkSquare(m);
  const order = bandOrder(m, lead);
  const position = new Array<number>(n);
  order.forEach((orig, k) => (position[orig] = k));
  const pm = prepare(permuted(m, order));
  const ex = new Expander(pm);
  let det: Poly | null = null;
  const cache = new Map<number, Poly>();
  // Row scaling multiplies det by scale; a cofactor lacks its own row's factor, restored per row.
  const rowScale = m.map((row) => {
    let l = 1n;
    for (const e of row) if (!e.isZero() && e.den !== 1n) l = bigLcm(l, e.den);
    return l;
  });
  return {
    determinant() {
      if (det === null) det = n === 0 ? Poly.one() : ex.minor(-1, -1);
      return det;
    },
    cofactor(i: number, j: number) {
      const key = i * n + j;
      const hit = cache.get(key);
      if (hit) return hit;
      // Symmetric permutation: adj(P A P^T) = P adj(A) P^T, so cofactors map entrywise.
      const pi = position[i];
      const pj = position[j];
      let c = ex.minor(pi, pj).scale(Rational.of(rowScale[i]));
      if ((pi + pj) % 2 === 1) c = c.neg();
      cache.set(key, c);
      return c;
    },
  };
}

/**
 * Cramer's rule: x_i = numerators[i] / det. When det = 0 the numerators are meaningless.
 * numerators[i] = sum_j b_j C_ji; the entries are computed on first access and share minors.
 */
export function solveCramer(a: Matrix, b: readonly Poly[]): { det: Poly; numerators: Poly[] } {
  const n = checkSquare(a);
  if (b.length !== n) throw new RangeError("right-hand side length differs from the matrix size");
  const table = cofactorsOf(a);
  const det = table.determinant();
  const numerators: Poly[] = new Array<Poly>(n);
  for (let i = 0; i < n; i++) {
    let value: Poly | null = null;
    Object.defineProperty(numerators, i, {
      enumerable: true,
      configurable: false,
      get: () => {
        if (value === null) {
          let s = Poly.zero();
          for (let j = 0; j < n; j++) if (!b[j].isZero()) s = s.add(b[j].mul(table.cofactor(j, i)));
          value = s;
        }
        return value;
      },
    });
  }
  return { det, numerators };
}

// ---- Bareiss fraction-free elimination ---------------------------------------------------

/** Determinant by Bareiss's fraction-free elimination (each step divides exactly by the previous pivot). */
export function determinantBareiss(m: Matrix): Poly {
  const n = checkSquare(m);
  const a = m.map((row) => row.slice());
  let sign = 1;
  let prev = Poly.one();
  for (let k = 0; k < n; k++) {
    let p = k;
    while (p < n && a[p][k].isZero()) p++;
    if (p === n) return Poly.zero();
    if (p !== k) {
      [a[p], a[k]] = [a[k], a[p]];
      sign = -sign;
    }
    for (let i = k + 1; i < n; i++) {
      for (let j = k + 1; j < n; j++) {
        a[i][j] = polyDivideExact(a[k][k].mul(a[i][j]).sub(a[i][k].mul(a[k][j])), prev);
      }
      a[i][k] = Poly.zero();
    }
    prev = a[k][k];
  }
  return sign < 0 ? a[n - 1][n - 1].neg() : a[n - 1][n - 1];
}

/** Rank by fraction-free elimination with column skipping (exact). */
export function matrixRankBareiss(m: Matrix): number {
  const rows = m.length;
  const cols = rows === 0 ? 0 : m[0].length;
  const a = m.map((row) => row.slice());
  let prev = Poly.one();
  let r = 0;
  for (let c = 0; c < cols && r < rows; c++) {
    let p = r;
    while (p < rows && a[p][c].isZero()) p++;
    if (p === rows) continue;
    [a[p], a[r]] = [a[r], a[p]];
    for (let i = r + 1; i < rows; i++) {
      for (let j = c + 1; j < cols; j++) {
        a[i][j] = polyDivideExact(a[r][c].mul(a[i][j]).sub(a[i][c].mul(a[r][j])), prev);
      }
      a[i][c] = Poly.zero();
    }
    prev = a[r][c];
    r++;
  }
  return r;
}
