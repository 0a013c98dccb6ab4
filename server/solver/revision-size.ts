// The stored size of a revision, bounded in bytes (REVISION_MAX_BYTES): past the bound, the largest
// parts that the equivalents do not need are left out, each with a statement saying so; a revision
// whose equivalents alone are past it is not stored. Runs on the solver thread, beside the solve.
import type { Derivation } from "./derive.js";

const bytesOf = (value: unknown) => Buffer.byteLength(JSON.stringify(value ?? null), "utf8");

// The equivalents and their printed forms: never left out (a revision without them says nothing).
const essential = new Set(["vth", "isc", "rth", "rthFromVocIsc", "agree", "compact", "tex", "port", "mode", "solved"]);

interface OmittedPart {
  part: string;
  bytes: number;
  reason: string;
}

const reason = (limit: number) => `left out: the revision would have been larger than the bound of ${limit} bytes (REVISION_MAX_BYTES)`;

/** The derivation within `maxBytes`, or null when even its essential parts are larger. */
export function boundDerivation(derivation: Derivation, maxBytes: number): { derivation: Derivation; bytes: number } | null {
  const resultSizes = Object.entries(derivation.results).map(([part, value]) => ({ part, bytes: bytesOf(value) }));
  const stepSizes = derivation.steps.map((step, index) => ({ index, bytes: bytesOf(step) }));
  const fixed = bytesOf(derivation.circuit) + bytesOf(derivation.diagnostics);
  let total = fixed + resultSizes.reduce((sum, r) => sum + r.bytes, 0) + stepSizes.reduce((sum, s) => sum + s.bytes, 0);
  if (total <= maxBytes) return { derivation, bytes: total };

  const results: Record<string, unknown> = { ...derivation.results };
  const steps = [...derivation.steps];
  const omitted: OmittedPart[] = [];
  // Largest first: optional result parts (sensitivities, values…) and step bodies compete on size alone.
  const candidates = [
    ...resultSizes.filter((r) => !essential.has(r.part)).map((r) => ({ ...r, kind: "result" as const, index: -1 })),
    ...stepSizes.map((s) => ({ part: `steps[${s.index}]`, bytes: s.bytes, kind: "step" as const, index: s.index })),
  ].sort((a, b) => b.bytes - a.bytes);
  for (const candidate of candidates) {
    if (total <= maxBytes) break;
    if (candidate.kind === "result") {
      delete results[candidate.part];
      total -= candidate.bytes;
    } else {
      const step = steps[candidate.index];
      const statement = `(This step's working, ${candidate.bytes} bytes, is ${reason(maxBytes)}.)`;
      const slim = { ...step, tex: "\\text{(left out: too large to store)}", explanation: `${step.explanation.slice(0, 500)} ${statement}`, data: { omitted: true } };
      // Only a step that slimming makes smaller is worth it; the rest are kept whole.
      if (bytesOf(slim) + 200 >= candidate.bytes) continue;
      steps[candidate.index] = slim;
      total -= candidate.bytes - bytesOf(slim);
    }
    omitted.push({ part: candidate.part, bytes: candidate.bytes, reason: reason(maxBytes) });
  }
  results.omitted = omitted;
  total += bytesOf(omitted);
  if (total > maxBytes) return null;
  return { derivation: { ...derivation, results, steps }, bytes: total };
}
