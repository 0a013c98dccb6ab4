// The heuristic gcd (Char, Geddes and Gonnet, 1989) for multivariate integer polynomials:
// evaluate one variable at a large integer xi, take the gcd of the images recursively (down
// to integers), and read the gcd back from the xi-adic digits of the image's coefficients
// (symmetric remainders). A candidate is accepted only when it divides both inputs exactly,
// so an answer is always right; after a few evaluation points it gives up (null) and the
// caller falls back to a remainder sequence.

import { Poly } from "./polynomial";
import { canonicalFields } from "./polynomial-build";
import { bigAbs, bigGcd } from "./rational";
import { polyDivide } from "./division";
import { sortNames } from "./names";

export interface HeuristicGcd {
  readonly gcd: Poly;
  readonly aQuotient: Poly;
  readonly bQuotient: Poly;
}

const ATTEMPTS = 6;

/** Gcd of two polynomials with integer coefficients (positive leading coefficient) and both quotients, or null. */
export function heuristicGcd(a: Poly, b: Poly): HeuristicGcd | null {
  if (a.den !== 1n || b.den !== 1n) throw new RangeError("heuristic gcd needs integer coefficients");
  const found = heu(a, b);
  if (found === null) return null;
  // Positive leading coefficient for the gcd; the quotients carry the sign.
  return found.gcd.coefs[0] < 0n ? { gcd: found.gcd.neg(), aQuotient: found.aQuotient.neg(), bQuotient: found.bQuotient.neg() } : found;
}

function integerContent(p: Poly): bigint {
  let g = 0n;
  for (const c of p.coefs) {
    g = bigGcd(g, c);
    if (g === 1n) break;
  }
  return g;
}

function maxNorm(p: Poly): bigint {
  let m = 0n;
  for (const c of p.coefs) {
    const x = bigAbs(c);
    if (x > m) m = x;
  }
  return m;
}

function isqrt(n: bigint): bigint {
  if (n < 2n) return n;
  // Newton's iteration from above: a float guess when n fits a double, a power of two beyond.
  let x = n < 2n ** 1000n ? BigInt(Math.ceil(Math.sqrt(Number(n)))) + 1n : 1n << BigInt(Math.ceil(n.toString(2).length / 2));
  for (;;) {
    const y = (x + n / x) >> 1n;
    if (y >= x) break;
    x = y;
  }
  while (x * x > n) x--;
  return x;
}

function scaleInt(p: Poly, k: bigint): Poly {
  return k === 1n ? p : Poly.fromFields(canonicalFields(p.vars, p.exps, p.coefs.map((c) => c * k), 1n));
}

function divideInt(p: Poly, k: bigint): Poly {
  return k === 1n ? p : Poly.fromFields(canonicalFields(p.vars, p.exps, p.coefs.map((c) => c / k), 1n));
}

function heu(a: Poly, b: Poly): HeuristicGcd | null {
  if (a.isZero() || b.isZero()) return null;
  // The common integer content is set aside; what remains has a primitive gcd.
  const common = bigGcd(integerContent(a), integerContent(b));
  const f = divideInt(a, common);
  const g = divideInt(b, common);
  if (f.isConstant() || g.isConstant()) {
    const h = bigGcd(integerContent(f), integerContent(g));
    return { gcd: Poly.constant(h * common), aQuotient: divideInt(f, h), bQuotient: divideInt(g, h) };
  }
  // Evaluate a variable both share when there is one (a variable in one only cannot be in the gcd).
  const x = f.vars.find((v) => g.vars.includes(v)) ?? f.vars[0];
  const fn = maxNorm(f);
  const gn = maxNorm(g);
  const bound = 2n * (fn < gn ? fn : gn) + 29n;
  const lcRatio = (p: Poly, n: bigint) => n / bigAbs(p.coefs[0]);
  const fr = lcRatio(f, fn);
  const gr = lcRatio(g, gn);
  // Never below 2·min(|f|, |g|) + 2: only from there does a candidate that divides both prove to be
  // the gcd (Char, Geddes and Gonnet's theorem). A smaller starting point (99·√bound, as some
  // implementations take for speed) lets a constant image pass the division test when the true gcd
  // is not constant, e.g. z − c with ξ = 2c, whose digit c reads as +c.
  let xi = bound;
  const floor = 2n * (fr < gr ? fr : gr) + 2n;
  if (floor > xi) xi = floor;
  for (let attempt = 0; attempt < ATTEMPTS; attempt++) {
    const fx = evaluateAt(f, x, xi);
    const gx = evaluateAt(g, x, xi);
    if (!fx.isZero() && !gx.isZero()) {
      const image = heu(fx, gx);
      if (image === null) return null;
      const accept = (h: Poly): HeuristicGcd | null => {
        if (h.isZero()) return null;
        const hp = h.primitivePart();
        const qa = polyDivide(f, hp);
        if (qa === null) return null;
        const qb = polyDivide(g, hp);
        if (qb === null) return null;
        return { gcd: scaleInt(hp, common), aQuotient: qa, bQuotient: qb };
      };
      const byGcd = accept(interpolate(image.gcd, x, xi));
      if (byGcd) return byGcd;
      // The cofactors' images may reconstruct where the gcd's did not.
      for (const [p, q] of [[f, image.aQuotient], [g, image.bQuotient]] as const) {
        const cof = interpolate(q, x, xi);
        if (cof.isZero()) continue;
        const h = polyDivide(p, cof);
        if (h === null || h.den !== 1n) continue;
        const other = p === f ? g : f;
        const qo = polyDivide(other, h);
        if (qo === null) continue;
        // h = p / cof exactly; make it primitive with the sign of a positive leading coefficient.
        const c = integerContent(h) * (h.coefs[0] < 0n ? -1n : 1n);
        const hp = divideInt(h, c);
        const qp = scaleInt(cof, c);
        const qOther = scaleInt(qo, c);
        return p === f
          ? { gcd: scaleInt(hp, common), aQuotient: qp, bQuotient: qOther }
          : { gcd: scaleInt(hp, common), aQuotient: qOther, bQuotient: qp };
      }
    }
    xi = (73794n * xi * isqrt(isqrt(xi))) / 27011n;
  }
  return null;
}

/** p with x replaced by the integer xi (a polynomial in the other variables). */
function evaluateAt(p: Poly, x: string, xi: bigint): Poly {
  const j = p.vars.indexOf(x);
  if (j < 0) return p;
  const nv = p.vars.length;
  const deg = p.degreeIn(x);
  const pw: bigint[] = [1n];
  for (let k = 1; k <= deg; k++) pw.push(pw[k - 1] * xi);
  const rest = p.vars.filter((_, i) => i !== j);
  const index = new Map<string, number>();
  const exps: number[] = [];
  const coefs: bigint[] = [];
  const ex = p.exps;
  for (let t = 0, o = 0; t < p.coefs.length; t++, o += nv) {
    let key = "";
    for (let v = 0; v < nv; v++) if (v !== j) key += ex[o + v] + ",";
    const c = p.coefs[t] * pw[ex[o + j]];
    const at = index.get(key);
    if (at === undefined) {
      index.set(key, coefs.length);
      for (let v = 0; v < nv; v++) if (v !== j) exps.push(ex[o + v]);
      coefs.push(c);
    } else coefs[at] += c;
  }
  return Poly.fromFields(canonicalFields(rest, exps, coefs, 1n));
}

/** The polynomial in x (and p's variables) whose coefficients are the symmetric xi-adic digits of p's. */
function interpolate(p: Poly, x: string, xi: bigint): Poly {
  // canonicalFields wants the variables in canonical order; x goes where it belongs in that order.
  const order = sortNames([...p.vars, x]);
  const at = order.indexOf(x);
  const nv = order.length;
  const pv = p.vars.length;
  const half = xi / 2n;
  const exps: number[] = [];
  const coefs: bigint[] = [];
  for (let t = 0; t < p.coefs.length; t++) {
    let c = p.coefs[t];
    for (let k = 0; c !== 0n; k++) {
      let d = c % xi;
      if (d > half) d -= xi;
      else if (d < -half) d += xi;
      if (d !== 0n) {
        for (let v = 0, q = 0; v < nv; v++) exps.push(v === at ? k : p.exps[t * pv + q++]);
        coefs.push(d);
      }
      c = (c - d) / xi;
    }
  }
  return Poly.fromFields(canonicalFields(order, exps, coefs, 1n));
}
