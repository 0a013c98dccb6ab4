// Design solve: which value of one symbol makes a result meet a target, with the other symbols
// at their given values. Exact when the result is linear-fractional in the symbol (the algebra's
// solveFor); numeric real roots when it is of higher degree and everything else is a number.

import { Rational, RationalFunction } from "../algebra";
import type { Quantity } from "../types";
import { polynomialRoots } from "./frequency";

export type DesignSolveAnswer =
  | { kind: "exact"; value: RationalFunction; number: number | null }
  | { kind: "numeric"; numbers: number[] }
  | { kind: "none"; reason: string };

// A part whose value cannot be negative or zero: a negative solution is no design.
const POSITIVE: ReadonlySet<Quantity> = new Set(["resistance", "conductance", "capacitance", "inductance"]);

export interface DesignSolveRequest {
  result: RationalFunction;
  /** How the result is called in the reasons, e.g. "Rth". */
  label: string;
  symbol: string;
  target: RationalFunction;
  /** The other symbols' values; the solved symbol's own value, if any, is ignored. */
  values?: Record<string, Rational>;
  quantity?: Quantity | null;
}

export function designSolve(req: DesignSolveRequest): DesignSolveAnswer {
  const values = { ...(req.values ?? {}) };
  delete values[req.symbol];
  const f = req.result.substitute(values);
  const target = req.target.substitute(values);
  const { symbol, label } = req;
  const positive = req.quantity ? POSITIVE.has(req.quantity) : false;
  if (!f.variables().includes(symbol)) {
    return { kind: "none", reason: `${label} does not depend on ${symbol}${f.sub(target).isZero() ? ": it meets the target for every value" : ""}` };
  }
  if (target.variables().includes(symbol)) return { kind: "none", reason: `the target cannot contain ${symbol} itself` };
  const degree = Math.max(f.num.degreeIn(symbol), f.den.degreeIn(symbol));
  if (degree <= 1) {
    const x = f.solveFor(symbol, target);
    if (x === null) {
      const lim = f.limit(symbol, "inf");
      const approached = lim.kind === "finite" && lim.value.sub(target).isZero();
      return {
        kind: "none",
        reason: approached
          ? `no finite value of ${symbol} gives ${label} = ${target.toInfix()}: ${label} only approaches it as ${symbol} grows without bound`
          : `no value of ${symbol} gives ${label} = ${target.toInfix()}`,
      };
    }
    const c = x.constantValue();
    if (c !== null && positive && c.sign() <= 0) {
      return { kind: "none", reason: `no positive ${req.quantity} meets it: the equation gives ${symbol} = ${c.toNumber().toPrecision(4)}` };
    }
    return { kind: "exact", value: x, number: c === null ? null : c.toNumber() };
  }
  const others = f.variables().filter((v) => v !== symbol);
  if (others.length > 0 || target.constantValue() === null) {
    return { kind: "none", reason: `${label} is of degree ${degree} in ${symbol}: give values to ${others.join(", ")} for a numeric answer` };
  }
  // N − T·D = 0 in the symbol, then keep the real roots where D does not vanish.
  const poly = f.num.sub(f.den.scale(target.constantValue()!));
  const coefficients = poly.coefficientsIn(symbol).map((p) => p.constantValue()?.toNumber() ?? 0);
  const numbers = polynomialRoots(coefficients)
    .filter((r) => r.im === 0)
    .map((r) => r.re)
    .filter((x) => Math.abs(f.den.evaluate({ [symbol]: x })) > 0)
    .filter((x) => !positive || x > 0);
  if (numbers.length === 0) return { kind: "none", reason: `no ${positive ? "positive " : ""}real value of ${symbol} gives ${label} = ${target.toInfix()}` };
  return { kind: "numeric", numbers: [...new Set(numbers)].sort((a, b) => a - b) };
}
