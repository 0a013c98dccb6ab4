// The arithmetic kernels behind Poly.add, Poly.sub and Poly.mul, on packed monomial keys:
// a sum merges the two canonical term sequences, a product by one term shifts exponents, a
// general product accumulates key sums. Each returns the result's fields (Poly.fromFields
// wraps them).

import { bigLcm } from "./rational";
import { TermTable, smallCoefficients } from "./term-table";
import { MAX_EXPONENT, addKeys, bitLength, gradedKeys, keysIn, makeLayout, unionVars, varMap, type Key, type Layout } from "./monomial-layout";
import { canonicalFields, fieldsFromKeys, normalizeDen, ZERO_FIELDS, type PolyFields } from "./polynomial-build";
import type { Poly } from "./polynomial";

/** x times y, both with at least two terms and a variable: key sums accumulated, in doubles while the coefficients allow. */
export function mulSparse(x: Poly, y: Poly): PolyFields {
  const [a, b] = x.coefs.length <= y.coefs.length ? [x, y] : [y, x];
  const vars = unionVars(a.vars, b.vars);
  const da = a.degrees();
  const db = b.degrees();
  const ma = varMap(a.vars, vars);
  const mb = varMap(b.vars, vars);
  const maxDeg = new Int32Array(vars.length);
  for (let v = 0; v < a.vars.length; v++) maxDeg[ma[v]] += da[v];
  for (let v = 0; v < b.vars.length; v++) maxDeg[mb[v]] += db[v];
  const layout = makeLayout(vars, maxDeg);
  const ka = keysIn(a, layout);
  const kb = keysIn(b, layout);
  if (layout.packed) {
    const fast = mulSmall(ka as number[], a.coefs, kb as number[], b.coefs);
    if (fast) return fieldsFromKeys(layout, fast.keys, fast.coefs, a.den * b.den);
  }
  const index = new Map<Key, number>();
  const keys: Key[] = [];
  const coefs: bigint[] = [];
  const ca = a.coefs;
  const cb = b.coefs;
  for (let i = 0; i < ca.length; i++) {
    const ki = ka[i];
    const ci = ca[i];
    for (let j = 0; j < cb.length; j++) {
      const k = addKeys(ki, kb[j]);
      const at = index.get(k);
      if (at === undefined) {
        index.set(k, keys.length);
        keys.push(k);
        coefs.push(ci * cb[j]);
      } else coefs[at] += ci * cb[j];
    }
  }
  return fieldsFromKeys(layout, keys, coefs, a.den * b.den);
}

/**
 * Σ_k x_k·y_k in one term table of one layout, so that terms cancelling between the products are
 * never decoded into exponent rows. Null when the pairs' denominators differ, the layout does not
 * pack or a coefficient leaves doubles: the caller then multiplies and adds.
 */
export function sumOfProductsPacked(pairs: ReadonlyArray<readonly [Poly, Poly]>): PolyFields | null {
  const den = pairs[0][0].den * pairs[0][1].den;
  let vars: string[] = [];
  for (const [x, y] of pairs) {
    if (x.den * y.den !== den) return null;
    vars = unionVars(unionVars(vars, x.vars), y.vars);
  }
  const maxDeg = new Int32Array(vars.length);
  let expected = 0;
  for (const [x, y] of pairs) {
    const sum = new Int32Array(vars.length);
    for (const p of [x, y]) {
      const d = p.degrees();
      const map = varMap(p.vars, vars);
      for (let v = 0; v < d.length; v++) sum[map[v]] += d[v];
    }
    for (let v = 0; v < vars.length; v++) if (sum[v] > maxDeg[v]) maxDeg[v] = sum[v];
    expected += x.coefs.length * y.coefs.length;
  }
  const layout = makeLayout(vars, maxDeg);
  if (!layout.packed) return null;
  const table = new TermTable(Math.min(expected, 1 << 16));
  for (const [x, y] of pairs) {
    const fa = smallCoefficients(x.coefs);
    const fb = fa && smallCoefficients(y.coefs);
    if (!fa || !fb) return null;
    if (!addProducts(table, keysIn(x, layout) as number[], fa, keysIn(y, layout) as number[], fb)) return null;
  }
  const r = table.result();
  return fieldsFromKeys(layout, r.keys, r.coefs, den);
}

/** Product terms accumulated in doubles; null when a coefficient leaves the safe-integer range. */
function mulSmall(ka: number[], ca: readonly bigint[], kb: number[], cb: readonly bigint[]): { keys: Float64Array; coefs: Float64Array } | null {
  const fa = smallCoefficients(ca);
  const fb = fa && smallCoefficients(cb);
  if (!fa || !fb) return null;
  const table = new TermTable(Math.min(ka.length * kb.length, 1 << 16));
  return addProducts(table, ka, fa, kb, fb) ? table.result() : null;
}

/** Adds the product of two polynomials' packed terms into the table; false once a coefficient leaves doubles. */
function addProducts(table: TermTable, ka: number[], fa: Float64Array, kb: number[], fb: Float64Array): boolean {
  for (let i = 0; i < ka.length; i++) {
    const ki = ka[i];
    const ci = fa[i];
    for (let j = 0; j < kb.length; j++) table.addProduct(ki + kb[j], ci, fb[j]);
    if (table.overflow) return false;
  }
  return true;
}

/** p times a one-term polynomial m: exponents shift, the graded order is unchanged. */
export function mulByTerm(p: Poly, m: Poly): PolyFields {
  const vars = unionVars(p.vars, m.vars);
  const nv = vars.length;
  const np = p.vars.length;
  const map = varMap(p.vars, vars);
  const mm = varMap(m.vars, vars);
  const shift = new Int32Array(nv);
  for (let v = 0; v < m.vars.length; v++) shift[mm[v]] = m.exps[v];
  const n = p.coefs.length;
  const exps = new Uint16Array(n * nv);
  const pd = p.degrees();
  for (let v = 0; v < np; v++) if (pd[v] + shift[map[v]] > MAX_EXPONENT) throw new RangeError(`exponent above ${MAX_EXPONENT}`);
  for (let t = 0; t < n; t++) {
    const o = t * nv;
    for (let v = 0; v < nv; v++) exps[o + v] = shift[v];
    for (let v = 0; v < np; v++) exps[o + map[v]] += p.exps[t * np + v];
  }
  const c = m.coefs[0];
  // Coefficient arrays are never mutated once in a Poly, so an unchanged one is shared.
  const shared = c === 1n && m.den === 1n;
  const coefs = shared ? (p.coefs as bigint[]) : p.coefs.map((x) => x * c);
  const den = shared ? p.den : normalizeDen(coefs, p.den * m.den);
  // Carry the degree caches over (the low degrees only when already known: computing them costs a pass).
  const pl = p.knownLowDegrees();
  const deg = Int32Array.from(shift);
  const low = pl ? Int32Array.from(shift) : undefined;
  for (let v = 0; v < np; v++) {
    deg[map[v]] += pd[v];
    if (low) low[map[v]] += pl![v];
  }
  return { vars, exps, coefs, den, degrees: deg, lowDegrees: low };
}

/** a + b, or a - b when subtract; both nonzero. */
export function addScaled(a: Poly, b: Poly, subtract: boolean): PolyFields {
  const vars = unionVars(a.vars, b.vars);
  const nv = vars.length;
  const maxDeg = new Int32Array(nv);
  const da = a.degrees();
  const db = b.degrees();
  const ma = varMap(a.vars, vars);
  const mb = varMap(b.vars, vars);
  for (let v = 0; v < a.vars.length; v++) maxDeg[ma[v]] = da[v];
  for (let v = 0; v < b.vars.length; v++) if (db[v] > maxDeg[mb[v]]) maxDeg[mb[v]] = db[v];
  const layout = makeLayout(vars, maxDeg);
  const den = a.den === b.den ? a.den : bigLcm(a.den, b.den);
  const sa = den / a.den;
  const sb = subtract ? -(den / b.den) : den / b.den;
  let maxTot = 0;
  for (let v = 0; v < nv; v++) maxTot += maxDeg[v];
  if (layout.totalBits + bitLength(maxTot) <= 53) return mergeSorted(a, b, vars, layout, ma, mb, sa, sb, den);
  const ka = keysIn(a, layout);
  const kb = keysIn(b, layout);
  const index = new Map<Key, number>();
  const keys: Key[] = ka.slice();
  const coefs: bigint[] = sa === 1n ? a.coefs.slice() : a.coefs.map((c) => c * sa);
  for (let i = 0; i < ka.length; i++) index.set(ka[i], i);
  for (let j = 0; j < kb.length; j++) {
    const c = sb === 1n ? b.coefs[j] : b.coefs[j] * sb;
    const at = index.get(kb[j]);
    if (at === undefined) {
      keys.push(kb[j]);
      coefs.push(c);
    } else coefs[at] += c;
  }
  return fieldsFromKeys(layout, keys, coefs, den);
}

/** Graded keys (total degree on top) of p's terms in a layout over a superset of its variables: descending, like p's terms. */
function gradedKeysIn(p: Poly, layout: Layout, map: Int32Array): Float64Array {
  return gradedKeys(p.exps, p.coefs.length, p.vars.length, Float64Array.from(map, (j) => layout.mult[j]), layout.totalBits);
}

/** a*sa + b*sb over den by merging the two canonical term sequences: no hashing, no sort. */
function mergeSorted(
  a: Poly, b: Poly, vars: readonly string[], layout: Layout, ma: Int32Array, mb: Int32Array, sa: bigint, sb: bigint, den: bigint,
): PolyFields {
  const nv = vars.length;
  const na = a.coefs.length;
  const nb = b.coefs.length;
  const ka = gradedKeysIn(a, layout, ma);
  const kb = gradedKeysIn(b, layout, mb);
  const nva = a.vars.length;
  const nvb = b.vars.length;
  const exps = new Uint16Array((na + nb) * nv);
  const coefs: bigint[] = [];
  let i = 0;
  let j = 0;
  let t = 0;
  while (i < na || j < nb) {
    let c: bigint;
    let from: Poly;
    let row: number;
    if (j >= nb || (i < na && ka[i] > kb[j])) {
      c = sa === 1n ? a.coefs[i] : a.coefs[i] * sa;
      from = a;
      row = i++;
    } else if (i >= na || kb[j] > ka[i]) {
      c = sb === 1n ? b.coefs[j] : b.coefs[j] * sb;
      from = b;
      row = j++;
    } else {
      c = (sa === 1n ? a.coefs[i] : a.coefs[i] * sa) + (sb === 1n ? b.coefs[j] : b.coefs[j] * sb);
      from = a;
      row = i++;
      j++;
    }
    if (c === 0n) continue;
    const o = t * nv;
    if (from === a) for (let v = 0; v < nva; v++) exps[o + ma[v]] = a.exps[row * nva + v];
    else for (let v = 0; v < nvb; v++) exps[o + mb[v]] = b.exps[row * nvb + v];
    coefs.push(c);
    t++;
  }
  if (t === 0) return ZERO_FIELDS;
  const out = exps.subarray(0, t * nv);
  // Cancellation may remove a variable entirely; the general builder drops its column.
  const deg = new Int32Array(nv);
  for (let r = 0, o = 0; r < t; r++, o += nv) for (let v = 0; v < nv; v++) if (out[o + v] > deg[v]) deg[v] = out[o + v];
  if (!deg.every((d) => d > 0)) return canonicalFields(vars, out, coefs, den);
  return { vars, exps: out.slice(), coefs, den: normalizeDen(coefs, den), degrees: deg };
}
