// Size and time caps of one solve: what is measured, against which setting, and how a breach is told.
import type { SolveSettings } from "../config.js";
import type { Network } from "./engine.js";

export type CapName = "elements" | "symbols" | "resultTerms" | "time" | "memory" | "revisionBytes";

export interface CapBreach {
  cap: CapName;
  limit: number;
  // What the solve came to; null when it was stopped before it could be measured (time, memory).
  actual: number | null;
  setting: string;
}

const settingOf: Record<CapName, string> = {
  elements: "SOLVE_MAX_ELEMENTS",
  symbols: "SOLVE_MAX_SYMBOLS",
  resultTerms: "SOLVE_MAX_RESULT_TERMS",
  time: "SOLVE_TIME_LIMIT_MS",
  memory: "SOLVE_MEMORY_MB",
  revisionBytes: "REVISION_MAX_BYTES",
};

export function breach(cap: CapName, limit: number, actual: number | null): CapBreach {
  return { cap, limit, actual, setting: settingOf[cap] };
}

// An identifier of a value expression; letters glued to a digit are an SI prefix or an exponent, not a name.
const identifier = /(?<![\p{L}\p{N}_.])[\p{L}_][\p{L}\p{N}_]*/gu;

/** The distinct symbols a network's element values use (the Laplace variable s included). */
function circuitSymbols(network: Network): string[] {
  const found = new Set<string>();
  for (const element of network.elements) {
    if (!("value" in element) || typeof element.value !== "string") continue;
    for (const match of element.value.matchAll(identifier)) found.add(match[0]);
  }
  return [...found].sort();
}

/** Checks that need no algebra: run before a solve is queued. */
export function sizeBreach(network: Network, caps: Pick<SolveSettings, "maxElements" | "maxSymbols">): CapBreach | null {
  if (network.elements.length > caps.maxElements) return breach("elements", caps.maxElements, network.elements.length);
  const symbols = circuitSymbols(network).length;
  if (symbols > caps.maxSymbols) return breach("symbols", caps.maxSymbols, symbols);
  return null;
}

interface CountedExpression {
  terms: { numerator: number; denominator: number };
}

/** The largest result, in terms of numerator plus denominator. */
function largestResultTerms(results: Record<string, unknown>): number {
  let largest = 0;
  for (const name of ["vth", "isc", "rth", "rthFromVocIsc"]) {
    const expression = results[name] as CountedExpression | null | undefined;
    if (expression?.terms) largest = Math.max(largest, expression.terms.numerator + expression.terms.denominator);
  }
  return largest;
}

export function resultBreach(results: Record<string, unknown>, maxResultTerms: number): CapBreach | null {
  const terms = largestResultTerms(results);
  return terms > maxResultTerms ? breach("resultTerms", maxResultTerms, terms) : null;
}

const capWords: Record<CapName, (limit: number) => string> = {
  elements: (limit) => `the network has more elements than the cap of ${limit}`,
  symbols: (limit) => `the network uses more distinct symbols than the cap of ${limit}`,
  resultTerms: (limit) => `a result has more terms (numerator plus denominator) than the cap of ${limit}`,
  time: (limit) => `the solve ran longer than the time cap of ${limit / 1000} s`,
  memory: (limit) => `the solve needed more memory than the cap of ${limit} MB`,
  revisionBytes: (limit) => `its equivalents alone would take more than the cap of ${limit} bytes to store`,
};

export function breachMessage(found: CapBreach): string {
  const measured = found.actual === null ? "" : ` (it has ${found.actual})`;
  return `This network is too large to solve here: ${capWords[found.cap](found.limit)}${measured}; the cap is set by ${found.setting}.`;
}
