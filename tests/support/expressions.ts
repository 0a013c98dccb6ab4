import { expect } from "vitest";
import { closeTo, evaluatePrintedInfix, randomPoints } from "./printed-forms";
import { mulberry32 } from "../engine/circuit-generators";

const IDENTIFIER = /[A-Za-z_][A-Za-z0-9_]*/g;

/**
 * The engine's printed result equals the expected (textbook) expression: both are read by the
 * independent float reader of tests/support/printed-forms.ts, never by the engine's own parser,
 * and compared at random points.
 */
export function expectSameExpression(actual: string | undefined | null, expected: string): void {
  expect(actual, `expected ${expected}`).toBeTypeOf("string");
  const symbols = new Set([...actual!.matchAll(IDENTIFIER), ...expected.matchAll(IDENTIFIER)].map((m) => m[0]));
  let compared = 0;
  for (const point of randomPoints(symbols, 6, mulberry32(expected.length * 7919 + actual!.length))) {
    const ours = evaluatePrintedInfix(actual!, point);
    const theirs = evaluatePrintedInfix(expected, point);
    if (!Number.isFinite(ours) && !Number.isFinite(theirs)) continue; // a pole of both at this point
    expect(closeTo(ours, theirs, 1e-9), `${actual} vs ${expected}: ${ours} vs ${theirs} at ${JSON.stringify(point)}`).toBe(true);
    compared++;
  }
  expect(compared, `${actual} vs ${expected}: no point away from a pole`).toBeGreaterThan(3);
}

/** One of the engine's plain infix results evaluated at numbers, by the same independent reader. */
export const evaluateInfix = evaluatePrintedInfix;
