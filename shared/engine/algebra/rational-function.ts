// Rational functions N/D over Q, always in lowest terms with D integer-primitive and a
// positive leading coefficient (D = 1 for polynomials), so equal functions print equally.

import { Rational } from "./rational";
import { Poly } from "./polynomial";
import { unionVars } from "./monomial-layout";
import { polyGcdCofactors } from "./gcd";
import { onceEach } from "./memo";
import { factorCheap, type CheapFactorization } from "./factor";
import { sortNames, texName } from "./names";

/** Sensitivity numerators up to this many terms are still factored by grouping for display. */
const SENSITIVITY_GROUPING_TERMS = 40;

export type Limit =
  | { kind: "finite"; value: RationalFunction }
  | { kind: "infinite"; sign: 1 | -1 | 0 } // 0 = the sign depends on other symbols
  ;

export class RationalFunction {
  readonly num: Poly;
  readonly den: Poly;

  private constructor(num: Poly, den: Poly) {
    this.num = num;
    this.den = den;
  }

  static readonly ZERO = new RationalFunction(Poly.zero(), Poly.one());
  static readonly ONE = new RationalFunction(Poly.one(), Poly.one());

  /** N/D in lowest terms; throws on D = 0. */
  static from(num: Poly, den: Poly = Poly.one()): RationalFunction {
    if (den.isZero()) throw new RangeError("rational function with zero denominator");
    if (num.isZero()) return RationalFunction.ZERO;
    if (den.isConstant()) return new RationalFunction(num.scale(den.constantValue()!.inverse()), Poly.one());
    const { aQuotient, bQuotient } = polyGcdCofactors(num, den);
    return RationalFunction.coprime(aQuotient, bQuotient);
  }

  /** N/D when N and D are already known coprime (only the normalization of D is done). */
  static fromCoprime(num: Poly, den: Poly): RationalFunction {
    if (den.isZero()) throw new RangeError("rational function with zero denominator");
    return RationalFunction.coprime(num, den);
  }

  private static coprime(num: Poly, den: Poly): RationalFunction {
    if (num.isZero()) return RationalFunction.ZERO;
    if (den.isConstant()) return new RationalFunction(num.scale(den.constantValue()!.inverse()), Poly.one());
    // Make D primitive with integer coefficients and a positive leading coefficient.
    const normal = normalDenominator(den);
    if (normal === null) return new RationalFunction(num, den);
    return new RationalFunction(num.scale(normal.inverse), normal.den);
  }

  static constant(c: Rational | bigint | number): RationalFunction {
    return new RationalFunction(Poly.constant(c), Poly.one());
  }

  static variable(name: string): RationalFunction {
    return new RationalFunction(Poly.variable(name), Poly.one());
  }

  static fromPoly(p: Poly): RationalFunction {
    return new RationalFunction(p, Poly.one());
  }

  // ---- arithmetic (Henrici's gcd-sparing formulas) ------------------------------------

  add(o: RationalFunction): RationalFunction {
    if (o.isZero()) return this;
    if (this.isZero()) return o;
    const a = this.num, b = this.den, c = o.num, d = o.den;
    if (b.isOne() && d.isOne()) return new RationalFunction(a.add(c), b);
    if (b.equals(d)) return RationalFunction.from(a.add(c), b);
    const { gcd: g, aQuotient: b1, bQuotient: d1 } = polyGcdCofactors(b, d);
    if (g.isOne()) return RationalFunction.coprime(a.mul(d).add(c.mul(b)), b.mul(d));
    const t = a.mul(d1).add(c.mul(b1));
    if (t.isZero()) return RationalFunction.ZERO;
    const h = polyGcdCofactors(t, g);
    if (h.gcd.isOne()) return RationalFunction.coprime(t, b1.mul(d));
    return RationalFunction.coprime(h.aQuotient, b1.mul(d1).mul(h.bQuotient));
  }

  sub(o: RationalFunction): RationalFunction {
    return this.add(o.neg());
  }

  mul(o: RationalFunction): RationalFunction {
    if (this.isZero() || o.isZero()) return RationalFunction.ZERO;
    const a = this.num, b = this.den, c = o.num, d = o.den;
    if (b.isOne() && d.isOne()) return new RationalFunction(a.mul(c), b);
    const g1 = d.isOne() ? null : polyGcdCofactors(a, d);
    const g2 = b.isOne() ? null : polyGcdCofactors(c, b);
    const n1 = g1 ? g1.aQuotient : a;
    const d2 = g1 ? g1.bQuotient : d;
    const n2 = g2 ? g2.aQuotient : c;
    const d1 = g2 ? g2.bQuotient : b;
    return RationalFunction.coprime(n1.mul(n2), d1.mul(d2));
  }

  div(o: RationalFunction): RationalFunction {
    return this.mul(o.inverse());
  }

  neg(): RationalFunction {
    return new RationalFunction(this.num.neg(), this.den);
  }

  inverse(): RationalFunction {
    if (this.num.isZero()) throw new RangeError("inverse of the zero rational function");
    return RationalFunction.coprime(this.den, this.num);
  }

  pow(n: number): RationalFunction {
    if (!Number.isInteger(n)) throw new RangeError("integer exponent required");
    if (n < 0) return this.inverse().pow(-n);
    return RationalFunction.coprime(this.num.pow(n), this.den.pow(n));
  }

  scale(c: Rational): RationalFunction {
    return c.isZero() ? RationalFunction.ZERO : new RationalFunction(this.num.scale(c), this.den);
  }

  // ---- structure ---------------------------------------------------------------------

  isZero(): boolean {
    return this.num.isZero();
  }

  isPolynomial(): boolean {
    return this.den.isOne();
  }

  equals(o: RationalFunction): boolean {
    return this.num.equals(o.num) && this.den.equals(o.den);
  }

  constantValue(): Rational | null {
    const n = this.num.constantValue();
    const d = this.den.constantValue();
    return n && d ? n.div(d) : null;
  }

  variables(): string[] {
    return unionVars(this.num.vars, this.den.vars);
  }

  // ---- substitution and evaluation ---------------------------------------------------

  /** Replace some variables by exact values; throws RangeError if the denominator vanishes. */
  substitute(values: Record<string, Rational>): RationalFunction {
    return RationalFunction.from(this.num.substitute(values), this.den.substitute(values));
  }

  /** Replace variables by rational functions, exactly; throws RangeError if the denominator vanishes. */
  substituteExpressions(values: Record<string, RationalFunction>): RationalFunction {
    const names = this.variables().filter((v) => Object.prototype.hasOwnProperty.call(values, v));
    if (names.length === 0) return this;
    // Clear denominators: P(n/d) * d^deg(P) is a polynomial; the leftover powers of d are balanced at the end.
    const [n, degN] = composeCleared(this.num, names, values);
    const [d, degD] = composeCleared(this.den, names, values);
    let top = n;
    let bottom = d;
    names.forEach((v, i) => {
      const k = degD[i] - degN[i];
      const dv = values[v].den;
      if (k > 0) top = top.mul(dv.pow(k));
      else if (k < 0) bottom = bottom.mul(dv.pow(-k));
    });
    return RationalFunction.from(top, bottom);
  }

  /** Floating-point value; NaN or Infinity only when the denominator evaluates to 0. */
  evaluate(values: Record<string, number>): number {
    return this.num.evaluate(values) / this.den.evaluate(values);
  }

  // ---- calculus ----------------------------------------------------------------------

  derivative(v: string): RationalFunction {
    const dn = this.num.derivative(v);
    const dd = this.den.derivative(v);
    if (dd.isZero()) return RationalFunction.from(dn, this.den);
    return RationalFunction.from(dn.mul(this.den).sub(this.num.mul(dd)), this.den.mul(this.den));
  }

  /**
   * Normalized sensitivity (v/F) dF/dv = v N'/N - v D'/D; 0 where F is identically 0.
   * From structure: each part is reduced against its own N or D only, and since N and D are
   * coprime the two reduced denominators are too, so their difference is already in lowest terms.
   */
  sensitivity(v: string): RationalFunction {
    if (this.isZero()) return RationalFunction.ZERO;
    const [pn, qn] = logDerivativeTimes(this.num, v);
    const [pd, qd] = logDerivativeTimes(this.den, v);
    // Most symbols leave N and D unreduced: their product is then shared by all of them.
    const unreduced = qn === this.num && qd === this.den;
    const bottom = unreduced ? (this.numTimesDen ??= this.num.mul(this.den)) : qn.mul(qd);
    const top = unreduced ? crossLogDerivative(this.num, this.den, v) : pn.mul(qd).sub(pd.mul(qn));
    const f = RationalFunction.fromCoprime(top, bottom);
    // The denominator is known as a product: compact forms print it so, without searching for factors.
    if (!f.isZero()) {
      f.denominatorFactors = [qn, qd].filter((q) => !q.isConstant());
      // A dozen of these print per result: a large numerator is not searched for factors.
      f.groupNumerator = f.num.termCount() <= SENSITIVITY_GROUPING_TERMS;
    }
    return f;
  }

  /**
   * Limit as v -> +infinity or v -> 0 from above, from degrees and leading coefficients in v.
   * An unbounded result reports its sign when that sign is a constant, 0 when it depends on other symbols.
   */
  limit(v: string, to: "inf" | "zero"): Limit {
    if (this.isZero()) return { kind: "finite", value: RationalFunction.ZERO };
    const [dn, dd] = to === "inf" ? [this.num.degreeIn(v), this.den.degreeIn(v)] : [this.num.lowDegreeIn(v), this.den.lowDegreeIn(v)];
    const cn = this.num.coefficientIn(v, dn);
    const cd = this.den.coefficientIn(v, dd);
    const finiteOrder = to === "inf" ? dn <= dd : dn >= dd;
    if (finiteOrder) {
      if (dn !== dd) return { kind: "finite", value: RationalFunction.ZERO };
      return { kind: "finite", value: RationalFunction.from(cn, cd) };
    }
    const ratio = RationalFunction.from(cn, cd).constantValue();
    return { kind: "infinite", sign: ratio ? ratio.sign() : 0 };
  }

  /** The dominant term ratio as v -> infinity or 0, e.g. R0/(1 + mu) as mu -> inf gives R0/mu. */
  leadingOrder(v: string, to: "inf" | "zero"): RationalFunction {
    if (this.isZero()) return this;
    const [dn, dd] = to === "inf" ? [this.num.degreeIn(v), this.den.degreeIn(v)] : [this.num.lowDegreeIn(v), this.den.lowDegreeIn(v)];
    const x = Poly.variable(v);
    return RationalFunction.from(this.num.coefficientIn(v, dn).mul(x.pow(dn)), this.den.coefficientIn(v, dd).mul(x.pow(dd)));
  }

  /**
   * Solve F = target for v when F is linear-fractional in v: F = (a v + b)/(c v + d).
   * Returns null when F has degree above 1 in v in N or D, when v does not occur in F,
   * when the target contains v, when a - target c vanishes identically (no unique solution),
   * or when the solution makes the denominator vanish.
   */
  solveFor(v: string, target: RationalFunction): RationalFunction | null {
    if (target.variables().includes(v)) return null;
    const degN = this.num.degreeIn(v);
    const degD = this.den.degreeIn(v);
    if (degN > 1 || degD > 1 || (degN <= 0 && degD <= 0)) return null;
    const fa = RationalFunction.fromPoly(this.num.coefficientIn(v, 1));
    const fb = RationalFunction.fromPoly(this.num.coefficientIn(v, 0));
    const fc = RationalFunction.fromPoly(this.den.coefficientIn(v, 1));
    const fd = RationalFunction.fromPoly(this.den.coefficientIn(v, 0));
    // a v + b = T (c v + d)  =>  v = (T d - b) / (a - T c)
    const lhs = fa.sub(target.mul(fc));
    if (lhs.isZero()) return null;
    const x = target.mul(fd).sub(fb).div(lhs);
    const denAt = fc.mul(x).add(fd);
    if (denAt.isZero()) return null;
    return x;
  }

  // ---- printing ----------------------------------------------------------------------

  /** Canonical expanded "N/D" ("N" when D = 1), plain infix, sympy-parsable once ^ is power. */
  toInfix(): string {
    return (this.infixCache ??= this.printInfix());
  }

  private infixCache: string | undefined;

  private printInfix(): string {
    if (this.den.isOne()) return this.num.toInfix();
    // Integer coefficients on both sides: scale N and D by N's common denominator.
    const [n, d] = this.integerParts();
    const nStr = n.termCount() > 1 ? `(${n.toInfix()})` : n.toInfix();
    return `${nStr}/${wrapDenominator(d)}`;
  }

  toTex(): string {
    if (this.den.isOne()) return this.num.toTex();
    const [n, d] = this.integerParts();
    return `\\frac{${n.toTex()}}{${d.toTex()}}`;
  }

  private integerParts(): [Poly, Poly] {
    const q = Rational.of(this.num.den);
    return q.isOne() ? [this.num, this.den] : [this.num.scale(q), this.den.scale(q)];
  }

  /** Common factors pulled out, N and D factored where cheap (content, monomials, grouping by one variable). */
  compactInfix(): string {
    const { sign, top, bottom } = this.compactParts();
    const signStr = sign < 0 ? "-" : "";
    const lone = (fs: CompactFactor[]) => fs.length === 1 && fs[0].multiTerm && fs[0].exponent === 1;
    const num = lone(top) && bottom.length === 0 && sign > 0 ? top[0].bare : top.map((f) => f.infix).join("*");
    if (bottom.length === 0) return signStr + num;
    const simple = bottom.length === 1 && !bottom[0].multiTerm && bottom[0].infix === bottom[0].bare;
    const den = simple || lone(bottom) ? bottom[0].infix : `(${bottom.map((f) => f.infix).join("*")})`;
    return `${signStr}${num}/${den}`;
  }

  compactTex(): string {
    const { sign, top, bottom } = this.compactParts();
    const tex = (fs: CompactFactor[]) => (fs.length === 0 ? "1" : fs.map((f) => f.tex).join("\\,"));
    const signStr = sign < 0 ? "-" : "";
    // A lone sum keeps its brackets under a minus sign: -(R1 + R2), never -R1 + R2.
    const bare = top.length === 1 && top[0].exponent === 1 && !(sign < 0 && top[0].multiTerm);
    if (bottom.length === 0) return signStr + (bare ? top[0].bareTex : tex(top));
    return `${signStr}\\frac{${tex(top)}}{${tex(bottom)}}`;
  }

  /** Polynomials whose product is the denominator up to a constant, when known from how it was made. */
  private denominatorFactors: Poly[] | undefined;
  private numTimesDen: Poly | undefined;
  /** Whether the compact forms search the numerator for factors by grouping. */
  private groupNumerator = true;

  private compactCache: { sign: number; top: CompactFactor[]; bottom: CompactFactor[] } | undefined;

  private compactParts(): { sign: number; top: CompactFactor[]; bottom: CompactFactor[] } {
    return (this.compactCache ??= this.computeCompactParts());
  }

  private computeCompactParts(): { sign: number; top: CompactFactor[]; bottom: CompactFactor[] } {
    if (this.isZero()) return { sign: 1, top: [compactNumber(0n)], bottom: [] };
    const fn = factorCheap(this.num, this.groupNumerator);
    const fd = this.denominatorFactors && this.denominatorFactors.length > 1 ? factorProduct(this.den, this.denominatorFactors) : factorCheap(this.den);
    const k = fn.constant.div(fd.constant);
    const top: CompactFactor[] = [];
    const bottom: CompactFactor[] = [];
    const absNum = k.num < 0n ? -k.num : k.num;
    if (absNum !== 1n) top.push(compactNumber(absNum));
    if (k.den !== 1n) bottom.push(compactNumber(k.den));
    pushFactors(top, fn);
    pushFactors(bottom, fd);
    if (top.length === 0) top.push(compactNumber(1n));
    return { sign: k.sign(), top, bottom };
  }

  toString(): string {
    return this.toInfix();
  }
}

interface CompactFactor {
  readonly bare: string; // infix without the power or parentheses
  readonly infix: string; // with parentheses and power as needed
  readonly bareTex: string;
  readonly tex: string;
  readonly multiTerm: boolean;
  readonly exponent: number;
}

/** factorCheap of den = c * prod(parts), from the parts' own factorizations (equal factors merged into powers). */
function factorProduct(den: Poly, parts: readonly Poly[]): CheapFactorization {
  const each = parts.map((q) => factorCheap(q));
  const monomial: Record<string, number> = {};
  const factors: Array<{ base: Poly; exponent: number }> = [];
  let lc = Rational.ONE;
  for (const f of each) {
    for (const [v, e] of Object.entries(f.monomial)) monomial[v] = (monomial[v] ?? 0) + e;
    for (const { base, exponent } of f.factors) {
      const same = factors.find((x) => x.base.equals(base));
      if (same) same.exponent += exponent;
      else factors.push({ base, exponent });
    }
    lc = lc.mul(f.constant);
  }
  // den / prod(parts) is a constant; the parts' own constants are folded into it.
  // The leading coefficient of a product is the product of the leading coefficients (a monomial order).
  const lcProduct = parts.reduce((acc, q) => acc.mul(q.leadingCoefficient()), Rational.ONE);
  const constant = den.leadingCoefficient().div(lcProduct).mul(lc);
  factors.sort((a, b) => a.base.termCount() - b.base.termCount() || (a.base.toInfix() < b.base.toInfix() ? -1 : 1));
  return { constant, monomial: Object.fromEntries(sortNames(Object.keys(monomial)).map((v) => [v, monomial[v]])), factors };
}

function compactNumber(n: bigint): CompactFactor {
  const s = n.toString();
  return { bare: s, infix: s, bareTex: s, tex: s, multiTerm: false, exponent: 1 };
}

function pushFactors(out: CompactFactor[], f: CheapFactorization): void {
  for (const v of Object.keys(f.monomial)) {
    const e = f.monomial[v];
    out.push({
      bare: v,
      infix: e === 1 ? v : `${v}^${e}`,
      bareTex: texName(v),
      tex: e === 1 ? texName(v) : `${texName(v)}^{${e}}`,
      multiTerm: false,
      exponent: e,
    });
  }
  for (const { base, exponent } of f.factors) {
    // Printed on demand: a large factor is printed only in the forms asked for (and cached by the Poly).
    out.push({
      get bare() {
        return base.toInfix();
      },
      get infix() {
        return exponent === 1 ? `(${base.toInfix()})` : `(${base.toInfix()})^${exponent}`;
      },
      get bareTex() {
        return base.toTex();
      },
      get tex() {
        return exponent === 1 ? `\\left(${base.toTex()}\\right)` : `\\left(${base.toTex()}\\right)^{${exponent}}`;
      },
      multiTerm: true,
      exponent,
    });
  }
}

/**
 * D made primitive with a positive leading coefficient, and the factor that did it; null when D is
 * already so. Kept per D, so results over one denominator (Vth and Rth over det A) share one
 * normalized denominator object, and with it its printed form and its values at the check points.
 */
const normalDenominator = onceEach((den: Poly): { inverse: Rational; den: Poly } | null => {
  let c = den.content();
  if (den.coefs[0] < 0n) c = c.neg();
  const inverse = c.inverse();
  return c.isOne() ? null : { inverse, den: den.scale(inverse) };
});

function wrapDenominator(d: Poly): string {
  const s = d.toInfix();
  return d.termCount() === 1 && d.vars.length === 1 && d.degreeIn(d.vars[0]) === 1 && d.coefs[0] === 1n ? s : `(${s})`;
}

/**
 * v·(N' D − N D') for N = Σ N_i v^i and D = Σ D_j v^j, as Σ_{i≠j} (i − j) N_i D_j v^(i+j): the
 * products of equal powers cancel and are never formed. For N and D of degree 1 in v (every
 * resistance of a resistive network) that is two products of halves, a quarter of the work of
 * v N'·D − v D'·N each, summed in one pass, so that what cancels between them is never decoded.
 */
function crossLogDerivative(n: Poly, d: Poly, v: string): Poly {
  const ns = n.coefficientsIn(v);
  const ds = d.coefficientsIn(v);
  const pairs: [Poly, Poly][] = [];
  for (let i = 0; i < ns.length; i++) {
    for (let j = 0; j < ds.length; j++) if (i !== j) pairs.push([ns[i].mul(Poly.monomial(i - j, { [v]: i + j })), ds[j]]);
  }
  return Poly.sumOfProducts(pairs);
}

/** v P'/P in lowest terms as [top, bottom] (bottom divides P); [0, 1] when P is free of v. */
function logDerivativeTimes(p: Poly, v: string): [Poly, Poly] {
  const d = p.degreeIn(v);
  if (d <= 0) return [Poly.zero(), Poly.one()];
  const top = p.derivative(v).mul(Poly.variable(v));
  if (d === 1 && p.lowDegreeIn(v) === 0) {
    // P = a v + b: v P' = a v, and gcd(a v, a v + b) = gcd(a, b), a gcd of two smaller polynomials.
    const { gcd, aQuotient: a1, bQuotient: b1 } = polyGcdCofactors(p.coefficientIn(v, 1), p.coefficientIn(v, 0));
    if (gcd.isOne()) return [top, p];
    const x = Poly.variable(v);
    return [a1.mul(x), a1.mul(x).add(b1)];
  }
  const { aQuotient, bQuotient } = polyGcdCofactors(top, p);
  return [aQuotient, bQuotient];
}

/** P with the variables replaced by n_v/d_v, times prod d_v^deg_v(P); returns the degrees used. */
function composeCleared(p: Poly, names: readonly string[], values: Record<string, RationalFunction>): [Poly, number[]] {
  const degs = names.map((v) => Math.max(0, p.degreeIn(v)));
  if (p.isZero()) return [p, degs];
  const numPow = names.map((v, i) => powers(values[v].num, degs[i]));
  const denPow = names.map((v, i) => powers(values[v].den, degs[i]));
  let sum = Poly.zero();
  for (const { coefficient, monomial } of p.terms()) {
    const rest: Record<string, number> = {};
    for (const v of Object.keys(monomial)) if (!names.includes(v)) rest[v] = monomial[v];
    let term = Poly.monomial(coefficient, rest);
    names.forEach((v, i) => {
      const e = monomial[v] ?? 0;
      term = term.mul(numPow[i][e]).mul(denPow[i][degs[i] - e]);
    });
    sum = sum.add(term);
  }
  return [sum, degs];
}

function powers(p: Poly, n: number): Poly[] {
  const out = [Poly.one()];
  for (let k = 1; k <= n; k++) out.push(out[k - 1].mul(p));
  return out;
}
