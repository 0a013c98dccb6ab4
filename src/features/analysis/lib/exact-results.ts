import { Rational, RationalFunction, parseSI, readExpression } from "@/lib/engine";
import type { ResultName, RevisionResults } from "@/lib/api-contract";
import { RESULT_NAMES } from "@/lib/quantities";

export type ExactResults = Partial<Record<ResultName, RationalFunction>>;

// Stored results are plain infix strings; read back into exact rational functions once per revision.
export function readExactResults(results: RevisionResults): ExactResults {
  const exact: ExactResults = {};
  for (const name of RESULT_NAMES) {
    const form = results[name];
    if (!form) continue;
    try {
      exact[name] = readExpression(form.infix);
    } catch {
      // A result the client cannot read stays out of Values/Limits/Sweep; the ledger still shows it.
    }
  }
  return exact;
}

export function symbolsOf(exact: ExactResults): string[] {
  const all = new Set<string>();
  for (const rf of Object.values(exact)) for (const v of rf?.variables() ?? []) all.add(v);
  return [...all].sort((a, b) => a.localeCompare(b, "en", { numeric: true }));
}

export interface ParsedValues {
  exact: Record<string, Rational>;
  errors: Record<string, string>;
}

// Typed numbers with SI prefixes ("4.7k", "10µ"), kept exact; blank means "keep the symbol".
export function readTypedValues(typed: Record<string, string>): ParsedValues {
  const exact: Record<string, Rational> = {};
  const errors: Record<string, string> = {};
  for (const [symbol, text] of Object.entries(typed)) {
    const trimmed = text.trim();
    if (!trimmed) continue;
    try {
      exact[symbol] = parseSI(trimmed);
    } catch (error) {
      errors[symbol] = error instanceof Error ? error.message : "not a number";
    }
  }
  return { exact, errors };
}
