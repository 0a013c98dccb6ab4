// The command-line / API output shape: one JSON object, each expression a plain infix string or null.

import type { Diagnostic, LimitEntry, ResultName, SolveResult, Step } from "../types";
import { RESULT_NAMES } from "./results";

type PerResult<T> = Record<ResultName, T>;

export interface SolveOutput {
  vth: string | null;
  isc: string | null;
  rth: string | null;
  rthFromVocIsc: string | null;
  agree: boolean | null;
  compact: PerResult<string | null>;
  tex: PerResult<string | null>;
  limits: Record<string, Partial<PerResult<LimitEntry>>>;
  /** Empty maps when no values were given. */
  values: {
    given: Record<string, string>;
    exact: Partial<PerResult<string | null>>;
    float: Partial<PerResult<number | null>>;
    display: Partial<PerResult<string | null>>;
  };
  steps: Step[];
  diagnostics: Diagnostic[];
  // Extensions beyond the fixed keys of the output format.
  ok: boolean;
  compactTex: PerResult<string | null>;
  statements: SolveResult["statements"];
  /** Which equivalent forms exist (their expressions are vth, rth, isc above). */
  equivalents: { thevenin: boolean; norton: boolean };
  numericCheck: SolveResult["numericCheck"];
  checks: SolveResult["checks"];
  sensitivities: SolveResult["sensitivities"];
  solved: SolveResult["solved"];
  dimensions: SolveResult["dimensions"];
  terms: Partial<PerResult<{ numerator: number; denominator: number }>>;
  /** Only when a result depends on s: DC and high-frequency equivalents, poles and zeros. */
  frequency?: SolveResult["frequency"];
  /** Only when assumptions were given: each result beside its dominant-term form. */
  approximations?: SolveResult["approximations"];
  boundedApproximations?: SolveResult["boundedApproximations"];
}

function per<T>(f: (r: ResultName) => T): PerResult<T> {
  return Object.fromEntries(RESULT_NAMES.map((r) => [r, f(r)])) as PerResult<T>;
}

export function toSolveOutput(result: SolveResult): SolveOutput {
  const expr = (r: ResultName) => result[r];
  const terms: SolveOutput["terms"] = {};
  for (const r of RESULT_NAMES) {
    const e = expr(r);
    if (e) terms[r] = e.terms;
  }
  const limits: SolveOutput["limits"] = {};
  for (const l of result.limits) limits[l.key] = l.results;
  const values: SolveOutput["values"] = { given: {}, exact: {}, float: {}, display: {} };
  if (result.values) {
    values.given = result.values.given;
    for (const r of RESULT_NAMES) {
      const v = result.values.results[r];
      if (!v) continue;
      values.exact[r] = v.exact;
      values.float[r] = v.float;
      values.display[r] = v.display;
    }
  }
  return {
    vth: expr("vth")?.infix ?? null,
    isc: expr("isc")?.infix ?? null,
    rth: expr("rth")?.infix ?? null,
    rthFromVocIsc: expr("rthFromVocIsc")?.infix ?? null,
    agree: result.agree,
    compact: per((r) => expr(r)?.compact ?? null),
    tex: per((r) => expr(r)?.tex ?? null),
    limits,
    values,
    steps: result.steps,
    diagnostics: result.diagnostics,
    ok: result.ok,
    compactTex: per((r) => expr(r)?.compactTex ?? null),
    statements: result.statements,
    equivalents: { thevenin: result.thevenin !== null, norton: result.norton !== null },
    numericCheck: result.numericCheck,
    checks: result.checks,
    sensitivities: result.sensitivities,
    solved: result.solved,
    dimensions: result.dimensions,
    terms,
    ...(result.frequency ? { frequency: result.frequency } : {}),
    ...(result.approximations ? { approximations: result.approximations } : {}),
    ...(result.boundedApproximations ? { boundedApproximations: result.boundedApproximations } : {}),
  };
}
