// Frequency behaviour of the port results in the Laplace variable s: the DC (s -> 0) and
// high-frequency (s -> inf) equivalents taken exactly, numeric poles and zeros once every other
// symbol has a value, and F(j·2πf) for a Bode plot.

import findRoots from "durand-kerner";
import type { Rational, RationalFunction } from "../algebra";
import type { ResultName } from "../types";
import type { IndependentSource } from "./sources";
import { LAPLACE } from "./values";

/** One result at a frequency limit: finite (value), unbounded, or absent for this port. */
export interface FrequencyLimitValue {
  kind: "finite" | "infinite" | "none";
  value: string | null;
  tex: string | null;
}

/** The port's equivalent at a frequency limit: Vth, Rth (Zth) and Isc there. */
export interface FrequencyEquivalent {
  vth: FrequencyLimitValue;
  rth: FrequencyLimitValue;
  isc: FrequencyLimitValue;
}

/** A root of a polynomial in s, in rad/s; hz is its distance from the origin divided by 2π. */
export interface SRoot {
  re: number;
  im: number;
  hz: number;
}

export interface PolesZeros {
  poles: SRoot[];
  zeros: SRoot[];
}

export interface FrequencyReport {
  variable: typeof LAPLACE;
  /** s -> 0: capacitors open, inductors shorted. */
  dc: FrequencyEquivalent;
  /** s -> inf: capacitors shorted, inductors open. */
  hf: FrequencyEquivalent;
  /** Numeric poles and zeros per result, once every other symbol has a value; symbols still missing otherwise. */
  roots: { results: Partial<Record<ResultName, PolesZeros>>; missing: string[] };
}

type FrequencyResults = Partial<Record<ResultName, RationalFunction | null>>;

/**
 * What Vth(s) is a response to. With exactly one independent source, Vth divided by its value: the
 * port's open-circuit transfer (V/V from a voltage source, V/A = Ω from a current source). With
 * several, Vth itself (every source at its own value); with none, Vth is zero.
 */
export type OpenCircuitTransfer =
  | { kind: "transfer"; source: IndependentSource; transfer: RationalFunction }
  | { kind: "several"; sources: IndependentSource[] }
  | { kind: "none" }
  | { kind: "unknown" };

export function openCircuitTransfer(vth: RationalFunction | null | undefined, sources: IndependentSource[] | null): OpenCircuitTransfer {
  if (sources === null || !vth) return { kind: "unknown" };
  if (sources.length === 0) return { kind: "none" };
  if (sources.length > 1) return { kind: "several", sources };
  return { kind: "transfer", source: sources[0], transfer: vth.div(sources[0].value) };
}

/** Whether any result depends on s (only then is there a frequency report). */
function dependsOnFrequency(results: FrequencyResults): boolean {
  return Object.values(results).some((f) => f != null && f.variables().includes(LAPLACE));
}

export function frequencyLimit(f: RationalFunction | null | undefined, to: "zero" | "inf"): FrequencyLimitValue {
  if (!f) return { kind: "none", value: null, tex: null };
  const lim = f.limit(LAPLACE, to);
  if (lim.kind === "infinite") return { kind: "infinite", value: null, tex: null };
  return { kind: "finite", value: lim.value.toInfix(), tex: lim.value.toTex() };
}

function equivalentAt(results: FrequencyResults, to: "zero" | "inf"): FrequencyEquivalent {
  return { vth: frequencyLimit(results.vth, to), rth: frequencyLimit(results.rth, to), isc: frequencyLimit(results.isc, to) };
}

/** The whole report; null when no result depends on s. */
export function frequencyReport(results: FrequencyResults, values: Record<string, Rational> = {}): FrequencyReport | null {
  if (!dependsOnFrequency(results)) return null;
  const roots: FrequencyReport["roots"] = { results: {}, missing: [] };
  const missing = new Set<string>();
  for (const r of ["vth", "rth", "isc"] as const) {
    const f = results[r];
    if (!f) continue;
    const pz = polesAndZeros(f, values);
    if ("missing" in pz) pz.missing.forEach((m) => missing.add(m));
    else roots.results[r] = pz;
  }
  roots.missing = [...missing].sort();
  return { variable: LAPLACE, dc: equivalentAt(results, "zero"), hf: equivalentAt(results, "inf"), roots };
}

/** Coefficients in s (increasing degree) as floats, after substituting every other symbol; or the symbols missing. */
export function numericCoefficientsInS(f: RationalFunction, values: Record<string, Rational>): { num: number[]; den: number[] } | { missing: string[] } {
  const g = f.substitute(values);
  const missing = g.variables().filter((v) => v !== LAPLACE);
  if (missing.length > 0) return { missing };
  const coefficients = (p: RationalFunction["num"]) =>
    p.variables().includes(LAPLACE) ? p.coefficientsIn(LAPLACE).map((c) => c.constantValue()?.toNumber() ?? 0) : [p.constantValue()?.toNumber() ?? 0];
  return { num: coefficients(g.num), den: coefficients(g.den) };
}

/** Poles (roots of the denominator) and zeros (of the numerator), numeric, sorted by frequency. */
export function polesAndZeros(f: RationalFunction, values: Record<string, Rational>): PolesZeros | { missing: string[] } {
  const c = numericCoefficientsInS(f, values);
  if ("missing" in c) return c;
  return { poles: polynomialRoots(c.den), zeros: polynomialRoots(c.num) };
}

/**
 * Complex roots of Σ c_k s^k (increasing degree), by the Durand–Kerner (Weierstrass) iteration.
 * Roots at s = 0 are split off exactly; the rest are found on s = σ z with σ the geometric mean
 * of the roots' moduli, so the iteration works near |z| = 1 whatever the component values.
 */
export function polynomialRoots(coefficients: readonly number[]): SRoot[] {
  let c = [...coefficients];
  while (c.length > 0 && c[c.length - 1] === 0) c.pop();
  const zeroRoots: SRoot[] = [];
  while (c.length > 1 && c[0] === 0) {
    c = c.slice(1);
    zeroRoots.push({ re: 0, im: 0, hz: 0 });
  }
  const n = c.length - 1;
  if (n < 1) return zeroRoots;
  const sigma = Math.pow(Math.abs(c[0] / c[n]), 1 / n);
  const scaled = c.map((a, k) => a * Math.pow(sigma, k));
  const lead = scaled[n];
  const monic = scaled.map((a) => a / lead);
  // Deterministic start: points on a slightly rotated circle (the package would pick random ones).
  const zr: number[] = [];
  const zi: number[] = [];
  for (let k = 0; k < n; k++) {
    const angle = (2 * Math.PI * k) / n + 0.4;
    zr.push(0.9 * Math.cos(angle));
    zi.push(0.9 * Math.sin(angle));
  }
  const [re, im] = findRoots(monic, null, 500 * n, 1e-15, zr, zi);
  const roots: SRoot[] = [];
  for (let k = 0; k < n; k++) {
    // A part at rounding level of the root's size is zero (real roots, roots on the jω axis).
    const size = Math.hypot(re[k], im[k]);
    const y = Math.abs(im[k]) < 1e-9 * size ? 0 : im[k] * sigma;
    const x = Math.abs(re[k]) < 1e-12 * size ? 0 : re[k] * sigma;
    roots.push({ re: x, im: y, hz: Math.hypot(x, y) / (2 * Math.PI) });
  }
  return [...zeroRoots, ...roots].sort((a, b) => a.hz - b.hz || a.im - b.im);
}

/** F(j·2πf) as magnitude and phase in degrees at each frequency (Hz), from coefficients in s. */
export function frequencyResponse(c: { num: number[]; den: number[] }, frequencies: readonly number[]): { magnitude: number[]; phase: number[] } {
  const magnitude: number[] = [];
  const phase: number[] = [];
  for (const f of frequencies) {
    const w = 2 * Math.PI * f;
    const [nr, ni] = hornerImaginary(c.num, w);
    const [dr, di] = hornerImaginary(c.den, w);
    const d = dr * dr + di * di;
    const re = (nr * dr + ni * di) / d;
    const im = (ni * dr - nr * di) / d;
    magnitude.push(Math.hypot(re, im));
    phase.push((Math.atan2(im, re) * 180) / Math.PI);
  }
  return { magnitude, phase: unwrapDegrees(phase) };
}

// Σ c_k (jω)^k by Horner's rule in complex arithmetic.
function hornerImaginary(c: readonly number[], w: number): [number, number] {
  let re = 0;
  let im = 0;
  for (let k = c.length - 1; k >= 0; k--) {
    const r = -im * w + c[k];
    im = re * w;
    re = r;
  }
  return [re, im];
}

// A phase plot reads best without 360° jumps.
function unwrapDegrees(phase: number[]): number[] {
  const out: number[] = [];
  let offset = 0;
  for (let i = 0; i < phase.length; i++) {
    if (i > 0) {
      const step = phase[i] + offset - out[i - 1];
      if (step > 180) offset -= 360;
      else if (step < -180) offset += 360;
    }
    out.push(phase[i] + offset);
  }
  return out;
}

/** Logarithmically spaced frequencies from fMin to fMax (Hz), n points. */
export function logFrequencies(fMin: number, fMax: number, n: number): number[] {
  const a = Math.log10(fMin);
  const b = Math.log10(fMax);
  return Array.from({ length: n }, (_, i) => Math.pow(10, a + ((b - a) * i) / (n - 1)));
}

/** A frequency span that shows every pole and zero with two decades either side (1 Hz – 1 MHz without any). */
export function frequencySpan(pz: PolesZeros[]): [number, number] {
  const hz = pz.flatMap((p) => [...p.poles, ...p.zeros]).map((r) => r.hz).filter((h) => h > 0 && Number.isFinite(h));
  if (hz.length === 0) return [1, 1e6];
  const lo = Math.floor(Math.log10(Math.min(...hz))) - 2;
  const hi = Math.ceil(Math.log10(Math.max(...hz))) + 2;
  return [Math.pow(10, lo), Math.pow(10, Math.max(hi, lo + 3))];
}
