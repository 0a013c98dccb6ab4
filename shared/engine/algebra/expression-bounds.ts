// Size bounds on a typed expression, checked by one linear scan of its text before anything parses
// it: characters, terms (numbers and names), bracket nesting, and the power a sub-expression can be
// raised to (exponents multiply through nested groups: ((a+b)^4)^6 reaches 24).

export interface ExpressionBounds {
  maxChars: number;
  maxTerms: number;
  maxDepth: number;
  maxExponent: number;
}

type ExpressionBoundName = "characters" | "terms" | "depth" | "exponent";

export interface ExpressionBreach {
  bound: ExpressionBoundName;
  limit: number;
  actual: number;
}

/** Defaults: far beyond any element value a designer types, far below what stalls a parser. */
export const DEFAULT_EXPRESSION_BOUNDS: ExpressionBounds = { maxChars: 4_000, maxTerms: 256, maxDepth: 32, maxExponent: 24 };

const opening = new Set(["(", "["]);
const closing = new Set([")", "]"]);
const nameStart = /[\p{L}_]/u;
const nameRest = /[\p{L}\p{N}_]/u;
const digit = /[0-9.]/;

interface Power {
  // The text the power applies to: a bracketed group [start, end] or a single term at start (end = start).
  start: number;
  end: number;
  power: number;
}

/** The first bound the text goes past, or null. Linear in the text, except for the (few) powers. */
export function expressionBreach(text: string, bounds: ExpressionBounds): ExpressionBreach | null {
  if (text.length > bounds.maxChars) return { bound: "characters", limit: bounds.maxChars, actual: text.length };
  let terms = 0;
  let deepest = 0;
  const open: number[] = [];
  const powers: Power[] = [];
  // What a following ^ would apply to.
  let last: { start: number; end: number } | null = null;
  let i = 0;
  while (i < text.length) {
    const c = text[i];
    if (opening.has(c)) {
      open.push(i);
      deepest = Math.max(deepest, open.length);
      if (deepest > bounds.maxDepth) return { bound: "depth", limit: bounds.maxDepth, actual: deepest };
      last = null;
      i += 1;
    } else if (closing.has(c)) {
      const start = open.pop() ?? 0;
      last = { start, end: i };
      i += 1;
    } else if (digit.test(c) || nameStart.test(c)) {
      // A number with its SI prefix or exponent letters ("4.7k", "1e3") or a name: one term.
      const start = i;
      while (i < text.length && (digit.test(text[i]) || nameRest.test(text[i]))) i += 1;
      terms += 1;
      if (terms > bounds.maxTerms) return { bound: "terms", limit: bounds.maxTerms, actual: terms };
      last = { start, end: start };
    } else if (c === "^" || (c === "*" && text[i + 1] === "*")) {
      i += c === "^" ? 1 : 2;
      const literal = /^[\s(+-]*([0-9]+(?:\.[0-9]*)?)/.exec(text.slice(i, i + 64));
      if (literal && last) powers.push({ start: last.start, end: last.end, power: Math.abs(Number(literal[1])) });
      last = null;
    } else {
      if (!/\s/.test(c)) last = null;
      i += 1;
    }
  }
  let largest = 0;
  for (const inner of powers) {
    let reach = inner.power;
    for (const outer of powers) {
      if (outer !== inner && outer.start < outer.end && outer.start <= inner.start && inner.end <= outer.end && (outer.start < inner.start || inner.end < outer.end)) reach *= outer.power;
    }
    largest = Math.max(largest, reach);
  }
  if (largest > bounds.maxExponent) return { bound: "exponent", limit: bounds.maxExponent, actual: largest };
  return null;
}
