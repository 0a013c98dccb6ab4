// Approximations with a stated error (simplification after generation): at a design point (the
// Values), optionally over a frequency band (s = j·2πf) or over a ± tolerance box around the
// point, drop the terms of N and D whose summed magnitude stays under a share of ε of their
// polynomial's magnitude, then measure the error the simplified N/D actually makes over the
// band or the box and report the largest. The exact result is kept beside it.

import { Poly, RationalFunction } from "../algebra";
import type { ResultName, Step } from "../types";
import { LAPLACE } from "./values";

export interface ErrorBoundOptions {
  /** Largest relative error allowed (default 0.05). */
  epsilon?: number;
  /** Frequency band in Hz [from, to]; a result in s is approximated only over a band. */
  band?: [number, number];
  /** Relative tolerance of every value (0.2 = ±20 %): the error is also measured over that box. */
  tolerance?: number;
  /** Terms never dropped / always dropped, named by their monomial ("gm2*ro1*ro2", "1"). */
  keep?: string[];
  drop?: string[];
}

export interface BoundedApproximation {
  exact: string;
  approximate: string;
  approximateTex: string;
  compact: string;
  dropped: { numerator: string[]; denominator: string[] };
  /** The terms left in the approximate form, named as in `dropped`. */
  kept: { numerator: string[]; denominator: string[] };
  /** Largest relative error |F~ − F| / |F| measured over the band and/or the tolerance box. */
  maxError: number;
  /** Where it was measured: "point", "band", "box" or "band and box". */
  over: string;
}

export interface BoundedApproximationReport {
  epsilon: number;
  band: [number, number] | null;
  tolerance: number | null;
  results: Partial<Record<ResultName, BoundedApproximation>>;
}

type Complex = [number, number];

const mul = (a: Complex, b: Complex): Complex => [a[0] * b[0] - a[1] * b[1], a[0] * b[1] + a[1] * b[0]];
const abs = (a: Complex) => Math.hypot(a[0], a[1]);

/** The monomial of term t printed without its coefficient ("1" for the constant term). */
function monomialName(m: Record<string, number>): string {
  const parts = Object.keys(m).sort().map((v) => (m[v] === 1 ? v : `${v}^${m[v]}`));
  return parts.length === 0 ? "1" : parts.join("*");
}

/** Each term's complex value at every sample point (s = j·ω at that sample). */
function termValues(p: Poly, samples: ReadonlyArray<{ point: Record<string, number>; omega: number }>): Complex[][] {
  return p.terms().map(({ coefficient, monomial }) =>
    samples.map(({ point, omega }) => {
      let v: Complex = [coefficient.toNumber(), 0];
      for (const [name, e] of Object.entries(monomial)) {
        const base: Complex = name === LAPLACE ? [0, omega] : [point[name], 0];
        for (let k = 0; k < e; k++) v = mul(v, base);
      }
      return v;
    }),
  );
}

/**
 * Terms to drop from p: smallest first, while at every sample the summed magnitude of the dropped
 * terms stays within share·|p|. Locked terms are kept or dropped whatever their size.
 */
function droppable(p: Poly, values: Complex[][], share: number, keep: ReadonlySet<string>, drop: ReadonlySet<string>): Set<number> {
  const terms = p.terms();
  const n = values[0]?.length ?? 0;
  const total = Array.from({ length: n }, (_, k) => abs(values.reduce<Complex>((acc, t) => [acc[0] + t[k][0], acc[1] + t[k][1]], [0, 0])));
  const weight = values.map((t) => Math.max(...t.map((v, k) => abs(v) / Math.max(total[k], 1e-300))));
  const order = terms.map((_, i) => i).sort((a, b) => weight[a] - weight[b]);
  const out = new Set<number>();
  const used = new Array<number>(n).fill(0);
  terms.forEach((t, i) => {
    if (drop.has(monomialName(t.monomial))) out.add(i);
  });
  for (const i of order) {
    const name = monomialName(terms[i].monomial);
    if (keep.has(name) || out.has(i) || out.size + 1 >= terms.length) continue;
    const next = used.map((u, k) => u + abs(values[i][k]));
    if (next.every((u, k) => u <= share * total[k])) {
      out.add(i);
      next.forEach((u, k) => (used[k] = u));
    }
  }
  return out;
}

function without(p: Poly, dropped: ReadonlySet<number>): Poly {
  if (dropped.size === 0) return p;
  return Poly.fromTerms(p.terms().filter((_, i) => !dropped.has(i)));
}

function valueAt(f: RationalFunction, point: Record<string, number>, omega: number): Complex {
  const at = (p: Poly): Complex =>
    termValues(p, [{ point, omega }]).reduce<Complex>((acc, t) => [acc[0] + t[0][0], acc[1] + t[0][1]], [0, 0]);
  const n = at(f.num);
  const d = at(f.den);
  const dd = d[0] * d[0] + d[1] * d[1];
  return [(n[0] * d[0] + n[1] * d[1]) / dd, (n[1] * d[0] - n[0] * d[1]) / dd];
}

/** Seeded corners and inner points of the ± tolerance box (the nominal point first). */
function boxPoints(nominal: Record<string, number>, tolerance: number): Record<string, number>[] {
  const names = Object.keys(nominal).sort();
  let seed = 0x2545f491;
  const random = () => ((seed = (seed * 1103515245 + 12345) >>> 0) / 4294967296);
  const points = [nominal];
  for (let k = 0; k < 64; k++) {
    const p: Record<string, number> = {};
    // Half the samples at corners (where multilinear errors peak), half inside.
    for (const v of names) p[v] = nominal[v] * (1 + tolerance * (k % 2 === 0 ? (random() < 0.5 ? -1 : 1) : 2 * random() - 1));
    points.push(p);
  }
  return points;
}

function bandOmegas(band: [number, number] | null): number[] {
  if (!band) return [0];
  const [lo, hi] = band;
  const from = Math.log10(Math.max(lo, 1e-9));
  const to = Math.log10(Math.max(hi, lo, 1e-9));
  return Array.from({ length: 41 }, (_, k) => 2 * Math.PI * 10 ** (from + ((to - from) * k) / 40));
}

/** Approximate one result within ε at the design point (and band / box); null when a symbol has no value. */
export function boundedApproximation(f: RationalFunction, nominal: Record<string, number>, options: ErrorBoundOptions): BoundedApproximation | null {
  const epsilon = options.epsilon ?? 0.05;
  const symbols = f.variables().filter((v) => v !== LAPLACE);
  const hasS = f.variables().includes(LAPLACE);
  if (symbols.some((v) => !Number.isFinite(nominal[v])) || (hasS && !options.band)) return null;
  const omegas = hasS ? bandOmegas(options.band ?? null) : [0];
  const points = options.tolerance ? boxPoints(nominal, options.tolerance) : [nominal];
  const samples = points.flatMap((point) => omegas.map((omega) => ({ point, omega })));
  const keep = new Set(options.keep ?? []);
  const drop = new Set(options.drop ?? []);
  const numValues = termValues(f.num, samples);
  const denValues = termValues(f.den, samples);
  const measure = (g: RationalFunction) =>
    Math.max(
      ...samples.map(({ point, omega }) => {
        const a = valueAt(f, point, omega);
        const b = valueAt(g, point, omega);
        return abs([b[0] - a[0], b[1] - a[1]]) / Math.max(abs(a), 1e-300);
      }),
    );
  // Half of ε for each of N and D (their relative errors add to first order); halved again while the measured error exceeds ε.
  let share = epsilon / 2;
  let best: { g: RationalFunction; dn: Set<number>; dd: Set<number>; err: number } | null = null;
  for (let attempt = 0; attempt < 6; attempt++, share /= 2) {
    const dn = droppable(f.num, numValues, share, keep, drop);
    const dd = droppable(f.den, denValues, share, keep, drop);
    const g = dn.size + dd.size === 0 ? f : RationalFunction.from(without(f.num, dn), without(f.den, dd));
    const err = measure(g);
    best = { g, dn, dd, err };
    if (err <= epsilon || drop.size > 0) break;
  }
  const names = (p: Poly, set: Set<number>, inSet = true) => p.terms().filter((_, i) => set.has(i) === inSet).map((t) => monomialName(t.monomial));
  const over = options.tolerance ? (hasS && options.band ? "band and box" : "box") : hasS && options.band ? "band" : "point";
  return {
    exact: f.toInfix(),
    approximate: best!.g.toInfix(),
    approximateTex: best!.g.toTex(),
    compact: best!.g.compactInfix(),
    dropped: { numerator: names(f.num, best!.dn), denominator: names(f.den, best!.dd) },
    kept: { numerator: names(f.num, best!.dn, false), denominator: names(f.den, best!.dd, false) },
    maxError: best!.err,
    over,
  };
}

const TEX_NAME: Record<ResultName, string> = { vth: "V_{th}", isc: "I_{sc}", rth: "Z_{th}", rthFromVocIsc: "V_{oc}/I_{sc}" };
const LABEL: Record<ResultName, string> = { vth: "Vth", isc: "Isc", rth: "Rth/Zth", rthFromVocIsc: "Voc/Isc" };

/** Vth, Rth/Zth and Isc approximated within ε, each with a ledger step of kind "approximation". */
export function boundedApproximationsOf(
  results: Partial<Record<ResultName, RationalFunction | null>>,
  nominal: Record<string, number>,
  options: ErrorBoundOptions,
): { report: BoundedApproximationReport; steps: Step[]; missing: string[]; needsBand: boolean } {
  const epsilon = options.epsilon ?? 0.05;
  const report: BoundedApproximationReport = { epsilon, band: options.band ?? null, tolerance: options.tolerance ?? null, results: {} };
  const steps: Step[] = [];
  const missing = new Set<string>();
  let needsBand = false;
  for (const r of ["vth", "rth", "isc"] as const) {
    const f = results[r];
    if (!f || f.isZero()) continue;
    const a = boundedApproximation(f, nominal, options);
    if (a === null) {
      for (const v of f.variables()) if (v !== LAPLACE && !Number.isFinite(nominal[v])) missing.add(v);
      if (f.variables().includes(LAPLACE) && !options.band) needsBand = true;
      continue;
    }
    report.results[r] = a;
    const where = a.over === "point" ? "at the design point" : a.over === "band" ? "over the band" : a.over === "box" ? "over the tolerance box" : "over the band and the tolerance box";
    const count = a.dropped.numerator.length + a.dropped.denominator.length;
    steps.push({
      id: `approx-bound.${r}`,
      kind: "approximation",
      title: `${LABEL[r]} within ${(epsilon * 100).toFixed(1)} %`,
      explanation:
        count === 0
          ? `No term of ${LABEL[r]} is small enough to drop within ${(epsilon * 100).toFixed(1)} %: the exact form stands.`
          : `At the design point, ${count} term${count > 1 ? "s" : ""} whose contribution stays under the bound ${count > 1 ? "are" : "is"} dropped (numerator: ${a.dropped.numerator.join(", ") || "none"}; denominator: ${a.dropped.denominator.join(", ") || "none"}). Largest error actually incurred ${where}: ${(a.maxError * 100).toPrecision(3)} %.`,
      tex: `${TEX_NAME[r]} = ${f.toTex()} \\;\\approx\\; ${a.approximateTex} \\quad (\\text{error} \\le ${(a.maxError * 100).toPrecision(3)}\\,\\%)`,
      data: { result: r, epsilon, exact: a.exact, approximate: a.approximate, dropped: a.dropped, maxError: a.maxError, over: a.over },
    });
  }
  return { report, steps, missing: [...missing].sort(), needsBand };
}
