import type { ResultChecks, ResultForm, Results, ReviewState, Revision, Step, Verdict } from "@/types/api";

type Loose = Record<string, unknown>;

const bool = (v: unknown) => (typeof v === "boolean" ? v : null);

const asString = (v: unknown): string | null => (typeof v === "string" ? v : null);
const nameOf = (v: unknown): string | null =>
  typeof v === "string" ? v : v && typeof v === "object" ? (asString((v as Loose).name) ?? asString((v as Loose).email)) : null;

function normaliseForm(raw: unknown, compactRaw?: unknown, texRaw?: unknown): ResultForm | null {
  if (raw == null) return null;
  if (typeof raw === "string") {
    const compact = asString(compactRaw) ?? raw;
    const tex = asString(texRaw) ?? raw;
    return { infix: raw, tex, compact, compactTex: tex };
  }
  const form = raw as Loose;
  const infix = asString(form.infix) ?? "";
  const tex = asString(form.tex) ?? infix;
  return { infix, tex, compact: asString(form.compact) ?? infix, compactTex: asString(form.compactTex) ?? tex };
}

// Reads the engine's SolveResult (expressions in every form) and the command line's flat form alike.
function normaliseResults(raw: Loose): Results {
  const compact = (raw.compact ?? {}) as Loose;
  const tex = (raw.tex ?? {}) as Loose;
  const checks = (raw.checks ?? {}) as Loose;
  const dims = (raw.dimensions ?? {}) as Loose;
  const statements = Array.isArray(raw.statements) ? (raw.statements as Results["statements"]) : [];
  const form = (name: string) => normaliseForm(raw[name], compact[name], tex[name]);
  const agree = typeof raw.agree === "boolean" ? raw.agree : null;
  return {
    vth: form("vth"),
    isc: form("isc"),
    rth: form("rth"),
    rthFromVocIsc: form("rthFromVocIsc"),
    agree,
    statements,
    checks: normaliseChecks(checks, agree, raw.numericCheck as Loose | null | undefined),
    quantities: (dims.quantities ?? raw.quantities ?? {}) as Results["quantities"],
    dimensionChecks: (dims.checks ?? {}) as Results["dimensionChecks"],
  };
}

// Before each mark said what it did, the test-source mark only said that Rth existed: it is shown as not checked.
function normaliseChecks(checks: Loose, agree: boolean | null, numericCheck: Loose | null | undefined): ResultChecks {
  const details = checks.details && typeof checks.details === "object" ? (checks.details as ResultChecks["details"]) : null;
  return {
    testSource: details ? bool(checks.testSource) : null,
    vocIsc: bool(checks.vocIsc) ?? agree,
    numeric: bool(checks.numeric) ?? bool(numericCheck?.agree),
    exactPoint: bool(checks.exactPoint),
    details,
  };
}

function normaliseStep(raw: Loose, index: number): Step {
  return {
    id: String(raw.id ?? raw.stepId ?? index),
    ordinal: Number(raw.ordinal ?? index + 1),
    kind: String(raw.kind ?? ""),
    title: String(raw.title ?? ""),
    explanation: String(raw.explanation ?? ""),
    tex: String(raw.tex ?? ""),
    data: raw.data ?? null,
  };
}

// The one place that reads a revision as the server sends it (workbench and shared view alike).
export function normaliseRevision(body: unknown): Revision {
  const top = body as Loose;
  const raw = (top.revision ?? top) as Loose;
  const network = (raw.network ?? top.network ?? {}) as Loose;
  const steps = ((raw.steps ?? []) as Loose[]).map(normaliseStep).sort((a, b) => a.ordinal - b.ordinal);
  const verdict = (raw.verdict ?? {}) as Loose;
  return {
    networkId: String(raw.networkId ?? network.id ?? ""),
    slug: String(network.slug ?? ""),
    title: String(network.title ?? ""),
    k: Number(raw.number ?? raw.k ?? 0),
    permalink: asString(raw.permalink),
    createdAt: String(raw.createdAt ?? ""),
    author: nameOf(raw.createdBy),
    circuit: raw.circuit as Revision["circuit"],
    results: normaliseResults((raw.results ?? {}) as Loose),
    diagnostics: (raw.diagnostics ?? []) as Revision["diagnostics"],
    steps,
    authorId: asString((raw.createdBy as Loose | null)?.id),
    verdict: normaliseReviewState(typeof raw.verdict === "string" ? { verdict: raw.verdict } : verdict),
    approvedBefore: raw.approvedBefore
      ? { k: Number((raw.approvedBefore as Loose).number), by: nameOf((raw.approvedBefore as Loose).by), at: asString((raw.approvedBefore as Loose).at) }
      : null,
    openNotes: typeof raw.openNotes === "number" ? raw.openNotes : null,
  };
}

export function normaliseReviewState(raw: Loose): ReviewState {
  return {
    verdict: (asString(raw.verdict) ?? "open") as Verdict,
    by: nameOf(raw.by),
    at: asString(raw.at),
    approvals: Number(raw.approvals ?? 0),
    requiredApprovals: Number(raw.requiredApprovals ?? 1),
  };
}
