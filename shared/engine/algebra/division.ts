// Exact division of sparse polynomials: leading-term division with the remainder held in
// a hash map and its terms ordered by a max-heap (after Monagan and Pearce, 2007, simplified).

import { Poly } from "./polynomial";
import { fieldsFromKeys } from "./polynomial-build";
import { addKeys, fieldDecoder, fieldOf, keysIn, makeLayout, subKeys, varMap, type Key, type Layout } from "./monomial-layout";

class MaxHeap {
  private readonly items: Key[] = [];
  get size(): number {
    return this.items.length;
  }
  peek(): Key {
    return this.items[0];
  }
  push(k: Key): void {
    const h = this.items;
    let i = h.length;
    h.push(k);
    while (i > 0) {
      const p = (i - 1) >> 1;
      if (h[p] >= k) break;
      h[i] = h[p];
      i = p;
    }
    h[i] = k;
  }
  /** Takes the largest key out; only called on a heap that is not empty. */
  pop(): Key {
    const h = this.items;
    const top = h[0];
    const last = h.pop()!;
    const n = h.length;
    if (n > 0) {
      let i = 0;
      for (;;) {
        const l = 2 * i + 1;
        if (l >= n) break;
        const r = l + 1;
        const c = r < n && h[r] > h[l] ? r : l;
        if (h[c] <= last) break;
        h[i] = h[c];
        i = c;
      }
      h[i] = last;
    }
    return top;
  }
}

/** Layout over a's variables with a total-degree field on top, so key order is the canonical (graded) order. */
function gradedLayout(vars: readonly string[], maxDeg: ArrayLike<number>): { layout: Layout; top: Key; totalBits: number } {
  let tot = 0;
  for (let v = 0; v < vars.length; v++) tot += maxDeg[v];
  const layout = makeLayout(vars, maxDeg);
  const totBits = tot <= 0 ? 1 : 32 - Math.clz32(tot);
  const packed = layout.totalBits + totBits <= 53;
  const full: Layout = { ...layout, packed };
  return { layout: full, top: packed ? 2 ** layout.totalBits : 1n << BigInt(layout.totalBits), totalBits: layout.totalBits };
}

function gradedKeys(p: Poly, layout: Layout, top: Key): Key[] {
  const keys = keysIn(p, layout);
  const nv = p.vars.length;
  for (let t = 0; t < keys.length; t++) {
    let d = 0;
    for (let v = 0; v < nv; v++) d += p.exps[t * nv + v];
    keys[t] = layout.packed ? (keys[t] as number) + d * (top as number) : (keys[t] as bigint) + BigInt(d) * (top as bigint);
  }
  return keys;
}

/** Quotient a / b when b divides a exactly over Q, otherwise null. */
export function polyDivide(a: Poly, b: Poly): Poly | null {
  if (b.isZero()) throw new RangeError("division by the zero polynomial");
  if (a.isZero()) return a;
  const bc = b.constantValue();
  if (bc) return a.scale(bc.inverse());
  if (b.termCount() === 1) return divideByTerm(a, b);
  // Every variable of b must occur in a with at least b's degree.
  const degA = a.degrees();
  const degB = b.degrees();
  let map: Int32Array;
  try {
    map = varMap(b.vars, a.vars);
  } catch {
    return null;
  }
  for (let v = 0; v < b.vars.length; v++) if (degB[v] > degA[map[v]]) return null;
  // Gauss's lemma: a primitive integer divisor of an integer polynomial leaves an integer quotient.
  const ca = a.content();
  const cb = b.content();
  const A = a.scale(ca.inverse());
  const B = b.scale(cb.inverse());
  const q = divideIntegral(A, B, degA, map, degB);
  return q === null ? null : q.scale(ca.div(cb));
}

/** Quotient a / b, throwing when b does not divide a. */
export function polyDivideExact(a: Poly, b: Poly): Poly {
  const q = polyDivide(a, b);
  if (q === null) throw new Error("polyDivideExact: divisor does not divide the dividend");
  return q;
}

const MAX_SAFE = Number.MAX_SAFE_INTEGER;

function divideIntegral(A: Poly, B: Poly, degA: Int32Array, map: Int32Array, degB: Int32Array): Poly | null {
  const nv = A.vars.length;
  // Room for the quotient: deg_v(q) = deg_v(A) - deg_v(B).
  const qMax = Int32Array.from(degA);
  for (let v = 0; v < B.vars.length; v++) qMax[map[v]] -= degB[v];
  const { layout, top } = gradedLayout(A.vars, degA);
  const kA = gradedKeys(A, layout, top);
  const kB = gradedKeys(B, layout, top);
  // Exponents of B's leading term in A's variable order.
  const ltB = new Int32Array(nv);
  for (let v = 0; v < B.vars.length; v++) ltB[map[v]] = B.exps[v];
  const fits = (c: bigint) => c >= -2147483648n && c <= 2147483647n;
  if (layout.packed && A.coefs.every(fits) && B.coefs.every(fits)) {
    const q = divideSmall(A, B, layout, kA as number[], kB as number[], ltB, qMax);
    if (q !== "overflow") return q;
  }
  return divideBig(A, B, layout, kA, kB, ltB, qMax);
}

/**
 * The leading remainder term must be a multiple of B's leading term within the quotient's
 * degree bounds; checked on the decoded exponents of key k.
 */
type Decoder = ReturnType<typeof fieldDecoder>;

function quotientTermFits(layout: Layout, dec: Decoder | null, k: Key, ltB: Int32Array, qMax: Int32Array): boolean {
  const nv = ltB.length;
  if (dec) {
    const kk = k as number;
    const hi = Math.floor(kk / 4294967296);
    const lo = (kk - hi * 4294967296) >>> 0;
    for (let v = 0; v < nv; v++) {
      const e = fieldOf(hi, lo, v, dec);
      const d = e - ltB[v];
      if (d < 0 || d > qMax[v]) return false;
    }
    return true;
  }
  const kk = k as bigint;
  for (let v = 0; v < nv; v++) {
    const e = Number((kk / layout.multBig[v]) % (1n << BigInt(layout.bits[v])));
    const d = e - ltB[v];
    if (d < 0 || d > qMax[v]) return false;
  }
  return true;
}

/**
 * Division with coefficients in doubles (exact while every value stays a safe integer).
 * A's terms are consumed in order; only the pending corrections -q*B sit in the heap.
 */
function divideSmall(
  A: Poly, B: Poly, layout: Layout, kA: number[], kB: number[], ltB: Int32Array, qMax: Int32Array,
): Poly | null | "overflow" {
  const cA = A.coefs.map(Number);
  const cB = B.coefs.map(Number);
  const lcB = cB[0];
  const kB0 = kB[0];
  const dec = fieldDecoder(layout);
  const corr = new Map<number, number>();
  const heap = new MaxHeap();
  const qKeys: number[] = [];
  const qCoefs: number[] = [];
  let ia = 0;
  const nA = kA.length;
  while (ia < nA || heap.size > 0) {
    let k: number;
    let c: number;
    if (ia < nA && (heap.size === 0 || kA[ia] >= (heap.peek() as number))) {
      k = kA[ia];
      c = cA[ia++];
      if (heap.size > 0 && heap.peek() === k) {
        heap.pop();
        c += corr.get(k)!;
        corr.delete(k);
      }
    } else {
      k = heap.pop() as number;
      c = corr.get(k)!;
      corr.delete(k);
    }
    if (c === 0) continue;
    if (Math.abs(c) > MAX_SAFE) return "overflow";
    if (!quotientTermFits(layout, dec, k, ltB, qMax)) return null;
    const qc = c / lcB;
    // Near 2^53 a rounded quotient could look integral; the product check is exact.
    if (!Number.isInteger(qc) || qc * lcB !== c) return null;
    const t = k - kB0;
    qKeys.push(t);
    qCoefs.push(qc);
    for (let j = 1; j < kB.length; j++) {
      const kk = t + kB[j];
      const prod = qc * cB[j];
      if (Math.abs(prod) > MAX_SAFE) return "overflow";
      const old = corr.get(kk);
      if (old === undefined) {
        corr.set(kk, -prod);
        heap.push(kk);
      } else {
        // Every stored value must stay exact, not just the final sums.
        const next = old - prod;
        if (Math.abs(next) > MAX_SAFE) return "overflow";
        corr.set(kk, next);
      }
    }
  }
  return Poly.fromFields(fieldsFromKeys(layout, qKeys, qCoefs.map(BigInt), 1n));
}

function divideBig(
  A: Poly, B: Poly, layout: Layout, kA: Key[], kB: Key[], ltB: Int32Array, qMax: Int32Array,
): Poly | null {
  const cA = A.coefs;
  const cB = B.coefs;
  const lcB = cB[0];
  const kB0 = kB[0];
  const dec = layout.packed ? fieldDecoder(layout) : null;
  const corr = new Map<Key, bigint>();
  const heap = new MaxHeap();
  const qKeys: Key[] = [];
  const qCoefs: bigint[] = [];
  let ia = 0;
  const nA = kA.length;
  while (ia < nA || heap.size > 0) {
    let k: Key;
    let c: bigint;
    if (ia < nA && (heap.size === 0 || kA[ia] >= heap.peek())) {
      k = kA[ia];
      c = cA[ia++];
      if (heap.size > 0 && heap.peek() === k) {
        heap.pop();
        c += corr.get(k)!;
        corr.delete(k);
      }
    } else {
      k = heap.pop();
      c = corr.get(k)!;
      corr.delete(k);
    }
    if (c === 0n) continue;
    if (!quotientTermFits(layout, dec, k, ltB, qMax)) return null;
    if (c % lcB !== 0n) return null;
    const qc = c / lcB;
    const t = subKeys(k, kB0);
    qKeys.push(t);
    qCoefs.push(qc);
    for (let j = 1; j < kB.length; j++) {
      const kk = addKeys(t, kB[j]);
      const old = corr.get(kk);
      if (old === undefined) {
        corr.set(kk, -qc * cB[j]);
        heap.push(kk);
      } else corr.set(kk, old - qc * cB[j]);
    }
  }
  return Poly.fromFields(fieldsFromKeys(layout, qKeys, qCoefs, 1n));
}

/** a / m for a one-term m, or null when m does not divide a. */
function divideByTerm(a: Poly, m: Poly): Poly | null {
  const powers = m.monomialAt(0);
  const low = a.lowDegrees();
  for (const v of Object.keys(powers)) {
    const j = a.vars.indexOf(v);
    if (j < 0 || low[j] < powers[v]) return null;
  }
  return a.divideByMonomial(powers).scale(m.coefficientAt(0).inverse());
}
