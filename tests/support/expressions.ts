import { expect } from "vitest";
import { parseValue, readExpression } from "../../shared/engine/algebra";

// Evaluates one of the engine's plain infix results (+ - * / ^, parentheses, symbols) at numbers,
// so a check states the textbook value rather than one particular printed form.
export function evaluateInfix(expression: string, values: Record<string, number>): number {
  if (!/^[\w\s+\-*/^().]*$/.test(expression)) throw new Error(`not a plain infix expression: ${expression}`);
  const names = Object.keys(values);
  const body = expression.replace(/\^/g, "**");
  return Function(...names, `"use strict"; return (${body});`)(...names.map((name) => values[name])) as number;
}

/** The engine's printed result equals the expected expression exactly: their difference cancels to 0. */
export function expectSameExpression(actual: string | undefined | null, expected: string): void {
  expect(actual, `expected ${expected}`).toBeTypeOf("string");
  expect(readExpression(actual!).sub(parseValue(expected)).isZero(), `${actual} vs ${expected}`).toBe(true);
}
