// Printing a polynomial: plain infix (read back by our reader and by sympy) and TeX.

import { bigGcd } from "./rational";
import { texName } from "./names";
import type { Poly } from "./polynomial";

/** Plain infix, e.g. "R0*mu + R0 - 2*gm^2"; sympy-parsable once ^ is read as power. */
export function polyInfix(p: Poly): string {
  return printTerms(p, p.vars, "*", (name, k) => `${name}^${k}`, (n, d) => `${n}/${d}`, false);
}

/** TeX, e.g. "R_{0}\\,\\mu + R_{0}"; a thin space keeps multi-letter symbols apart (Rs\\,s, not Rss). */
export function polyTex(p: Poly): string {
  return printTerms(p, p.vars.map(texName), "\\,", (name, k) => `${name}^{${k}}`, (n, d) => `\\frac{${n}}{${d}}`, true);
}

/**
 * Terms joined by " + " / " - ". A coefficient n/d prints as "n*m/d" in infix (so "x/2") and
 * as "\\frac{n}{d} m" in TeX.
 */
function printTerms(
  p: Poly, names: readonly string[], times: string, power: (name: string, k: number) => string, fraction: (n: string, d: string) => string, tex: boolean,
): string {
  const n = p.coefs.length;
  if (n === 0) return "0";
  const nv = p.vars.length;
  const e = p.exps;
  // Each term is one string built by concatenation, and the terms are joined in chunks (markedly
  // faster than one huge join); "*R2" is one piece, made once per variable.
  const afterTimes = names.map((name) => times + name);
  const chunks: string[] = [];
  let pieces: string[] = [];
  for (let t = 0; t < n; t++) {
    if (pieces.length >= 256) {
      chunks.push(pieces.join(""));
      pieces = [];
    }
    let num = p.coefs[t];
    let den = p.den;
    if (den !== 1n) {
      const g = bigGcd(num, den);
      if (g !== 1n) {
        num /= g;
        den /= g;
      }
    }
    const neg = num < 0n;
    const absNum = neg ? -num : num;
    let term = t > 0 ? (neg ? " - " : " + ") : neg ? "-" : "";
    const o = t * nv;
    let mono = "";
    for (let v = 0; v < nv; v++) {
      const k = e[o + v];
      if (k === 0) continue;
      if (k === 1) mono += mono === "" ? names[v] : afterTimes[v];
      else mono += mono === "" ? power(names[v], k) : times + power(names[v], k);
    }
    if (mono === "") {
      pieces.push(term + (den === 1n ? absNum.toString() : fraction(absNum.toString(), den.toString())));
      continue;
    }
    if (tex && den !== 1n) term += fraction(absNum.toString(), den.toString()) + "\\,";
    else if (absNum !== 1n) term += absNum.toString() + times;
    term += mono;
    if (!tex && den !== 1n) term += `/${den}`;
    pieces.push(term);
  }
  chunks.push(pieces.join(""));
  return chunks.join("");
}
