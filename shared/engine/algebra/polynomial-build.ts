// Canonical polynomial fields from raw terms: zero terms and unused variables dropped, the
// common denominator reduced, the terms sorted into graded lexicographic order (see Poly).
// The builders return the fields and Poly.fromFields wraps them, so building does not depend
// on the class.

import { bigGcd, bigLcm, type Rational } from "./rational";
import { sortNames } from "./names";
import { scratchFloat64, scratchUint32 } from "./scratch";
import { MAX_EXPONENT, bitLength, fieldDecoder, fieldOf, gradedKeys, makeLayout, type Key, type Layout } from "./monomial-layout";

/** A polynomial's fields in canonical form, with its degrees when the building operation knows them. */
export interface PolyFields {
  readonly vars: readonly string[];
  readonly exps: Uint16Array;
  readonly coefs: readonly bigint[];
  readonly den: bigint;
  readonly degrees?: Int32Array;
  readonly lowDegrees?: Int32Array;
}

export const ZERO_FIELDS: PolyFields = { vars: [], exps: new Uint16Array(0), coefs: [], den: 1n };

/** Divide the common denominator and the coefficients (in place) by their gcd; returns the reduced denominator. */
export function normalizeDen(coefs: bigint[], den: bigint): bigint {
  if (den === 1n) return den;
  let g = den;
  for (let i = 0; i < coefs.length && g !== 1n; i++) g = bigGcd(g, coefs[i]);
  if (g !== 1n) {
    for (let i = 0; i < coefs.length; i++) coefs[i] /= g;
    return den / g;
  }
  return den;
}


/** Fields of the polynomial with packed keys (distinct) and integer coefficients (BigInt, or safe integers in doubles) over den. */
export function fieldsFromKeys(layout: Layout, keys: ArrayLike<Key>, coefs: ArrayLike<bigint> | Float64Array, den: bigint): PolyFields {
  const nv = layout.vars.length;
  const m = coefs.length;
  const cs: bigint[] = [];
  const keep: number[] = [];
  if (coefs instanceof Float64Array) {
    for (let i = 0; i < m; i++) if (coefs[i] !== 0) keep.push(i);
  } else {
    for (let i = 0; i < m; i++) if (coefs[i] !== 0n) keep.push(i);
  }
  const n = keep.length;
  if (layout.packed && n > 1) {
    const sorted = sortedFromKeys(layout, keys, keep, coefs, den);
    if (sorted !== null) return sorted;
  }
  const exps = new Uint16Array(n * nv);
  if (layout.packed) {
    const dec = fieldDecoder(layout);
    // One array kind for the loop (keys arrive as Float64Array or as arrays of doubles).
    const ks = keys instanceof Float64Array ? keys : Float64Array.from(keys as ArrayLike<number>);
    for (let t = 0; t < n; t++) {
      const i = keep[t];
      const k = ks[i];
      const hi = Math.floor(k / 4294967296);
      const lo = (k - hi * 4294967296) >>> 0;
      const o = t * nv;
      for (let v = 0; v < nv; v++) exps[o + v] = fieldOf(hi, lo, v, dec);
    }
  } else {
    const masks = layout.bits.map((b) => (1n << BigInt(b)) - 1n);
    const shifts = layout.multBig.map((mb) => BigInt(mb.toString(2).length - 1));
    for (let t = 0; t < n; t++) {
      const k = keys[keep[t]] as bigint;
      for (let v = 0; v < nv; v++) exps[t * nv + v] = Number((k >> shifts[v]) & masks[v]);
    }
  }
  if (coefs instanceof Float64Array) for (let t = 0; t < n; t++) cs.push(bigOf(coefs[keep[t]]));
  else for (let t = 0; t < n; t++) cs.push(coefs[keep[t]]);
  return canonicalFields(layout.vars, exps, cs, den);
}

/**
 * The canonical fields straight from packed keys, each exponent row written once: the keys are
 * ordered by (degree, key) - in a layout with the first variable in the top field, key order is
 * lexicographic order; a graded layout holds the degree in the key already - and decoded in that
 * order. Null when (degree, key) does not fit a double; the caller then takes the general path.
 */
function sortedFromKeys(layout: Layout, keys: ArrayLike<Key>, keep: readonly number[], coefs: ArrayLike<bigint> | Float64Array, den: bigint): PolyFields | null {
  const nv = layout.vars.length;
  const n = keep.length;
  const dec = fieldDecoder(layout);
  const ks = keys instanceof Float64Array ? keys : Float64Array.from(keys as ArrayLike<number>);
  const graded = scratchFloat64("graded-keys", n);
  if (layout.graded) {
    for (let t = 0; t < n; t++) graded[t] = ks[keep[t]];
  } else {
    let maxTotal = 0;
    for (let t = 0; t < n; t++) {
      const k = ks[keep[t]];
      const h = Math.floor(k / 4294967296);
      const l = (k - h * 4294967296) >>> 0;
      let d = 0;
      for (let v = 0; v < nv; v++) d += fieldOf(h, l, v, dec);
      graded[t] = d;
      if (d > maxTotal) maxTotal = d;
    }
    if (layout.totalBits + bitLength(maxTotal) > 53) return null;
    const top = 2 ** layout.totalBits;
    for (let t = 0; t < n; t++) graded[t] = graded[t] * top + ks[keep[t]];
  }
  const order = radixOrder(graded);
  let exps = new Uint16Array(n * nv);
  const maxDeg = new Int32Array(nv);
  const cs = new Array<bigint>(n);
  const small = coefs instanceof Float64Array;
  for (let r = 0; r < n; r++) {
    const t = order[n - 1 - r];
    const k = ks[keep[t]];
    const h = Math.floor(k / 4294967296);
    const l = (k - h * 4294967296) >>> 0;
    const o = r * nv;
    for (let v = 0; v < nv; v++) {
      const x = fieldOf(h, l, v, dec);
      exps[o + v] = x;
      if (x > maxDeg[v]) maxDeg[v] = x;
    }
    cs[r] = small ? bigOf(coefs[keep[t]]) : (coefs[keep[t]] as bigint);
  }
  // Variables that occur; a field that is zero in every term is left out.
  const kept: number[] = [];
  for (let v = 0; v < nv; v++) if (maxDeg[v] > 0) kept.push(v);
  const nk = kept.length;
  if (nk !== nv) {
    const compact = new Uint16Array(n * nk);
    for (let r = 0; r < n; r++) for (let j = 0; j < nk; j++) compact[r * nk + j] = exps[r * nv + kept[j]];
    exps = compact;
  }
  if (den < 0n) {
    den = -den;
    for (let i = 0; i < n; i++) cs[i] = -cs[i];
  }
  den = normalizeDen(cs, den);
  return { vars: nk === nv ? layout.vars : kept.map((v) => layout.vars[v]), exps, coefs: cs, den, degrees: Int32Array.from(kept, (v) => maxDeg[v]) };
}

/**
 * Ascending order of distinct non-negative integer keys below 2^53, as term indices: a least
 * significant digit radix sort in passes of 11 bits (linear, and no index bits packed into the key).
 * The order is a scratch array (scratch.ts): valid until the next call.
 */
function radixOrder(keys: Float64Array): Uint32Array {
  const n = keys.length;
  const hi = scratchUint32("radix-hi", n);
  const lo = scratchUint32("radix-lo", n);
  let maxHi = 0;
  let maxLo = 0;
  for (let t = 0; t < n; t++) {
    const h = Math.floor(keys[t] / 4294967296);
    hi[t] = h;
    lo[t] = (keys[t] - h * 4294967296) >>> 0;
    if (h > maxHi) maxHi = h;
    if (lo[t] > maxLo) maxLo = lo[t];
  }
  let order = scratchUint32("radix-a", n);
  for (let t = 0; t < n; t++) order[t] = t;
  let next = scratchUint32("radix-b", n);
  const count = new Uint32Array(2048);
  const pass = (word: Uint32Array, shift: number) => {
    count.fill(0);
    for (let i = 0; i < n; i++) count[(word[order[i]] >>> shift) & 2047]++;
    let sum = 0;
    for (let b = 0; b < 2048; b++) {
      const c = count[b];
      count[b] = sum;
      sum += c;
    }
    for (let i = 0; i < n; i++) {
      const t = order[i];
      next[count[(word[t] >>> shift) & 2047]++] = t;
    }
    [order, next] = [next, order];
  };
  // Passes above the largest key's top bit would leave the order as it is: they are skipped.
  if (maxHi > 0) {
    for (let shift = 0; shift < 32; shift += 11) pass(lo, shift);
    for (let shift = 0; shift < 32 && maxHi >>> shift > 0; shift += 11) pass(hi, shift);
  } else {
    for (let shift = 0; shift < 32 && maxLo >>> shift > 0; shift += 11) pass(lo, shift);
  }
  return order;
}

/** The BigInts of -256 ... 256, made once: most coefficients of a network's polynomials are among them. */
const SMALL_BIGINTS = Array.from({ length: 513 }, (_, i) => BigInt(i - 256));

/** A safe integer as a BigInt, shared for small values (one object instead of one per term). */
function bigOf(c: number): bigint {
  return c >= -256 && c <= 256 ? SMALL_BIGINTS[c + 256] : BigInt(c);
}

/** A monomial by its variables: coefficient and (variable number, exponent) pairs, variables distinct, in any order. */
export interface SparseMonomial {
  coef: Rational;
  factors: number[];
}

/**
 * Fields of the sum of many monomials (repeats allowed) over the variables names (numbered by position),
 * in one pass: rows written once, repeats found by a hash of each monomial's pairs, one sort.
 * Linear in the terms written plus the sort, where adding them one polynomial at a time costs
 * n log n polynomial additions.
 */
export function fieldsFromMonomials(names: readonly string[], terms: readonly SparseMonomial[]): PolyFields {
  const used = new Uint8Array(names.length);
  for (const t of terms) for (let j = 0; j < t.factors.length; j += 2) used[t.factors[j]] = 1;
  const vars = sortNames(names.filter((_, i) => used[i]));
  const column = new Int32Array(names.length);
  const sortedAt = new Map(vars.map((v, i) => [v, i]));
  names.forEach((name, i) => {
    if (used[i]) column[i] = sortedAt.get(name)!;
  });
  const nv = vars.length;
  const exps = new Uint16Array(terms.length * nv);
  const coefs: Rational[] = [];
  // Chained hash table over the distinct rows so far: head by hash, next by row.
  const head = new Map<number, number>();
  const next: number[] = [];
  for (const t of terms) {
    const row = coefs.length;
    const o = row * nv;
    const f = t.factors;
    let h = 0;
    for (let j = 0; j < f.length; j += 2) {
      const c = column[f[j]];
      const e = f[j + 1];
      if (e > MAX_EXPONENT) throw new RangeError(`exponent above ${MAX_EXPONENT}`);
      exps[o + c] = e;
      // Order-independent: the pairs come in the text's order.
      h = (h + Math.imul((c * 65599 + e) ^ 0x5bd1e995, 0x9e3779b1)) | 0;
    }
    let same = head.get(h) ?? -1;
    for (; same >= 0; same = next[same]) {
      const so = same * nv;
      let equal = true;
      for (let v = 0; v < nv && equal; v++) equal = exps[so + v] === exps[o + v];
      if (equal) break;
    }
    if (same >= 0) {
      coefs[same] = coefs[same].add(t.coef);
      for (let j = 0; j < f.length; j += 2) exps[o + column[f[j]]] = 0;
      continue;
    }
    coefs.push(t.coef);
    next.push(head.get(h) ?? -1);
    head.set(h, row);
  }
  const n = coefs.length;
  return fieldsFromRationals(vars, n * nv === exps.length ? exps : exps.slice(0, n * nv), coefs);
}

/** A sum of terms with rational coefficients, repeated exponent rows combined (rows keyed as text: for small inputs). */
export class RationalTermSum {
  private readonly index = new Map<string, number>();
  private readonly exps: number[] = [];
  private readonly coefs: Rational[] = [];

  /** Add c times the monomial with exponent row e (read, not kept). */
  add(e: readonly number[], c: Rational): void {
    const key = e.join(",");
    const at = this.index.get(key);
    if (at === undefined) {
      this.index.set(key, this.coefs.length);
      this.exps.push(...e);
      this.coefs.push(c);
    } else this.coefs[at] = this.coefs[at].add(c);
  }

  fields(vars: readonly string[]): PolyFields {
    return fieldsFromRationals(vars, this.exps, this.coefs);
  }
}

/** Fields of the polynomial with distinct monomials and rational coefficients. */
function fieldsFromRationals(vars: readonly string[], exps: ArrayLike<number>, coefs: Rational[]): PolyFields {
  let den = 1n;
  for (const c of coefs) if (c.den !== 1n) den = bigLcm(den, c.den);
  const ints = coefs.map((c) => (c.den === den ? c.num : c.num * (den / c.den)));
  return canonicalFields(vars, exps, ints, den);
}

/**
 * Canonical fields from distinct monomials: drops zero terms and unused variables,
 * reduces the common denominator and sorts the terms. Takes ownership of coefs.
 */
export function canonicalFields(vars: readonly string[], exps: ArrayLike<number>, coefs: bigint[], den: bigint): PolyFields {
  // One element type for every loop below (mixed array kinds make V8's element loads slow).
  if (!(exps instanceof Uint16Array)) exps = Uint16Array.from(exps);
  let nv = vars.length;
  const n0 = coefs.length;
  // Drop zero coefficients.
  let n = 0;
  for (let i = 0; i < n0; i++) if (coefs[i] !== 0n) n++;
  let e: ArrayLike<number> = exps;
  if (n !== n0) {
    const e2 = new Uint16Array(n * nv);
    const c2 = new Array<bigint>(n);
    let t = 0;
    for (let i = 0; i < n0; i++) {
      if (coefs[i] === 0n) continue;
      for (let v = 0; v < nv; v++) e2[t * nv + v] = exps[i * nv + v];
      c2[t++] = coefs[i];
    }
    e = e2;
    coefs = c2;
  }
  if (n === 0) return ZERO_FIELDS;
  if (den < 0n) {
    den = -den;
    for (let i = 0; i < n; i++) coefs[i] = -coefs[i];
  }
  den = normalizeDen(coefs, den);
  // Drop variables that no longer occur.
  const maxDeg = new Int32Array(nv);
  for (let t = 0; t < n; t++) for (let v = 0; v < nv; v++) if (e[t * nv + v] > maxDeg[v]) maxDeg[v] = e[t * nv + v];
  const keep: number[] = [];
  for (let v = 0; v < nv; v++) if (maxDeg[v] > 0) keep.push(v);
  let outVars: readonly string[] = vars;
  if (keep.length !== nv) {
    const e2 = new Uint16Array(n * keep.length);
    for (let t = 0; t < n; t++) for (let j = 0; j < keep.length; j++) e2[t * keep.length + j] = e[t * nv + keep[j]];
    e = e2;
    outVars = keep.map((v) => vars[v]);
    const md = keep.map((v) => maxDeg[v]);
    nv = keep.length;
    maxDeg.set(md);
  }
  const ex = e instanceof Uint16Array ? e : Uint16Array.from(e as ArrayLike<number>);
  return sortedFields(outVars, ex, coefs, den, maxDeg.subarray(0, nv));
}

/** Canonical order for distinct terms with no zero coefficient; maxDeg is each variable's degree (all > 0). */
export function sortedFields(vars: readonly string[], e: Uint16Array, coefs: bigint[], den: bigint, maxDeg: ArrayLike<number>): PolyFields {
  const nv = vars.length;
  const n = coefs.length;
  const degrees = Int32Array.from(maxDeg);
  if (n <= 1) return { vars, exps: e, coefs, den, degrees };
  let maxTot = 0;
  for (let v = 0; v < nv; v++) maxTot += maxDeg[v];
  const layout = makeLayout(vars, maxDeg);
  let order: Uint32Array;
  if (layout.totalBits + bitLength(maxTot) <= 53) {
    const sk = gradedKeys(e, n, nv, layout.mult, layout.totalBits);
    let sorted = true;
    for (let t = 1; t < n && sorted; t++) if (sk[t] > sk[t - 1]) sorted = false;
    if (sorted) return { vars, exps: e, coefs, den, degrees };
    // Ascending by graded key, read back from the top.
    order = radixOrder(sk).reverse();
  } else {
    const tot = new Float64Array(n);
    for (let t = 0, o = 0; t < n; t++, o += nv) {
      let d = 0;
      for (let v = 0; v < nv; v++) d += e[o + v];
      tot[t] = d;
    }
    order = new Uint32Array(n);
    for (let t = 0; t < n; t++) order[t] = t;
    order.sort((a, b) => {
      if (tot[a] !== tot[b]) return tot[b] - tot[a];
      for (let v = 0; v < nv; v++) {
        const d = e[b * nv + v] - e[a * nv + v];
        if (d !== 0) return d;
      }
      return 0;
    });
  }
  const e2 = new Uint16Array(n * nv);
  const c2 = new Array<bigint>(n);
  for (let t = 0; t < n; t++) {
    const s = order[t];
    const from = s * nv;
    const to = t * nv;
    for (let v = 0; v < nv; v++) e2[to + v] = e[from + v];
    c2[t] = coefs[s];
  }
  return { vars, exps: e2, coefs: c2, den, degrees };
}

