// Sparse multivariate polynomials over Q in named variables.
//
// Representation: a sorted list of the variables that occur, an exponent matrix (one row
// per term) and integer coefficient numerators over one positive common denominator.
// Terms are kept in canonical order: graded lexicographic, descending, with the variables
// in canonical name order (the first name is the most significant), so equal polynomials
// have identical representations and print identically.
//
// Arithmetic runs on packed monomial keys (monomial-layout.ts) in the kernels of
// polynomial-arithmetic.ts; results are put in canonical form by polynomial-build.ts.
// Calculus and printing are in polynomial-calculus.ts and polynomial-print.ts.

import { Rational, bigGcd } from "./rational";
import { sortNames } from "./names";
import { MAX_EXPONENT } from "./monomial-layout";
import { RationalTermSum, canonicalFields, normalizeDen, type PolyFields } from "./polynomial-build";
import { addScaled, mulByTerm, mulSparse, sumOfProductsPacked } from "./polynomial-arithmetic";
import { derivativeFields, evaluatePoly, substitutedFields } from "./polynomial-calculus";
import { polyInfix, polyTex } from "./polynomial-print";

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

  /** The polynomial with the given canonical fields (what the builders in polynomial-build.ts return). */
  static fromFields(f: PolyFields): Poly {
    return f.coefs.length === 0 ? Poly.ZERO : new Poly(f.vars, f.exps, f.coefs, f.den, f.degrees, f.lowDegrees);
  }

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
    const sum = new RationalTermSum();
    for (const t of terms) {
      const e = new Array<number>(nv).fill(0);
      for (const [v, k] of Object.entries(t.monomial)) {
        if (!Number.isInteger(k) || k < 0 || k > MAX_EXPONENT) throw new RangeError(`bad exponent ${k} for ${v}`);
        if (k !== 0) e[pos.get(v)!] = k;
      }
      sum.add(e, t.coefficient instanceof Rational ? t.coefficient : Rational.of(t.coefficient));
    }
    return Poly.fromFields(sum.fields(vars));
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
    return Poly.fromFields(canonicalFields(this.vars, exps, coefs, this.den));
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
    return exps.map((e, k) => Poly.fromFields(canonicalFields(this.vars, e, coefs[k], this.den)));
  }

  // ---- arithmetic --------------------------------------------------------------------

  add(o: Poly): Poly {
    if (o.coefs.length === 0) return this;
    if (this.coefs.length === 0) return o;
    return Poly.fromFields(addScaled(this, o, false));
  }

  sub(o: Poly): Poly {
    if (o.coefs.length === 0) return this;
    if (this.coefs.length === 0) return o.neg();
    return Poly.fromFields(addScaled(this, o, true));
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
    if (o.coefs.length === 1) return Poly.fromFields(mulByTerm(this, o));
    if (this.coefs.length === 1) return Poly.fromFields(mulByTerm(o, this));
    return Poly.fromFields(mulSparse(this, o));
  }

  /** Σ x_k·y_k, in one pass where the terms allow: what cancels between the products costs no decoding. */
  static sumOfProducts(pairs: ReadonlyArray<readonly [Poly, Poly]>): Poly {
    const live = pairs.filter(([x, y]) => x.coefs.length > 0 && y.coefs.length > 0);
    if (live.length === 0) return Poly.ZERO;
    const packed = live.length > 1 ? sumOfProductsPacked(live) : null;
    if (packed) return Poly.fromFields(packed);
    return live.reduce((sum, [x, y]) => sum.add(x.mul(y)), Poly.ZERO);
  }

  pow(n: number): Poly {
    if (!Number.isInteger(n) || n < 0) throw new RangeError("Poly.pow needs a non-negative integer");
    // Square and multiply, from the exponent's highest bit down.
    let result: Poly = Poly.ONE;
    for (let bit = 31 - Math.clz32(n); bit >= 0; bit--) {
      result = result.mul(result);
      if ((n >> bit) & 1) result = result.mul(this);
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

  // ---- calculus (polynomial-calculus.ts) ---------------------------------------------

  derivative(v: string): Poly {
    return Poly.fromFields(derivativeFields(this, v));
  }

  /** Replace the given variables by exact values; the others stay symbolic. */
  substitute(values: Record<string, Rational>): Poly {
    if (!this.vars.some((v) => Object.prototype.hasOwnProperty.call(values, v))) return this;
    return Poly.fromFields(substitutedFields(this, values));
  }

  /** Floating-point value; every variable must be given. */
  evaluate(values: Record<string, number>): number {
    return evaluatePoly(this, values).value;
  }

  /** Floating-point value with a bound on its rounding error (see evaluatePoly). */
  evaluateWithError(values: Record<string, number>): { value: number; error: number } {
    return evaluatePoly(this, values);
  }

  // ---- content -----------------------------------------------------------------------

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

  // ---- printing (polynomial-print.ts) ------------------------------------------------

  private infixCache: string | undefined;
  private texCache: string | undefined;

  /** Plain infix, printed once (see polyInfix). */
  toInfix(): string {
    return (this.infixCache ??= polyInfix(this));
  }

  /** TeX, printed once (see polyTex). */
  toTex(): string {
    return (this.texCache ??= polyTex(this));
  }

  toString(): string {
    return this.toInfix();
  }
}
