// Packed monomial keys: the exponents of a monomial laid side by side as bit fields of one
// integer, the first variable in the most significant field, so multiplying monomials is adding
// keys. A layout is sized per operation from the degrees its result can reach; keys fit in a
// double up to 53 bits and are BigInt beyond.

import { compareNames } from "./names";
import type { Poly } from "./polynomial";

export type Key = number | bigint;

// Keys of one layout are all doubles or all BigInts, so these never mix the two; the casts only tell
// TypeScript so (multiplying monomials is adding keys, dividing is subtracting them).
export const addKeys = (a: Key, b: Key): Key => (a as number) + (b as number);
export const subKeys = (a: Key, b: Key): Key => (a as number) - (b as number);

/** A packed-monomial layout: one bit field per variable, the first variable in the most significant field. */
export interface Layout {
  readonly vars: readonly string[];
  readonly bits: readonly number[];
  /** 2^offset of each field, as a double (meaningful only when packed). */
  readonly mult: Float64Array;
  /** 2^offset of each field as BigInt (used when not packed). */
  readonly multBig: readonly bigint[];
  readonly totalBits: number;
  /** Keys fit exactly in a double. */
  readonly packed: boolean;
  /**
   * A graded layout also holds each monomial's total degree in a field above the exponents
   * (weight 2^totalBits), so numeric key order is graded lexicographic order.
   */
  readonly graded: boolean;
}

export const MAX_EXPONENT = 0xffff;

export function bitLength(n: number): number {
  return n <= 0 ? 1 : 32 - Math.clz32(n);
}

export function makeLayout(vars: readonly string[], maxDeg: ArrayLike<number>, graded = false): Layout {
  const nv = vars.length;
  const bits = new Array<number>(nv);
  let total = 0;
  for (let v = 0; v < nv; v++) {
    if (maxDeg[v] > MAX_EXPONENT) throw new RangeError(`exponent above ${MAX_EXPONENT}`);
    bits[v] = bitLength(maxDeg[v]);
    total += bits[v];
  }
  const mult = new Float64Array(nv);
  const multBig = new Array<bigint>(nv);
  let off = 0;
  for (let v = nv - 1; v >= 0; v--) {
    mult[v] = 2 ** off;
    multBig[v] = 1n << BigInt(off);
    off += bits[v];
  }
  // The degree field is kept only when it fits beside the exponents in a double.
  let top = 0;
  for (let v = 0; v < nv; v++) top += maxDeg[v];
  const isGraded = graded && total + bitLength(top) <= 53;
  return { vars, bits, mult, multBig, totalBits: total, packed: total <= 53, graded: isGraded };
}

/** Index of each of `from`'s variables within `to` (both sorted; `from` ⊆ `to`). */
export function varMap(from: readonly string[], to: readonly string[]): Int32Array {
  const map = new Int32Array(from.length);
  let j = 0;
  for (let i = 0; i < from.length; i++) {
    while (to[j] !== from[i]) {
      j++;
      if (j >= to.length) throw new Error(`variable ${from[i]} missing from layout`);
    }
    map[i] = j;
  }
  return map;
}

export function unionVars(a: readonly string[], b: readonly string[]): string[] {
  if (a.length === 0) return b.slice();
  if (b.length === 0) return a.slice();
  const out: string[] = [];
  let i = 0;
  let j = 0;
  while (i < a.length && j < b.length) {
    const c = a[i] === b[j] ? 0 : compareNames(a[i], b[j]);
    if (c === 0) {
      out.push(a[i]);
      i++;
      j++;
    } else if (c < 0) out.push(a[i++]);
    else out.push(b[j++]);
  }
  while (i < a.length) out.push(a[i++]);
  while (j < b.length) out.push(b[j++]);
  return out;
}

/** Packed keys of p's terms in a layout that contains all of p's variables. */
export function keysIn(p: Poly, layout: Layout): Key[] {
  const nv = p.vars.length;
  const map = varMap(p.vars, layout.vars);
  const n = p.coefs.length;
  const e = p.exps;
  const keys = new Array<Key>(n);
  if (layout.packed) {
    const mult = new Float64Array(nv);
    for (let v = 0; v < nv; v++) mult[v] = layout.mult[map[v]];
    const degreeWeight = layout.graded ? 2 ** layout.totalBits : 0;
    for (let t = 0, o = 0; t < n; t++, o += nv) {
      let k = 0;
      let d = 0;
      for (let v = 0; v < nv; v++) {
        k += e[o + v] * mult[v];
        d += e[o + v];
      }
      keys[t] = k + d * degreeWeight;
    }
  } else {
    const mult = Array.from(map, (j) => layout.multBig[j]);
    for (let t = 0, o = 0; t < n; t++, o += nv) {
      let k = 0n;
      for (let v = 0; v < nv; v++) if (e[o + v] !== 0) k += BigInt(e[o + v]) * mult[v];
      keys[t] = k;
    }
  }
  return keys;
}

/**
 * Graded keys of n exponent rows of nv columns (total degree on top of the packed exponents,
 * column v weighted by mult[v]), so numeric order is graded lexicographic order. Needs
 * totalBits plus the bits of the highest total degree to fit in 53.
 */
export function gradedKeys(e: Uint16Array, n: number, nv: number, mult: Float64Array, totalBits: number): Float64Array {
  const top = 2 ** totalBits;
  const keys = new Float64Array(n);
  for (let t = 0, o = 0; t < n; t++, o += nv) {
    let k = 0;
    let d = 0;
    for (let v = 0; v < nv; v++) {
      const x = e[o + v];
      d += x;
      k += x * mult[v];
    }
    keys[t] = d * top + k;
  }
  return keys;
}

/** Field v of a key given as its high and low 32-bit words (decoder from fieldDecoder). */
export function fieldOf(hi: number, lo: number, v: number, dec: { off: Int32Array; bits: Int32Array; mask: Int32Array }): number {
  const off = dec.off[v];
  return (off >= 32 ? hi >>> (off - 32) : off + dec.bits[v] <= 32 ? lo >>> off : (lo >>> off) | (hi << (32 - off))) & dec.mask[v];
}

/** Bit offset, width and mask of each field, for decoding keys with 32-bit integer operations. */
export function fieldDecoder(layout: Layout): { off: Int32Array; bits: Int32Array; mask: Int32Array } {
  const nv = layout.vars.length;
  const off = new Int32Array(nv);
  const bits = new Int32Array(nv);
  const mask = new Int32Array(nv);
  for (let v = 0; v < nv; v++) {
    off[v] = Math.round(Math.log2(layout.mult[v]));
    bits[v] = layout.bits[v];
    mask[v] = (1 << bits[v]) - 1;
  }
  return { off, bits, mask };
}

