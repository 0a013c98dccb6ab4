import type { Rational, RationalFunction } from "@/lib/engine";

export interface SweepRequest {
  symbol: string;
  fromDecade: number;
  toDecade: number;
  pointsPerDecade: number;
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
  const { symbol, fromDecade, toDecade, pointsPerDecade } = request;
  if (!Number.isFinite(fromDecade) || !Number.isFinite(toDecade) || toDecade <= fromDecade) {
    return { kind: "invalid", reason: "The upper decade must be above the lower one." };
  }
  if (toDecade - fromDecade > 24) return { kind: "invalid", reason: "At most 24 decades at once." };
  const others = { ...fixed };
  delete others[symbol];
  const reduced = rf.substitute(others);
  const missing = reduced.variables().filter((v) => v !== symbol);
  if (missing.length > 0) return { kind: "missing", symbols: missing };
  const count = Math.round((toDecade - fromDecade) * pointsPerDecade) + 1;
  const x: number[] = [];
  const y: number[] = [];
  for (let i = 0; i < count; i += 1) {
    const xi = 10 ** (fromDecade + i / pointsPerDecade);
    x.push(xi);
    const yi = reduced.evaluate({ [symbol]: xi });
    y.push(Number.isFinite(yi) ? yi : Number.NaN);
  }
  return { kind: "ok", x, y, atInfinity: finiteLimit(reduced, symbol, "inf"), atZero: finiteLimit(reduced, symbol, "zero") };
}

export function sweepCsv(symbol: string, resultLabel: string, unit: string, x: number[], y: number[]): string {
  const header = `${symbol},${resultLabel}${unit ? ` (${unit})` : ""}`;
  return [header, ...x.map((xi, i) => `${xi},${Number.isNaN(y[i]) ? "" : y[i]}`)].join("\n") + "\n";
}

