// Printing a polynomial: plain infix (read back by our reader and by sympy) and TeX.

import { bigGcd } from "./rational";
import { texName } from "./names";
import type { Poly } from "./polynomial";
import { CHAIN_MIN_TERMS, productChain } from "./polynomial-calculus";
import { scratchUint8 } from "./scratch";

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
 * as "\\frac{n}{d} m" in TeX. Short and long polynomials print the same text by two routes.
 */
function printTerms(
  p: Poly, names: readonly string[], times: string, power: (name: string, k: number) => string, fraction: (n: string, d: string) => string, tex: boolean,
): string {
  return (p.coefs.length < CHAIN_MIN_TERMS ? printShortTerms : printLongTerms)(p, names, times, power, fraction, tex);
}

/** A short polynomial's terms, each one string built by concatenation (a byte buffer costs more there). */
function printShortTerms(
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
    const { neg, absNum, den } = termCoefficient(p.coefs[t], p.den);
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

/** A long polynomial's terms, as bytes in one buffer. */
function printLongTerms(
  p: Poly, names: readonly string[], times: string, power: (name: string, k: number) => string, fraction: (n: string, d: string) => string, tex: boolean,
): string {
  const n = p.coefs.length;
  // The text is written as UTF-8 bytes into one buffer and decoded once (a long result has
  // hundreds of thousands of terms). Term t's monomial starts with the monomial of term t − 1 up
  // to the end of the factors they share (p's product chain), copied within the buffer.
  const { shared, start, factorVar, factorExp, depth } = productChain(p);
  const factorText = new Map<number, { first: Uint8Array; later: Uint8Array }>();
  const factor = (v: number, k: number, first: boolean): Uint8Array => {
    const key = v * 65536 + k;
    let f = factorText.get(key);
    if (f === undefined) {
      const text = k === 1 ? names[v] : power(names[v], k);
      f = { first: UTF8.encode(text), later: UTF8.encode(times + text) };
      factorText.set(key, f);
    }
    return first ? f.first : f.later;
  };
  // ends[j]: bytes of the first j factors of the current monomial.
  const ends = new Int32Array(depth + 1);
  // Size the buffer from the monomials' lengths (a few bytes of sign; coefficients other than ±1
  // are guessed and the buffer grows when the guess is short).
  let size = 0;
  for (let t = 0; t < n; t++) {
    let j = shared[t];
    for (let f = start[t]; f < start[t + 1]; f++, j++) ends[j + 1] = ends[j] + factor(factorVar[f], factorExp[f], j === 0).length;
    const c = p.coefs[t];
    size += ends[j] + 3 + (p.den === 1n && (c === 1n || c === -1n) ? 0 : 24);
  }
  const out = new ByteWriter(size);
  let previous = 0;
  for (let t = 0; t < n; t++) {
    const { neg, absNum, den } = termCoefficient(p.coefs[t], p.den);
    if (t > 0) out.ascii(neg ? " - " : " + ");
    else if (neg) out.ascii("-");
    const same = shared[t];
    const from = start[t];
    const to = start[t + 1];
    if (same === 0 && from === to) {
      out.text(den === 1n ? absNum.toString() : fraction(absNum.toString(), den.toString()));
      continue;
    }
    if (tex && den !== 1n) out.text(fraction(absNum.toString(), den.toString()) + "\\,");
    else if (absNum !== 1n) out.text(absNum.toString() + times);
    const mono = out.length;
    out.copyWithin(previous, ends[same]);
    for (let f = from, j = same; f < to; f++) {
      out.bytes(factor(factorVar[f], factorExp[f], j === 0));
      ends[++j] = out.length - mono;
    }
    previous = mono;
    if (!tex && den !== 1n) out.ascii(`/${den}`);
  }
  return out.toString();
}

/** The coefficient c/den of one term in lowest terms, as its sign, |numerator| and denominator. */
function termCoefficient(c: bigint, den: bigint): { neg: boolean; absNum: bigint; den: bigint } {
  if (den !== 1n) {
    const g = bigGcd(c, den);
    if (g !== 1n) {
      c /= g;
      den /= g;
    }
  }
  return { neg: c < 0n, absNum: c < 0n ? -c : c, den };
}

const UTF8 = new TextEncoder();
const DECODE = new TextDecoder();

/**
 * A growing byte buffer for printed text; offsets into it stay valid as it grows. Its bytes are a
 * scratch array (scratch.ts), reused by the next printing: one writer at a time.
 */
class ByteWriter {
  private buf: Uint8Array;
  length = 0;

  constructor(expected: number) {
    this.buf = scratchUint8("printed-bytes", Math.max(64, expected));
  }

  private room(more: number): void {
    if (this.length + more <= this.buf.length) return;
    const old = this.buf;
    this.buf = scratchUint8("printed-bytes", Math.max(old.length * 2, this.length + more));
    this.buf.set(old.subarray(0, this.length));
  }

  bytes(b: Uint8Array): void {
    this.room(b.length);
    if (b.length < 16) for (let i = 0; i < b.length; i++) this.buf[this.length + i] = b[i];
    else this.buf.set(b, this.length);
    this.length += b.length;
  }

  /** Text of ASCII characters only (signs, digits, "/"). */
  ascii(s: string): void {
    this.room(s.length);
    for (let i = 0; i < s.length; i++) this.buf[this.length + i] = s.charCodeAt(i);
    this.length += s.length;
  }

  text(s: string): void {
    this.bytes(UTF8.encode(s));
  }

  /** Append `count` bytes already written at `from`. */
  copyWithin(from: number, count: number): void {
    this.room(count);
    this.buf.copyWithin(this.length, from, from + count);
    this.length += count;
  }

  toString(): string {
    return DECODE.decode(this.buf.subarray(0, this.length));
  }
}
