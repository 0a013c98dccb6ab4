// Admittance-to-impedance conversion of polynomials: replace each conductance-like
// variable g by 1/r and clear denominators with r^deg_g(p). For multilinear p this is a
// pure remap of exponents (e_r = deg_g - e_g), no arithmetic on coefficients.

import { Poly } from "./polynomial";
import { canonicalFields, sortedFields } from "./polynomial-build";
import { unionVars } from "./monomial-layout";
import { sortNames } from "./names";

/**
 * p(g -> 1/r) * prod r^deg_g(p), for each pair g -> r. Returns the polynomial and the
 * multiplier prod r^deg_g(p), so p = poly / multiplier after the substitution.
 * A target r may already occur in p (its exponents add up).
 */
export function reciprocalSubstitute(p: Poly, pairs: Record<string, string>): { poly: Poly; multiplier: Poly } {
  const from = Object.keys(pairs).filter((g) => p.vars.includes(g));
  if (from.length === 0 || p.isZero()) return { poly: p, multiplier: Poly.one() };
  const targets = from.map((g) => pairs[g]);
  if (new Set(targets).size !== targets.length) throw new Error("reciprocalSubstitute: two variables map to one target");
  for (const g of from) if (targets.includes(g)) throw new Error(`reciprocalSubstitute: ${g} is both replaced and a target`);
  const degs = p.degrees();
  if (targets.some((r) => p.vars.includes(r))) return reciprocalByTerms(p, pairs, from, degs);
  const keptVars = p.vars.filter((v) => !from.includes(v));
  const vars = sortNames(unionVars(keptVars, sortNames(targets)));
  const nvIn = p.vars.length;
  const nvOut = vars.length;
  // For each input variable: output column and whether its exponent is reflected.
  const col = Int32Array.from(p.vars, (v) => vars.indexOf(from.includes(v) ? pairs[v] : v));
  const reflect = Uint8Array.from(p.vars, (v) => (from.includes(v) ? 1 : 0));
  const n = p.coefs.length;
  const exps = new Uint16Array(n * nvOut);
  const src = p.exps;
  // Every variable reflected, in the same order as its target: reflecting reverses the graded
  // lexicographic order exactly, so the rows are written in reverse and no sort is needed.
  let reverses = reflect.every((r) => r === 1);
  for (let v = 1; v < nvIn && reverses; v++) if (col[v] <= col[v - 1]) reverses = false;
  if (reverses && nvIn === nvOut) {
    // Then every column is its own (col is increasing within as many columns): a row is degs − row.
    for (let t = 0; t < n; t++) {
      const i = t * nvIn;
      const o = (n - 1 - t) * nvOut;
      for (let v = 0; v < nvIn; v++) exps[o + v] = degs[v] - src[i + v];
    }
  } else {
    for (let t = 0; t < n; t++) {
      const i = t * nvIn;
      const o = (reverses ? n - 1 - t : t) * nvOut;
      for (let v = 0; v < nvIn; v++) {
        const e = src[i + v];
        exps[o + col[v]] += reflect[v] === 1 ? degs[v] - e : e;
      }
    }
  }
  const multiplier: Record<string, number> = {};
  p.vars.forEach((v, i) => {
    if (reflect[i]) multiplier[pairs[v]] = degs[i];
  });
  // Output degrees are known: deg_g - low_g for a target, unchanged otherwise.
  const low = p.lowDegrees();
  const outDeg = new Int32Array(nvOut);
  for (let v = 0; v < nvIn; v++) outDeg[col[v]] = reflect[v] === 1 ? degs[v] - low[v] : degs[v];
  // Coefficients are unchanged; sortedFields only reads them (a reduced, positive den is kept as is).
  const everyVar = outDeg.every((d) => d > 0);
  const poly = Poly.fromFields(
    reverses && everyVar
      ? { vars, exps, coefs: p.coefs.slice().reverse(), den: p.den, degrees: outDeg }
      : everyVar
        ? sortedFields(vars, exps, p.coefs as bigint[], p.den, outDeg)
        : canonicalFields(vars, exps, reverses ? p.coefs.slice().reverse() : p.coefs.slice(), p.den),
  );
  return { poly, multiplier: Poly.monomial(1, multiplier) };
}

/** Slow path when a target already occurs in p: distinct monomials may then merge. */
function reciprocalByTerms(p: Poly, pairs: Record<string, string>, from: string[], degs: Int32Array): { poly: Poly; multiplier: Poly } {
  const degOf = new Map(p.vars.map((v, i) => [v, degs[i]]));
  const terms = p.terms().map(({ coefficient, monomial }) => {
    const out: Record<string, number> = {};
    for (const v of p.vars) {
      const e = monomial[v] ?? 0;
      const target = from.includes(v) ? pairs[v] : v;
      out[target] = (out[target] ?? 0) + (from.includes(v) ? degOf.get(v)! - e : e);
    }
    return { coefficient, monomial: out };
  });
  const multiplier: Record<string, number> = {};
  for (const g of from) multiplier[pairs[g]] = degOf.get(g)!;
  return { poly: Poly.fromTerms(terms), multiplier: Poly.monomial(1, multiplier) };
}
