// Greatest common divisors of multivariate polynomials over Q.
//
// Method, cheapest first:
//  1. integer content and monomial factors are pulled out;
//  2. degree bounds by univariate images: all variables but one are evaluated at a random
//     point modulo a prime and the gcd of the two images is taken in the remaining one.
//     When the leading coefficient of the dividend survives the evaluation, the image of the
//     true gcd keeps its degree and divides both images, so deg_x(gcd) <= deg(image gcd)
//     exactly; a zero bound for every variable proves the gcd trivial;
//  3. variables with a zero bound are eliminated: the gcd lies in the other variables and
//     so divides every coefficient of both inputs with respect to the eliminated ones,
//     which leaves gcds of far smaller polynomials;
//  4. otherwise the heuristic gcd (heuristic-gcd.ts: evaluation at a large integer and
//     xi-adic reconstruction), and only if it gives up a recursive primitive Euclid (primitive polynomial remainder sequence) in
//     one variable, with contents computed recursively by this same function.
// Every answer is exact; randomness only decides how fast it comes.

import { Poly } from "./polynomial";
import { canonicalFields } from "./polynomial-build";
import { makeLayout, unionVars, type Key } from "./monomial-layout";
import { polyDivide, polyDivideExact } from "./division";
import { heuristicGcd } from "./heuristic-gcd";
import { onceEach } from "./memo";
import { PRIME, coefficientResidues, invMod, makeRandom, mulMod } from "./modular";
import { CHAIN_MIN_TERMS, productChain } from "./polynomial-calculus";

/**
 * Images of p in each test variable x: all other variables evaluated at the point (mod PRIME).
 * Returns, per test variable, the image's coefficients from degree 0 up.
 */
function univariateImages(p: Poly, point: Map<string, number>, testVars: readonly string[]): Map<string, number[]> {
  const nv = p.vars.length;
  const n = p.coefs.length;
  const degs = p.degrees();
  const powers = p.vars.map((v, i) => {
    const r = point.get(v)!;
    const pw = [1];
    for (let k = 1; k <= degs[i]; k++) pw.push((pw[k - 1] * r) % PRIME);
    return pw;
  });
  // One pass: each term's value at the point, and per (variable, exponent) raw sums of those
  // values (exact in doubles below 2^27 terms), reduced once at the end.
  const cols = testVars.map((x) => p.vars.indexOf(x));
  const sumAt = new Int32Array(nv).fill(-1); // variable -> first slot of its sums
  let slots = 0;
  cols.forEach((j) => {
    if (j >= 0 && sumAt[j] < 0) {
      sumAt[j] = slots;
      slots += degs[j] + 1;
    }
  });
  const sums = new Float64Array(slots);
  const pw = powers.map((a) => Float64Array.from(a));
  const ex = p.exps;
  const cs = coefficientResidues(p);
  let total = 0;
  if (n >= CHAIN_MIN_TERMS) {
    // Running products over the factors neighbouring terms share (see productChain); the
    // factors of the current term are kept on a stack for the sums.
    const { shared, start, factorVar, factorExp, depth } = productChain(p);
    const running = new Float64Array(depth + 1);
    running[0] = 1;
    const slotOf = new Int32Array(depth); // the sums slot of each factor of the current term, or -1
    for (let t = 0; t < n; t++) {
      let j = shared[t];
      for (let f = start[t], end = start[t + 1]; f < end; f++, j++) {
        const v = factorVar[f];
        const e = factorExp[f];
        running[j + 1] = mulMod(running[j], pw[v][e]);
        slotOf[j] = sumAt[v] >= 0 ? sumAt[v] + e : -1;
      }
      const m = mulMod(cs[t], running[j]);
      total += m;
      for (let k = 0; k < j; k++) if (slotOf[k] >= 0) sums[slotOf[k]] += m;
    }
  } else {
    for (let t = 0, o = 0; t < n; t++, o += nv) {
      let m = cs[t];
      for (let v = 0; v < nv; v++) {
        const e = ex[o + v];
        if (e !== 0) m = mulMod(m, pw[v][e]);
      }
      total += m;
      for (let v = 0; v < nv; v++) {
        const e = ex[o + v];
        if (e !== 0 && sumAt[v] >= 0) sums[sumAt[v] + e] += m;
      }
    }
  }
  const acc = (j: number) => sums.subarray(sumAt[j], sumAt[j] + degs[j] + 1);
  const out = new Map<string, number[]>();
  testVars.forEach((x, c) => {
    const j = cols[c];
    if (j < 0) {
      out.set(x, [total % PRIME]);
      return;
    }
    const a = Float64Array.from(acc(j));
    let rest = total;
    for (let e = 1; e < a.length; e++) rest -= a[e];
    a[0] = rest;
    const inv = invMod(point.get(x)!);
    const img = new Array<number>(a.length);
    let ip = 1;
    for (let e = 0; e < a.length; e++) {
      // The constant term is a difference of sums and may be negative: bring every residue into [0, PRIME).
      img[e] = ((((a[e] % PRIME) + PRIME) % PRIME) * ip) % PRIME;
      ip = (ip * inv) % PRIME;
    }
    out.set(x, img);
  });
  return out;
}

function trim(a: number[]): number[] {
  let n = a.length;
  while (n > 0 && a[n - 1] === 0) n--;
  return n === a.length ? a : a.slice(0, n);
}

/** Degree of the gcd of two univariate polynomials mod PRIME (coefficients from degree 0 up). */
function univariateGcdDegree(a: number[], b: number[]): number {
  a = trim(a.slice());
  b = trim(b.slice());
  while (b.length > 0) {
    // a := a mod b
    const inv = invMod(b[b.length - 1]);
    while (a.length >= b.length) {
      const f = (a[a.length - 1] * inv) % PRIME;
      const s = a.length - b.length;
      for (let i = 0; i < b.length; i++) a[s + i] = (a[s + i] - ((f * b[i]) % PRIME) + PRIME) % PRIME;
      a = trim(a);
    }
    [a, b] = [b, a];
  }
  return a.length - 1;
}

/** Normalized gcd result: integer-primitive with a positive leading coefficient. */
function normalize(p: Poly): Poly {
  if (p.isZero()) return p;
  if (p.isConstant()) return Poly.one();
  return p.primitivePart();
}

export interface GcdWithCofactors {
  /** normalized gcd: integer-primitive, positive leading coefficient, 1 when trivial */
  readonly gcd: Poly;
  /** a / gcd, exactly */
  readonly aQuotient: Poly;
  /** b / gcd, exactly */
  readonly bQuotient: Poly;
}

/** Greatest common divisor, normalized: primitive with integer coefficients and positive leading coefficient (1 when trivial). */
export function polyGcd(a: Poly, b: Poly): Poly {
  return polyGcdCofactors(a, b).gcd;
}

/** The gcd together with both quotients (what lowest terms needs, without dividing twice). */
export function polyGcdCofactors(a: Poly, b: Poly): GcdWithCofactors {
  if (a.isZero() || b.isZero()) {
    const g = normalize(a.isZero() ? b : a);
    if (g.isZero()) return { gcd: g, aQuotient: g, bQuotient: g };
    return { gcd: g, aQuotient: a.isZero() ? a : polyDivideExact(a, g), bQuotient: b.isZero() ? b : polyDivideExact(b, g) };
  }
  if (a.isConstant() || b.isConstant()) return { gcd: Poly.one(), aQuotient: a, bQuotient: b };
  // Monomial factors first: the common one is the minimum of the low degrees.
  const lowA = a.lowDegrees();
  const lowB = b.lowDegrees();
  const common: Record<string, number> = {};
  a.vars.forEach((v, i) => {
    const j = b.vars.indexOf(v);
    if (j >= 0 && lowA[i] > 0 && lowB[j] > 0) common[v] = Math.min(lowA[i], lowB[j]);
  });
  const mono = Poly.monomial(1, common);
  const hasMono = Object.keys(common).length > 0;
  const found = gcdWithoutMonomials(a, b, lowA, lowB);
  if (found === null) {
    // Trivial apart from the monomial: the quotients are a single exponent shift.
    return hasMono ? { gcd: mono, aQuotient: a.divideByMonomial(common), bQuotient: b.divideByMonomial(common) } : { gcd: Poly.one(), aQuotient: a, bQuotient: b };
  }
  const g = hasMono ? found.g.mul(mono) : found.g;
  // a = s x^lowA A with a rational s, so a / (g mono) = s x^(lowA - mono) (A / g).
  const quotient = (p: Poly, low: Int32Array, P: Poly, q: Poly | undefined): Poly => {
    if (q === undefined) return polyDivideExact(p, g);
    const rest: Record<string, number> = {};
    p.vars.forEach((v, i) => {
      const k = low[i] - (common[v] ?? 0);
      if (k > 0) rest[v] = k;
    });
    return q.mul(Poly.monomial(p.leadingCoefficient().div(P.leadingCoefficient()), rest));
  };
  return { gcd: g, aQuotient: quotient(a, lowA, found.A, found.qa), bQuotient: quotient(b, lowB, found.B, found.qb) };
}

/** Gcd of a list of polynomials (normalized; zero for an empty or all-zero list). */
export function polyGcdList(ps: readonly Poly[]): Poly {
  const sorted = ps.filter((p) => !p.isZero()).sort((x, y) => x.termCount() - y.termCount());
  if (sorted.length === 0) return Poly.zero();
  let g = normalize(sorted[0]);
  for (let i = 1; i < sorted.length && !g.isOne(); i++) {
    if (polyDivide(sorted[i], g) !== null) continue;
    g = polyGcd(g, sorted[i]);
  }
  return g;
}

export function polyLcm(a: Poly, b: Poly): Poly {
  if (a.isZero() || b.isZero()) return Poly.zero();
  const { aQuotient } = polyGcdCofactors(a, b);
  return normalize(aQuotient.mul(b));
}

interface PrimitiveGcd {
  /** normalized gcd of the primitive, monomial-free parts A and B */
  readonly g: Poly;
  /** A / g and B / g when already known */
  readonly qa?: Poly;
  readonly qb?: Poly;
  /** the primitive, monomial-free parts themselves */
  readonly A: Poly;
  readonly B: Poly;
}

/**
 * Gcd of a and b with their monomial factors set aside (normalized), or null when it is 1.
 * lowA, lowB: the low degree of each variable of a and b.
 */
function gcdWithoutMonomials(a: Poly, b: Poly, lowA: Int32Array, lowB: Int32Array): PrimitiveGcd | null {
  // A single term is all monomial: nothing is left to share (and no image of the other is needed).
  if (a.termCount() === 1 || b.termCount() === 1) return null;
  const all = unionVars(a.vars, b.vars);
  const commonVars = all.filter((v) => a.vars.includes(v) && b.vars.includes(v));
  if (commonVars.length === 0) return null;
  const bound = degreeBounds(a, b, lowA, lowB, all, commonVars);
  const inGcd = new Set(commonVars.filter((v) => bound.get(v)! > 0));
  if (inGcd.size === 0) return null;
  const A = stripMonomial(a, lowA).primitivePart();
  const B = stripMonomial(b, lowB).primitivePart();
  if (A.isConstant() || B.isConstant()) return null;
  const found = gcdPrimitive(A, B, inGcd, bound, all, commonVars);
  return found.g.isOne() ? null : { ...found, A, B };
}

function stripMonomial(p: Poly, low: Int32Array): Poly {
  const m: Record<string, number> = {};
  p.vars.forEach((v, i) => {
    if (low[i] > 0) m[v] = low[i];
  });
  return p.divideByMonomial(m);
}

/** Gcd of primitive integer polynomials without monomial factors, given the modular degree bounds. */
function gcdPrimitive(
  A: Poly, B: Poly, inGcd: Set<string>, bound: Map<string, number>, all: readonly string[], commonVars: readonly string[],
): { g: Poly; qa?: Poly; qb?: Poly } {
  if (A.equals(B)) return { g: normalize(A), qa: Poly.one(), qb: Poly.one() };
  // The gcd may be one of the inputs (a frequent case: F * D over D).
  if (B.vars.every((v) => inGcd.has(v) && bound.get(v) === B.degreeIn(v))) {
    const q = polyDivide(A, B);
    if (q !== null) return { g: B, qa: q, qb: Poly.one() };
  }
  if (A.vars.every((v) => inGcd.has(v) && bound.get(v) === A.degreeIn(v))) {
    const q = polyDivide(B, A);
    if (q !== null) return { g: A, qa: Poly.one(), qb: q };
  }
  const keep = all.filter((v) => inGcd.has(v));
  if (keep.length < all.length) return gcdByElimination(A, B, keep, bound);
  // Every variable may occur in the gcd: the heuristic gcd first, Euclid in the variable of lowest degree if it gives up.
  const heuristic = heuristicGcd(A, B);
  if (heuristic !== null) return { g: heuristic.gcd, qa: heuristic.aQuotient, qb: heuristic.bQuotient };
  let x = commonVars[0];
  for (const v of commonVars) if (Math.max(A.degreeIn(v), B.degreeIn(v)) < Math.max(A.degreeIn(x), B.degreeIn(x))) x = v;
  return { g: primitiveEuclid(A, B, x) };
}

/**
 * The gcd lies in the variables `keep`, so it divides every coefficient of A and B with respect
 * to the others. The gcd of the smallest few coefficients is a multiple of the true gcd; once it
 * divides both A and B it is the gcd. More coefficients are folded in while it does not.
 */
function gcdByElimination(A: Poly, B: Poly, keep: readonly string[], bound: Map<string, number>): { g: Poly; qa?: Poly; qb?: Poly } {
  const groups = [...coefficientGroups(A, keep), ...coefficientGroups(B, keep)].sort((x, y) => x.size - y.size);
  let g = normalize(groups[0].build());
  // A candidate above the degree bounds is certainly a proper multiple of the gcd: keep folding.
  const withinBounds = () => g.vars.every((v) => g.degreeIn(v) <= (bound.get(v) ?? 0));
  let used = 1;
  let batch = 4;
  for (;;) {
    for (; used < groups.length && !g.isOne() && (used < batch || !withinBounds()); used++) {
      const c = groups[used].build();
      if (polyDivide(c, g) === null) g = polyGcd(g, c);
    }
    if (g.isOne() || used >= groups.length) return { g };
    const qa = polyDivide(A, g);
    const qb = qa === null ? null : polyDivide(B, g);
    if (qa !== null && qb !== null) return { g, qa, qb };
    batch = used * 4;
  }
}

/** Terms of p grouped by their exponents in the variables outside keep; each group builds its coefficient on demand. */
function coefficientGroups(p: Poly, keep: readonly string[]): Array<{ size: number; build: () => Poly }> {
  const nv = p.vars.length;
  const keepCols: number[] = [];
  const elimCols: number[] = [];
  p.vars.forEach((v, i) => (keep.includes(v) ? keepCols : elimCols).push(i));
  const degs = p.degrees();
  const layout = makeLayout(elimCols.map((i) => p.vars[i]), elimCols.map((i) => degs[i]));
  const mult = elimCols.map((_, j) => layout.mult[j]);
  const groups = new Map<Key | string, number[]>();
  for (let t = 0; t < p.coefs.length; t++) {
    let key: Key | string;
    if (layout.packed) {
      let k = 0;
      for (let j = 0; j < elimCols.length; j++) k += p.exps[t * nv + elimCols[j]] * mult[j];
      key = k;
    } else {
      key = elimCols.map((i) => p.exps[t * nv + i]).join(",");
    }
    const g = groups.get(key);
    if (g) g.push(t);
    else groups.set(key, [t]);
  }
  const keptVars = keepCols.map((i) => p.vars[i]);
  return [...groups.values()].map((terms) => ({
    size: terms.length,
    build: () => {
      const exps: number[] = [];
      const coefs: bigint[] = [];
      for (const t of terms) {
        for (const i of keepCols) exps.push(p.exps[t * nv + i]);
        coefs.push(p.coefs[t]);
      }
      return Poly.fromFields(canonicalFields(keptVars, exps, coefs, 1n));
    },
  }));
}

/** p's images in each of its variables at the fixed point (fixedResidue of each name), computed once per polynomial. */
const fixedPointImages = onceEach((p: Poly) => univariateImages(p, new Map(p.vars.map((v) => [v, fixedResidue(v)])), p.vars));

/** A nonzero residue that depends on the name alone (FNV-1a hash), the same in every gcd. */
function fixedResidue(name: string): number {
  let h = 0x811c9dc5;
  for (let i = 0; i < name.length; i++) h = Math.imul(h ^ name.charCodeAt(i), 0x01000193);
  return 1 + ((h >>> 0) % (PRIME - 1));
}

/** Upper bounds on deg_x gcd(a, b) with monomial factors removed, for each common variable x, from images mod PRIME. */
function degreeBounds(a: Poly, b: Poly, lowA: Int32Array, lowB: Int32Array, all: readonly string[], commonVars: readonly string[]): Map<string, number> {
  const degA = a.degrees();
  const degB = b.degrees();
  const ia = new Map(a.vars.map((v, i) => [v, i]));
  const ib = new Map(b.vars.map((v, i) => [v, i]));
  const bound = new Map<string, number>();
  for (const v of commonVars) {
    const i = ia.get(v)!;
    const j = ib.get(v)!;
    bound.set(v, Math.min(degA[i] - lowA[i], degB[j] - lowB[j]));
  }
  const random = makeRandom(a.termCount() * 7919 + b.termCount());
  // A point that keeps a leading coefficient gives a valid bound; retry only the variables without one.
  // The first point is each variable's fixed value, so a polynomial's images there are taken once
  // for every gcd it enters (det A meets Rth's numerator, then Isc's denominator); retries are random.
  let pending = commonVars.filter((v) => bound.get(v)! > 0);
  for (let attempt = 0; attempt < 3 && pending.length > 0; attempt++) {
    const point = attempt === 0 ? null : new Map(all.map((v) => [v, random()]));
    const imgA = point === null ? fixedPointImages(a) : univariateImages(a, point, pending);
    const imgB = point === null ? fixedPointImages(b) : univariateImages(b, point, pending);
    const retry: string[] = [];
    for (const v of pending) {
      const i = ia.get(v)!;
      const j = ib.get(v)!;
      // Divide out x^low (the other monomial factors are nonzero constants at the point).
      const pa = trim(imgA.get(v)!).slice(lowA[i]);
      const pb = trim(imgB.get(v)!).slice(lowB[j]);
      // The bound holds only when a leading coefficient survives: then the gcd's image keeps its degree.
      const valid = pa.length > 0 && pb.length > 0 && (pa.length - 1 === degA[i] - lowA[i] || pb.length - 1 === degB[j] - lowB[j]);
      if (!valid) {
        retry.push(v);
        continue;
      }
      const d = univariateGcdDegree(pa, pb);
      if (d < bound.get(v)!) bound.set(v, d);
    }
    pending = retry;
  }
  return bound;
}

/** Content with respect to x: gcd of the coefficients of the powers of x. */
function contentIn(p: Poly, x: string): Poly {
  return polyGcdList(p.coefficientsIn(x));
}

/** Pseudo-remainder of a by b in x (sparse, coefficients in the other variables). */
function pseudoRemainder(a: Poly, b: Poly, x: string): Poly {
  const db = b.degreeIn(x);
  const lcB = b.coefficientIn(x, db);
  const xPoly = Poly.variable(x);
  let r = a;
  while (!r.isZero() && r.degreeIn(x) >= db) {
    const dr = r.degreeIn(x);
    const lcR = r.coefficientIn(x, dr);
    r = r.mul(lcB).sub(lcR.mul(xPoly.pow(dr - db)).mul(b));
    // Divide out the integer content as we go; it keeps coefficients small and does not change the gcd.
    if (!r.isZero()) r = r.primitivePart();
  }
  return r;
}

/** Primitive polynomial remainder sequence in x; contents by recursive gcds in the other variables. */
function primitiveEuclid(A: Poly, B: Poly, x: string): Poly {
  const cA = contentIn(A, x);
  const cB = contentIn(B, x);
  const c = polyGcd(cA, cB);
  let p = polyDivide(A, cA)!;
  let q = polyDivide(B, cB)!;
  if (p.degreeIn(x) < q.degreeIn(x)) [p, q] = [q, p];
  while (!q.isZero()) {
    const r = pseudoRemainder(p, q, x);
    if (r.isZero()) break;
    if (r.degreeIn(x) === 0) {
      q = Poly.one();
      break;
    }
    p = q;
    q = polyDivide(r, contentIn(r, x))!;
  }
  const g = q.isZero() ? p : q;
  return normalize(c.mul(g.degreeIn(x) > 0 ? polyDivide(g, contentIn(g, x))! : Poly.one()));
}

