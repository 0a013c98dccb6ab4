// Sparse multivariate polynomials over Q in named variables.
//
// Representation: a sorted list of the variables that occur, an exponent matrix (one row
// per term) and integer coefficient numerators over one positive common denominator.
// Terms are kept in canonical order: graded lexicographic, descending, with the variables
// in canonical name order (the first name is the most significant), so equal polynomials
// have identical representations and print identically.
//
// Arithmetic runs on packed monomial keys (exponent fields of a per-operation width laid
// side by side in one integer), so multiplying monomials is adding keys. Keys fit in a
// double up to 53 bits and fall back to BigInt keys beyond.

import { Rational, bigGcd, bigLcm } from "./rational";
import { compareNames, sortNames, texName } from "./names";
import { TermTable, smallCoefficients } from "./term-table";

export type Key = number | bigint;

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
}

export const MAX_EXPONENT = 0xffff;

function bitLength(n: number): number {
  return n <= 0 ? 1 : 32 - Math.clz32(n);
}

export function makeLayout(vars: readonly string[], maxDeg: ArrayLike<number>): Layout {
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
  return { vars, bits, mult, multBig, totalBits: total, packed: total <= 53 };
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

function normalizeDen(coefs: bigint[], den: bigint): bigint {
  if (den === 1n) return den;
  let g = den;
  for (let i = 0; i < coefs.length && g !== 1n; i++) g = bigGcd(g, coefs[i]);
  if (g !== 1n) {
    for (let i = 0; i < coefs.length; i++) coefs[i] /= g;
    return den / g;
  }
  return den;
}

export class Poly {
  /** @internal Sorted names of the variables that occur. */
  readonly vars: readonly string[];
  /** @internal Exponents, term-major: exps[t * vars.length + v]. */
  readonly exps: Uint16Array;
  /** @internal Integer coefficient numerators, in canonical term order. */
  readonly coefs: readonly bigint[];
  /** @internal Positive common denominator, coprime to the coefficients. */
  readonly den: bigint;

  /** @internal Use the static constructors; this one trusts its arguments to be canonical. */
  constructor(vars: readonly string[], exps: Uint16Array, coefs: readonly bigint[], den: bigint, degrees?: Int32Array, lowDegrees?: Int32Array) {
    this.vars = vars;
    this.exps = exps;
    this.coefs = coefs;
    this.den = den;
    // Degrees known to the constructing operation save a pass over the terms later.
    this.degreeCache = degrees;
    this.lowDegreeCache = lowDegrees;
  }

  private static readonly ZERO = new Poly([], new Uint16Array(0), [], 1n);
  private static readonly ONE = new Poly([], new Uint16Array(0), [1n], 1n);

  static zero(): Poly {
    return Poly.ZERO;
  }

  static one(): Poly {
    return Poly.ONE;
  }

  static constant(c: Rational | bigint | number): Poly {
    const r = c instanceof Rational ? c : Rational.of(c);
    if (r.isZero()) return Poly.ZERO;
    if (r.isOne()) return Poly.ONE;
    return new Poly([], new Uint16Array(0), [r.num], r.den);
  }

  static variable(name: string): Poly {
    if (!name) throw new Error("empty variable name");
    return new Poly([name], Uint16Array.of(1), [1n], 1n);
  }

  static monomial(c: Rational | bigint | number, powers: Record<string, number>): Poly {
    return Poly.fromTerms([{ coefficient: c, monomial: powers }]);
  }

  /** Sum of terms; repeated monomials are combined. */
  static fromTerms(terms: ReadonlyArray<{ coefficient: Rational | bigint | number; monomial: Record<string, number> }>): Poly {
    const vars = sortNames(terms.flatMap((t) => Object.keys(t.monomial).filter((v) => t.monomial[v] !== 0)));
    const nv = vars.length;
    const pos = new Map(vars.map((v, i) => [v, i]));
    const index = new Map<string, number>();
    const exps: number[] = [];
    const coefs: Rational[] = [];
    for (const t of terms) {
      const e = new Array<number>(nv).fill(0);
      for (const [v, k] of Object.entries(t.monomial)) {
        if (!Number.isInteger(k) || k < 0 || k > MAX_EXPONENT) throw new RangeError(`bad exponent ${k} for ${v}`);
        if (k !== 0) e[pos.get(v)!] = k;
      }
      const key = e.join(",");
      const c = t.coefficient instanceof Rational ? t.coefficient : Rational.of(t.coefficient);
      const at = index.get(key);
      if (at === undefined) {
        index.set(key, coefs.length);
        exps.push(...e);
        coefs.push(c);
      } else coefs[at] = coefs[at].add(c);
    }
    return fromRationalCoefs(vars, exps, coefs);
  }

  // ---- structure ---------------------------------------------------------------------

  isZero(): boolean {
    return this.coefs.length === 0;
  }

  isConstant(): boolean {
    return this.vars.length === 0;
  }

  constantValue(): Rational | null {
    if (this.vars.length > 0) return null;
    return this.coefs.length === 0 ? Rational.ZERO : Rational.of(this.coefs[0], this.den);
  }

  isOne(): boolean {
    return this.vars.length === 0 && this.coefs.length === 1 && this.coefs[0] === 1n && this.den === 1n;
  }

  variables(): string[] {
    return this.vars.slice();
  }

  termCount(): number {
    return this.coefs.length;
  }

  /** Coefficient of term i (canonical order) as a rational. */
  coefficientAt(i: number): Rational {
    return Rational.of(this.coefs[i], this.den);
  }

  /** Exponents of term i as a record over the variables that occur in it. */
  monomialAt(i: number): Record<string, number> {
    const nv = this.vars.length;
    const out: Record<string, number> = {};
    for (let v = 0; v < nv; v++) {
      const e = this.exps[i * nv + v];
      if (e !== 0) out[this.vars[v]] = e;
    }
    return out;
  }

  terms(): Array<{ coefficient: Rational; monomial: Record<string, number> }> {
    return this.coefs.map((_, i) => ({ coefficient: this.coefficientAt(i), monomial: this.monomialAt(i) }));
  }

  /** Leading coefficient in canonical order (zero for the zero polynomial). */
  leadingCoefficient(): Rational {
    return this.coefs.length === 0 ? Rational.ZERO : this.coefficientAt(0);
  }

  totalDegree(): number {
    if (this.coefs.length === 0) return -Infinity;
    const nv = this.vars.length;
    let d = 0;
    for (let v = 0; v < nv; v++) d += this.exps[v];
    return d; // the first term has the highest total degree in graded order
  }

  degreeIn(v: string): number {
    if (this.coefs.length === 0) return -Infinity;
    const j = this.vars.indexOf(v);
    return j < 0 ? 0 : this.degrees()[j];
  }

  /** Lowest exponent of v over the terms; +Infinity for the zero polynomial. */
  lowDegreeIn(v: string): number {
    if (this.coefs.length === 0) return Infinity;
    const j = this.vars.indexOf(v);
    return j < 0 ? 0 : this.lowDegrees()[j];
  }

  private degreeCache: Int32Array | undefined;
  private lowDegreeCache: Int32Array | undefined;

  /** @internal Degree of each variable (in vars order); computed once, do not modify. */
  degrees(): Int32Array {
    return (this.degreeCache ??= this.computeDegrees());
  }

  /** @internal Lowest exponent of each variable (in vars order); computed once, do not modify. */
  lowDegrees(): Int32Array {
    return (this.lowDegreeCache ??= this.computeLowDegrees());
  }

  /** @internal The low degrees if already computed. */
  knownLowDegrees(): Int32Array | undefined {
    return this.lowDegreeCache;
  }

  private computeDegrees(): Int32Array {
    const nv = this.vars.length;
    const d = new Int32Array(nv);
    const e = this.exps;
    for (let t = 0, o = 0; t < this.coefs.length; t++, o += nv) {
      for (let v = 0; v < nv; v++) if (e[o + v] > d[v]) d[v] = e[o + v];
    }
    return d;
  }

  private computeLowDegrees(): Int32Array {
    const nv = this.vars.length;
    const d = new Int32Array(nv).fill(MAX_EXPONENT);
    const e = this.exps;
    for (let t = 0, o = 0; t < this.coefs.length; t++, o += nv) {
      for (let v = 0; v < nv; v++) if (e[o + v] < d[v]) d[v] = e[o + v];
    }
    if (this.coefs.length === 0) d.fill(0);
    return d;
  }

  coefficientIn(v: string, k: number): Poly {
    const j = this.vars.indexOf(v);
    if (j < 0) return k === 0 ? this : Poly.ZERO;
    const nv = this.vars.length;
    const exps: number[] = [];
    const coefs: bigint[] = [];
    for (let t = 0; t < this.coefs.length; t++) {
      if (this.exps[t * nv + j] !== k) continue;
      for (let u = 0; u < nv; u++) exps.push(u === j ? 0 : this.exps[t * nv + u]);
      coefs.push(this.coefs[t]);
    }
    return buildPoly(this.vars, exps, coefs, this.den);
  }

  /** Coefficients of v^0 .. v^deg as polynomials in the other variables. */
  coefficientsIn(v: string): Poly[] {
    const j = this.vars.indexOf(v);
    if (j < 0) return [this];
    const deg = this.degreeIn(v);
    const nv = this.vars.length;
    const exps: number[][] = Array.from({ length: deg + 1 }, () => []);
    const coefs: bigint[][] = Array.from({ length: deg + 1 }, () => []);
    for (let t = 0; t < this.coefs.length; t++) {
      const k = this.exps[t * nv + j];
      for (let u = 0; u < nv; u++) exps[k].push(u === j ? 0 : this.exps[t * nv + u]);
      coefs[k].push(this.coefs[t]);
    }
    return exps.map((e, k) => buildPoly(this.vars, e, coefs[k], this.den));
  }

  // ---- arithmetic --------------------------------------------------------------------

  add(o: Poly): Poly {
    if (o.coefs.length === 0) return this;
    if (this.coefs.length === 0) return o;
    return addScaled(this, o, false);
  }

  sub(o: Poly): Poly {
    if (o.coefs.length === 0) return this;
    if (this.coefs.length === 0) return o.neg();
    return addScaled(this, o, true);
  }

  neg(): Poly {
    if (this.coefs.length === 0) return this;
    return new Poly(this.vars, this.exps, this.coefs.map((c) => -c), this.den, this.degreeCache, this.lowDegreeCache);
  }

  scale(c: Rational): Poly {
    if (c.isZero() || this.coefs.length === 0) return Poly.ZERO;
    if (c.isOne()) return this;
    const coefs = this.coefs.map((x) => x * c.num);
    const den = normalizeDen(coefs, this.den * c.den);
    return new Poly(this.vars, this.exps, coefs, den, this.degreeCache, this.lowDegreeCache);
  }

  mul(o: Poly): Poly {
    if (this.coefs.length === 0 || o.coefs.length === 0) return Poly.ZERO;
    if (o.vars.length === 0) return this.scale(Rational.of(o.coefs[0], o.den));
    if (this.vars.length === 0) return o.scale(Rational.of(this.coefs[0], this.den));
    if (o.coefs.length === 1) return mulByTerm(this, o);
    if (this.coefs.length === 1) return mulByTerm(o, this);
    const [a, b] = this.coefs.length <= o.coefs.length ? [this, o] : [o, this];
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
      if (fast) return fromKeys(layout, fast.keys, fast.coefs, a.den * b.den);
    }
    const index = new Map<Key, number>();
    const keys: Key[] = [];
    const coefs: bigint[] = [];
    const ca = a.coefs;
    const cb = b.coefs;
    for (let i = 0; i < ca.length; i++) {
      const ki: any = ka[i];
      const ci = ca[i];
      for (let j = 0; j < cb.length; j++) {
        const k: Key = ki + (kb[j] as any);
        const at = index.get(k);
        if (at === undefined) {
          index.set(k, keys.length);
          keys.push(k);
          coefs.push(ci * cb[j]);
        } else coefs[at] += ci * cb[j];
      }
    }
    return fromKeys(layout, keys, coefs, a.den * b.den);
  }

  pow(n: number): Poly {
    if (!Number.isInteger(n) || n < 0) throw new RangeError("Poly.pow needs a non-negative integer");
    let result: Poly = Poly.ONE;
    let base: Poly = this;
    while (n > 0) {
      if (n & 1) result = result.mul(base);
      n >>= 1;
      if (n > 0) base = base.mul(base);
    }
    return result;
  }

  equals(o: Poly): boolean {
    if (this === o) return true;
    if (this.coefs.length !== o.coefs.length || this.den !== o.den || this.vars.length !== o.vars.length) return false;
    for (let i = 0; i < this.vars.length; i++) if (this.vars[i] !== o.vars[i]) return false;
    for (let i = 0; i < this.coefs.length; i++) if (this.coefs[i] !== o.coefs[i]) return false;
    const e = this.exps;
    const f = o.exps;
    for (let i = 0; i < e.length; i++) if (e[i] !== f[i]) return false;
    return true;
  }

  derivative(v: string): Poly {
    const j = this.vars.indexOf(v);
    if (j < 0) return Poly.ZERO;
    const nv = this.vars.length;
    const exps: number[] = [];
    const coefs: bigint[] = [];
    for (let t = 0; t < this.coefs.length; t++) {
      const k = this.exps[t * nv + j];
      if (k === 0) continue;
      for (let u = 0; u < nv; u++) exps.push(u === j ? k - 1 : this.exps[t * nv + u]);
      coefs.push(this.coefs[t] * BigInt(k));
    }
    return buildPoly(this.vars, exps, coefs, this.den);
  }

  /** Replace the given variables by exact values; the others stay symbolic. */
  substitute(values: Record<string, Rational>): Poly {
    const nv = this.vars.length;
    const sub = this.vars.map((v) => (Object.prototype.hasOwnProperty.call(values, v) ? values[v] : undefined));
    if (sub.every((s) => s === undefined)) return this;
    const degs = this.degrees();
    // Powers of each substituted value, as numerator/denominator BigInts.
    const powers = sub.map((s, v) => {
      if (s === undefined) return null;
      const p: Rational[] = [Rational.ONE];
      for (let k = 1; k <= degs[v]; k++) p.push(p[k - 1].mul(s));
      return p;
    });
    const index = new Map<string, number>();
    const exps: number[] = [];
    const coefs: Rational[] = [];
    const e = new Array<number>(nv);
    for (let t = 0; t < this.coefs.length; t++) {
      let c = Rational.of(this.coefs[t], this.den);
      for (let v = 0; v < nv; v++) {
        const k = this.exps[t * nv + v];
        const p = powers[v];
        if (p) {
          e[v] = 0;
          if (k > 0) c = c.mul(p[k]);
        } else e[v] = k;
      }
      if (c.isZero()) continue;
      const key = e.join(",");
      const at = index.get(key);
      if (at === undefined) {
        index.set(key, coefs.length);
        exps.push(...e);
        coefs.push(c);
      } else coefs[at] = coefs[at].add(c);
    }
    return fromRationalCoefs(this.vars, exps, coefs);
  }

  /** Floating-point value; every variable must be given. */
  evaluate(values: Record<string, number>): number {
    const nv = this.vars.length;
    const x = this.vars.map((v) => {
      const val = values[v];
      if (typeof val !== "number") throw new Error(`no value for ${v}`);
      return val;
    });
    const den = Number(this.den);
    let sum = 0;
    for (let t = 0; t < this.coefs.length; t++) {
      let m = Number(this.coefs[t]);
      for (let v = 0; v < nv; v++) {
        const k = this.exps[t * nv + v];
        if (k === 1) m *= x[v];
        else if (k > 1) m *= x[v] ** k;
      }
      sum += m;
    }
    return Number.isFinite(den) ? sum / den : Rational.of(1n, this.den).toNumber() * sum;
  }

  /** Positive rational content: p = content * (primitive polynomial with integer coefficients). */
  content(): Rational {
    if (this.coefs.length === 0) return Rational.ZERO;
    let g = 0n;
    for (const c of this.coefs) {
      g = bigGcd(g, c);
      if (g === 1n) break;
    }
    return Rational.of(g, this.den);
  }

  /** Integer coefficients with gcd 1 and a positive leading coefficient (the zero polynomial stays zero). */
  primitivePart(): Poly {
    if (this.coefs.length === 0) return this;
    const c = this.content();
    return this.scale(this.coefs[0] < 0n ? c.inverse().neg() : c.inverse());
  }

  /** Largest monomial dividing every term, as exponents in vars order. @internal */
  monomialContentExps(): Int32Array {
    return this.lowDegrees();
  }

  /** Largest monomial dividing every term (1 for zero). */
  monomialContent(): Poly {
    const low = this.lowDegrees();
    const m: Record<string, number> = {};
    this.vars.forEach((v, i) => {
      if (low[i] > 0) m[v] = low[i];
    });
    return Poly.monomial(1, m);
  }

  /** Divide every term by the monomial with the given exponents (which must divide each term). */
  divideByMonomial(powers: Record<string, number>): Poly {
    const nv = this.vars.length;
    const sub = this.vars.map((v) => powers[v] ?? 0);
    for (const v of Object.keys(powers)) {
      if (powers[v] > 0 && !this.vars.includes(v) && this.coefs.length > 0) throw new Error(`monomial does not divide: ${v}`);
    }
    if (sub.every((s) => s === 0)) return this;
    const n = this.coefs.length;
    const e = this.exps;
    const low = this.lowDegrees();
    for (let v = 0; v < nv; v++) if (sub[v] > low[v]) throw new Error("monomial does not divide");
    // Dividing by a monomial keeps the graded order; only columns that become zero are dropped.
    const deg = this.degrees();
    const keepList: number[] = [];
    for (let v = 0; v < nv; v++) if (deg[v] - sub[v] > 0) keepList.push(v);
    const keep = Int32Array.from(keepList);
    const shift = Int32Array.from(keepList, (v) => sub[v]);
    const nk = keep.length;
    const out = new Uint16Array(n * nk);
    for (let t = 0; t < n; t++) {
      const o = t * nk;
      const i = t * nv;
      for (let j = 0; j < nk; j++) out[o + j] = e[i + keep[j]] - shift[j];
    }
    const degOut = Int32Array.from(keepList, (v) => deg[v] - sub[v]);
    const lowOut = Int32Array.from(keepList, (v) => low[v] - sub[v]);
    return new Poly(nk === nv ? this.vars : keepList.map((v) => this.vars[v]), out, this.coefs, this.den, degOut, lowOut);
  }

  // ---- printing ----------------------------------------------------------------------

  private infixCache: string | undefined;
  private texCache: string | undefined;

  /** Plain infix, e.g. "R0*mu + R0 - 2*gm^2"; sympy-parsable once ^ is read as power. */
  toInfix(): string {
    return (this.infixCache ??= this.print(this.vars, "*", (name, k) => `${name}^${k}`, (n, d) => `${n}/${d}`, false));
  }

  /** TeX, e.g. "R_{0}\\,\\mu + R_{0}"; a thin space keeps multi-letter symbols apart (Rs\\,s, not Rss). */
  toTex(): string {
    return (this.texCache ??= this.print(this.vars.map(texName), "\\,", (name, k) => `${name}^{${k}}`, (n, d) => `\\frac{${n}}{${d}}`, true));
  }

  /**
   * Terms joined by " + " / " - ". A coefficient n/d prints as "n*m/d" in infix (so "x/2") and
   * as "\\frac{n}{d} m" in TeX.
   */
  private print(
    names: readonly string[], times: string, power: (name: string, k: number) => string, fraction: (n: string, d: string) => string, tex: boolean,
  ): string {
    const n = this.coefs.length;
    if (n === 0) return "0";
    const nv = this.vars.length;
    const e = this.exps;
    // One flat list of pieces joined once: variable names are reused strings, so a multilinear
    // term allocates nothing but its coefficient.
    const chunks: string[] = [];
    let pieces: string[] = [];
    for (let t = 0; t < n; t++) {
      // Joining in chunks of about a thousand pieces is markedly faster than one huge join.
      if (pieces.length > 1024) {
        chunks.push(pieces.join(""));
        pieces = [];
      }
      let num = this.coefs[t];
      let den = this.den;
      if (den !== 1n) {
        const g = bigGcd(num, den);
        if (g !== 1n) {
          num /= g;
          den /= g;
        }
      }
      const neg = num < 0n;
      const absNum = neg ? -num : num;
      if (t > 0) pieces.push(neg ? " - " : " + ");
      else if (neg) pieces.push("-");
      const o = t * nv;
      let first = true;
      let hasMono = false;
      for (let v = 0; v < nv; v++) if (e[o + v] !== 0) hasMono = true;
      if (!hasMono) {
        pieces.push(den === 1n ? absNum.toString() : fraction(absNum.toString(), den.toString()));
        continue;
      }
      if (tex && den !== 1n) {
        pieces.push(fraction(absNum.toString(), den.toString()), "\\,");
      } else if (absNum !== 1n) {
        pieces.push(absNum.toString(), times);
      }
      for (let v = 0; v < nv; v++) {
        const k = e[o + v];
        if (k === 0) continue;
        if (!first) pieces.push(times);
        pieces.push(k === 1 ? names[v] : power(names[v], k));
        first = false;
      }
      if (!tex && den !== 1n) pieces.push("/", den.toString());
    }
    chunks.push(pieces.join(""));
    return chunks.join("");
  }

  toString(): string {
    return this.toInfix();
  }
}

// ---- construction helpers (module-internal, shared with the other algebra modules) ----

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
    for (let t = 0, o = 0; t < n; t++, o += nv) {
      let k = 0;
      for (let v = 0; v < nv; v++) k += e[o + v] * mult[v];
      keys[t] = k;
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

/** Product terms accumulated in doubles; null when a coefficient leaves the safe-integer range. */
function mulSmall(ka: number[], ca: readonly bigint[], kb: number[], cb: readonly bigint[]): { keys: Float64Array; coefs: Float64Array } | null {
  const fa = smallCoefficients(ca);
  const fb = fa && smallCoefficients(cb);
  if (!fa || !fb) return null;
  const table = new TermTable(Math.min(ka.length * kb.length, 1 << 16));
  for (let i = 0; i < ka.length; i++) {
    const ki = ka[i];
    const ci = fa[i];
    for (let j = 0; j < kb.length; j++) table.addProduct(ki + kb[j], ci, fb[j]);
    if (table.overflow) return null;
  }
  return table.result();
}

/** p times a one-term polynomial m: exponents shift, the graded order is unchanged. */
function mulByTerm(p: Poly, m: Poly): Poly {
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
  return new Poly(vars, exps, coefs, den, deg, low);
}

/** Build a polynomial from packed keys (distinct) and integer coefficients (BigInt, or safe integers in doubles) over den. */
export function fromKeys(layout: Layout, keys: ArrayLike<Key>, coefs: ArrayLike<bigint> | Float64Array, den: bigint): Poly {
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
      for (let v = 0; v < nv; v++) {
        const off = dec.off[v];
        exps[o + v] = (off >= 32 ? hi >>> (off - 32) : off + dec.bits[v] <= 32 ? lo >>> off : (lo >>> off) | (hi << (32 - off))) & dec.mask[v];
      }
    }
  } else {
    const masks = layout.bits.map((b) => (1n << BigInt(b)) - 1n);
    const shifts = layout.multBig.map((mb) => BigInt(mb.toString(2).length - 1));
    for (let t = 0; t < n; t++) {
      const k = keys[keep[t]] as bigint;
      for (let v = 0; v < nv; v++) exps[t * nv + v] = Number((k >> shifts[v]) & masks[v]);
    }
  }
  if (coefs instanceof Float64Array) for (let t = 0; t < n; t++) cs.push(BigInt(coefs[keep[t]]));
  else for (let t = 0; t < n; t++) cs.push(coefs[keep[t]]);
  return buildPoly(layout.vars, exps, cs, den);
}

/** A monomial by its variables: coefficient and (variable number, exponent) pairs, variables distinct, in any order. */
export interface SparseMonomial {
  coef: Rational;
  factors: number[];
}

/**
 * The sum of many monomials (repeats allowed) over the variables names (numbered by position),
 * in one pass: rows written once, repeats found by a hash of each monomial's pairs, one sort.
 * Linear in the terms written plus the sort, where adding them one polynomial at a time costs
 * n log n polynomial additions.
 */
export function polyFromMonomials(names: readonly string[], terms: readonly SparseMonomial[]): Poly {
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
  return fromRationalCoefs(vars, n * nv === exps.length ? exps : exps.slice(0, n * nv), coefs);
}

function fromRationalCoefs(vars: readonly string[], exps: ArrayLike<number>, coefs: Rational[]): Poly {
  let den = 1n;
  for (const c of coefs) if (c.den !== 1n) den = bigLcm(den, c.den);
  const ints = coefs.map((c) => (c.den === den ? c.num : c.num * (den / c.den)));
  return buildPoly(vars, exps, ints, den);
}

/**
 * Canonical polynomial from distinct monomials: drops zero terms and unused variables,
 * reduces the common denominator and sorts the terms. Takes ownership of coefs.
 */
export function buildPoly(vars: readonly string[], exps: ArrayLike<number>, coefs: bigint[], den: bigint): Poly {
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
  if (n === 0) return Poly.zero();
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
  return sortTerms(outVars, ex, coefs, den, maxDeg.subarray(0, nv));
}

/** Canonical order for distinct terms with no zero coefficient; maxDeg is each variable's degree (all > 0). */
export function sortTerms(vars: readonly string[], e: Uint16Array, coefs: bigint[], den: bigint, maxDeg: ArrayLike<number>): Poly {
  const nv = vars.length;
  const n = coefs.length;
  const degrees = Int32Array.from(maxDeg);
  if (n <= 1) return new Poly(vars, e, coefs, den, degrees);
  let maxTot = 0;
  for (let v = 0; v < nv; v++) maxTot += maxDeg[v];
  const layout = makeLayout(vars, maxDeg);
  let order: Uint32Array;
  if (layout.totalBits + bitLength(maxTot) <= 53) {
    // Sort key: total degree on top of the packed exponents, so numeric order is graded lex order.
    const sk = new Float64Array(n);
    const top = 2 ** layout.totalBits;
    const mult = layout.mult;
    for (let t = 0, o = 0; t < n; t++, o += nv) {
      let k = 0;
      let d = 0;
      for (let v = 0; v < nv; v++) {
        const x = e[o + v];
        d += x;
        k += x * mult[v];
      }
      sk[t] = d * top + k;
    }
    let sorted = true;
    for (let t = 1; t < n && sorted; t++) if (sk[t] > sk[t - 1]) sorted = false;
    if (sorted) return new Poly(vars, e, coefs, den, degrees);
    order = new Uint32Array(n);
    const idxBits = bitLength(n);
    if (layout.totalBits + bitLength(maxTot) + idxBits <= 53) {
      // Room for the term index below the key: one native numeric sort, indices read back.
      const scale = 2 ** idxBits;
      const packed = new Float64Array(n);
      for (let t = 0; t < n; t++) packed[t] = sk[t] * scale + t;
      packed.sort();
      for (let t = 0; t < n; t++) order[t] = packed[n - 1 - t] % scale;
    } else {
      // Keys are distinct integers: a native numeric sort, then each key finds its term again.
      const where = new Map<number, number>();
      for (let t = 0; t < n; t++) where.set(sk[t], t);
      const asc = sk.slice().sort();
      for (let t = 0; t < n; t++) order[t] = where.get(asc[n - 1 - t])!;
    }
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
  return new Poly(vars, e2, c2, den, degrees);
}

function addScaled(a: Poly, b: Poly, subtract: boolean): Poly {
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
  return fromKeys(layout, keys, coefs, den);
}

/** Graded keys (total degree on top) of p's terms in a layout over a superset of its variables: descending, like p's terms. */
function gradedKeysIn(p: Poly, layout: Layout, map: Int32Array): Float64Array {
  const nv = p.vars.length;
  const n = p.coefs.length;
  const e = p.exps;
  const mult = Float64Array.from(map, (j) => layout.mult[j]);
  const top = 2 ** layout.totalBits;
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

/** a*sa + b*sb over den by merging the two canonical term sequences: no hashing, no sort. */
function mergeSorted(
  a: Poly, b: Poly, vars: readonly string[], layout: Layout, ma: Int32Array, mb: Int32Array, sa: bigint, sb: bigint, den: bigint,
): Poly {
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
  if (t === 0) return Poly.zero();
  const out = exps.subarray(0, t * nv);
  // Cancellation may remove a variable entirely; the general builder drops its column.
  const deg = new Int32Array(nv);
  for (let r = 0, o = 0; r < t; r++, o += nv) for (let v = 0; v < nv; v++) if (out[o + v] > deg[v]) deg[v] = out[o + v];
  if (!deg.every((d) => d > 0)) return buildPoly(vars, out, coefs, den);
  return new Poly(vars, out.slice(), coefs, normalizeDen(coefs, den), deg);
}
