import type { Rational, RationalFunction } from "@/lib/engine";

export interface SweepRequest {
  symbol: string;
  from: number;
  to: number;
  /** Log: points spaced evenly in decades (from and to above zero); linear: evenly in value. */
  scale: "log" | "linear";
}

export const POINTS_PER_DECADE = 40;
const LINEAR_POINTS = 201;
export const MAX_DECADES = 24;

/** Why a range cannot be drawn on a log axis, or null when it can. */
export function notLogRange(from: number, to: number): string | null {
  if (from > 0 && to > 0) return null;
  const touches = from === 0 || to === 0;
  return `The range ${touches ? "touches" : from < 0 && to < 0 ? "lies below" : "crosses"} zero: a log axis cannot show it.`;
}

/** The swept points: evenly in decades on a log axis, evenly in value on a linear one. */
export function sweepPoints(from: number, to: number, scale: "log" | "linear"): number[] {
  if (scale === "linear") return Array.from({ length: LINEAR_POINTS }, (_, i) => from + ((to - from) * i) / (LINEAR_POINTS - 1));
  const [a, b] = [Math.log10(from), Math.log10(to)];
  const count = Math.max(2, Math.round((b - a) * POINTS_PER_DECADE) + 1);
  return Array.from({ length: count }, (_, i) => (i === 0 ? from : i === count - 1 ? to : 10 ** (a + ((b - a) * i) / (count - 1))));
}

export type SweepOutcome =
  | { kind: "missing"; symbols: string[] }
  | { kind: "invalid"; reason: string }
  | {
      kind: "ok";
      x: number[];
      y: number[];
      /** Finite limits of the swept result, drawn as asymptotes; null when unbounded. */
      atInfinity: number | null;
      atZero: number | null;
    };

function finiteLimit(rf: RationalFunction, symbol: string, to: "inf" | "zero"): number | null {
  try {
    const limit = rf.limit(symbol, to);
    if (limit.kind !== "finite") return null;
    const value = limit.value.constantValue();
    return value ? value.toNumber() : null;
  } catch {
    return null;
  }
}

// Substitute the fixed symbols exactly once, then evaluate the one-variable function in floats per point.
export function sweepResult(rf: RationalFunction, request: SweepRequest, fixed: Record<string, Rational>): SweepOutcome {
  const { symbol, from, to, scale } = request;
  if (!Number.isFinite(from) || !Number.isFinite(to) || to <= from) return { kind: "invalid", reason: "The sweep's end must be above its start." };
  if (scale === "log") {
    const notLog = notLogRange(from, to);
    if (notLog) return { kind: "invalid", reason: notLog };
    if (Math.log10(to / from) > MAX_DECADES) return { kind: "invalid", reason: `At most ${MAX_DECADES} decades at once.` };
  }
  const others = { ...fixed };
  delete others[symbol];
  const reduced = rf.substitute(others);
  const missing = reduced.variables().filter((v) => v !== symbol);
  if (missing.length > 0) return { kind: "missing", symbols: missing };
  const x = sweepPoints(from, to, scale);
  const y = x.map((xi) => {
    const yi = reduced.evaluate({ [symbol]: xi });
    return Number.isFinite(yi) ? yi : Number.NaN;
  });
  return { kind: "ok", x, y, atInfinity: finiteLimit(reduced, symbol, "inf"), atZero: finiteLimit(reduced, symbol, "zero") };
}

export function sweepCsv(symbol: string, resultLabel: string, unit: string, x: number[], y: number[]): string {
  const header = `${symbol},${resultLabel}${unit ? ` (${unit})` : ""}`;
  return [header, ...x.map((xi, i) => `${xi},${Number.isNaN(y[i]) ? "" : y[i]}`)].join("\n") + "\n";
}

