import { RESULT_NAMES, RESULT_UNIT, resultLabel, resultsInS } from "@/features/analysis/lib/quantities";
import type { ResultName, Results } from "@/types/api";

function Mark({ label, state, detail }: { label: string; state: boolean | null; detail: string }) {
  const tone = state === true ? "border-verdigris/50 text-verdigris" : state === false ? "border-signal/50 text-signal" : "border-rule text-ink/50";
  const sign = state === true ? "✓" : state === false ? "✗" : "–";
  return (
    <li className={`rounded-sm border px-1.5 py-0.5 ${tone}`} title={detail}>
      <span aria-hidden="true">{sign}</span> {label}
      <span className="sr-only">: {detail}</span>
    </li>
  );
}

// The check badge: three independent agreements on the result.
export function CheckBadge({ results }: { results: Results }) {
  const { testSource, vocIsc, numeric } = results.checks;
  const word = (state: boolean | null, yes: string, no: string, none: string) => (state === true ? yes : state === false ? no : none);
  return (
    <ul aria-label="Check badge" className="flex flex-wrap items-center gap-1.5 text-xs">
      <Mark label="test source" state={testSource} detail={word(testSource, "Rth found with a test source, independent sources zeroed", "the test-source solve failed", "no test-source Rth for this port")} />
      <Mark label="Voc/Isc" state={vocIsc} detail={word(vocIsc, "Voc/Isc equals the test-source Rth exactly", "Voc/Isc differs from the test-source Rth", "only one form of Rth exists for this port")} />
      <Mark label="numeric" state={numeric} detail={word(numeric, "an independent numeric solve at random values agrees", "the independent numeric solve disagrees", "no numeric check was recorded")} />
    </ul>
  );
}

export function DimensionCheck({ results }: { results: Results }) {
  // Only results the port has: no "Isc in A" for a port without a Norton form.
  const entries = (Object.entries(results.dimensionChecks) as [ResultName, Results["dimensionChecks"][ResultName]][]).filter(([name]) => results[name] !== null);
  if (entries.length === 0) return null;
  const allOk = entries.every(([, c]) => c?.status === "ok");
  const inS = resultsInS(results);
  const summary = RESULT_NAMES.filter((name) => entries.some(([n]) => n === name))
    .map((name) => `${resultLabel(name, inS)} in ${RESULT_UNIT[name]}`)
    .join(", ");
  return (
    <div className="text-xs" data-dimension-check="">
      <p className={allOk ? "text-verdigris" : "text-copper"}>
        {allOk ? `✓ Dimension check: ${summary}.` : "Dimension check:"}
      </p>
      {!allOk && (
        <ul className="mt-0.5 list-disc pl-4 text-ink/80">
          {entries.map(([name, c]) => (
            <li key={name}>{c?.message}</li>
          ))}
        </ul>
      )}
    </div>
  );
}
