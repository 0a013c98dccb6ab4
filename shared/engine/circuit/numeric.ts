// Floating-point solve of the same nodal system: the numeric check of the exact results, and the
// scaling test of the dimension check.

import type { Poly } from "../algebra";
import type { Port } from "../types";
import type { NodalSystem } from "./mna";
import { portVector, shortPort } from "./ports";

/** Gaussian elimination with partial pivoting; null when a pivot is negligible (singular). */
function solveFloat(a: number[][], b: number[]): number[] | null {
  const n = b.length;
  const m = a.map((row, i) => [...row, b[i]]);
  const scale = Math.max(1e-300, ...a.flat().map(Math.abs));
  for (let k = 0; k < n; k++) {
    let p = k;
    for (let i = k + 1; i < n; i++) if (Math.abs(m[i][k]) > Math.abs(m[p][k])) p = i;
    if (Math.abs(m[p][k]) <= 1e-12 * scale) return null;
    [m[k], m[p]] = [m[p], m[k]];
    for (let i = k + 1; i < n; i++) {
      const f = m[i][k] / m[k][k];
      if (f === 0) continue;
      for (let j = k; j <= n; j++) m[i][j] -= f * m[k][j];
    }
  }
  const x = new Array<number>(n).fill(0);
  for (let i = n - 1; i >= 0; i--) {
    let s = m[i][n];
    for (let j = i + 1; j < n; j++) s -= m[i][j] * x[j];
    x[i] = s / m[i][i];
  }
  return x;
}

/** Values of the internal variables at a point given in user symbols. */
function internalValues(sys: NodalSystem, point: Record<string, number>): Record<string, number> {
  const out: Record<string, number> = { ...point };
  for (const s of sys.internals) out[s.name] = s.value.evaluate(point);
  return out;
}

function evaluateMatrix(a: Poly[][], at: Record<string, number>): number[][] {
  return a.map((row) => row.map((p) => (p.isZero() ? 0 : p.evaluate(at))));
}

export interface FloatPortValues {
  vth: number | null;
  rth: number | null;
  isc: number | null;
}

/** Vth, Rth and Isc in floating point at one point (user symbols, every symbol given). */
export function floatPortValues(sys: NodalSystem, port: Port, point: Record<string, number>): FloatPortValues {
  const at = internalValues(sys, point);
  const a = evaluateMatrix(sys.a, at);
  const b = sys.b.map((p) => (p.isZero() ? 0 : p.evaluate(at)));
  const c = portVector(sys, port).map((p) => (p.isZero() ? 0 : p.evaluate({})));
  const dot = (x: number[]) => x.reduce((s, xi, i) => s + xi * c[i], 0);
  const open = solveFloat(a, b);
  const test = solveFloat(a, c);
  const short = shortPort(sys, port, a, b, { add: (x: number, y: number) => x + y });
  const xs = solveFloat(short.a, short.b);
  const isc = xs === null ? null : short.sign * (short.probeRhs - short.probeRow.reduce((s, r, i) => s + r * xs[i], 0));
  return { vth: open === null ? null : dot(open), rth: test === null ? null : dot(test), isc };
}

/** A deterministic pseudo-random generator (mulberry32), so checks repeat for the same input. */
export function seededRandom(seed: number): () => number {
  let t = seed >>> 0;
  return () => {
    t = (t + 0x6d2b79f5) >>> 0;
    let r = Math.imul(t ^ (t >>> 15), 1 | t);
    r = (r + Math.imul(r ^ (r >>> 7), 61 | r)) ^ r;
    return ((r ^ (r >>> 14)) >>> 0) / 4294967296;
  };
}

export function hashString(text: string): number {
  let h = 2166136261;
  for (let i = 0; i < text.length; i++) {
    h ^= text.charCodeAt(i);
    h = Math.imul(h, 16777619);
  }
  return h >>> 0;
}
