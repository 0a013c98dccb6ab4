import { Link } from "react-router-dom";
import { RESULT_NAMES, RESULT_UNIT, resultLabel, resultsInS } from "@/lib/quantities";
import type { CheckMark, RevisionResults } from "@/lib/api-contract";

/** The page that explains every check and every outside reference. */
const HOW_CHECKED_PATH = "/how-results-are-checked";

const MARKS: { key: CheckMark; label: string; none: string }[] = [
  { key: "testSource", label: "test source", none: "no test-source check for this port" },
  { key: "vocIsc", label: "Voc/Isc", none: "only one form of Rth exists for this port" },
  { key: "numeric", label: "numeric", none: "no numeric check was recorded" },
  { key: "exactPoint", label: "exact point", none: "no exact-point check was recorded" },
];

function signOf(state: boolean | null): string {
  return state === true ? "✓" : state === false ? "✗" : "–";
}

function Mark({ label, state, detail }: { label: string; state: boolean | null; detail: string }) {
  const tone = state === true ? "border-verdigris/50 text-verdigris" : state === false ? "border-signal/50 text-signal" : "border-rule text-ink/50";
  return (
    <li className={`rounded-sm border px-1.5 py-0.5 ${tone}`} title={detail} data-mark-state={state === null ? "none" : String(state)}>
      <span aria-hidden="true">{signOf(state)}</span> {label}
      <span className="sr-only">: {detail}</span>
    </li>
  );
}

// Revisions solved before each mark said what it did read as the engine wrote them then: the test-source mark only
// said that Rth existed, so it shows as not run; a missing Voc/Isc or numeric mark is the agreement or numeric check.
function markStates(results: RevisionResults): Record<CheckMark, boolean | null> {
  const { checks } = results;
  return {
    testSource: checks.details ? checks.testSource : null,
    vocIsc: checks.vocIsc ?? results.agree ?? null,
    numeric: checks.numeric ?? results.numericCheck?.agree ?? null,
    exactPoint: checks.exactPoint ?? null,
  };
}

// The check badge: four independent tests the result can fail, each saying what it did.
export function CheckBadge({ results }: { results: RevisionResults }) {
  const checks = markStates(results);
  const details = results.checks.details;
  const tooltip = (key: CheckMark, none: string) => {
    const d = details?.[key];
    if (!d) return checks[key] === null ? `${none} (solved before this check existed; solve again to run it)` : none;
    return `${d.outcome} ${d.method}`;
  };
  return (
    <div className="text-xs">
      <div className="flex flex-wrap items-center gap-1.5">
        <ul aria-label="Check badge" className="flex flex-wrap items-center gap-1.5">
          {MARKS.map((m) => (
            <Mark key={m.key} label={m.label} state={checks[m.key]} detail={tooltip(m.key, m.none)} />
          ))}
        </ul>
        <Link to={HOW_CHECKED_PATH} className="text-copper underline">
          How results are checked
        </Link>
      </div>
      <details className="mt-1 text-ink/80">
        <summary className="cursor-pointer select-none text-ink/60">What each check did</summary>
        <dl aria-label="What each check did" className="mt-1 grid grid-cols-[6.5rem_minmax(0,1fr)] gap-x-2 gap-y-1">
          {MARKS.map((m) => {
            const d = details?.[m.key];
            return (
              <div key={m.key} className="contents">
                <dt className={checks[m.key] === false ? "text-signal" : "text-ink/70"}>
                  {signOf(checks[m.key])} {m.label}
                </dt>
                <dd>
                  {d ? (
                    <>
                      <span className={d.agree === false ? "text-signal" : "text-ink"}>{d.outcome}</span> <span className="text-ink/60">{d.method}</span>
                    </>
                  ) : (
                    <span className="text-ink/60">Not recorded with this revision: it was solved before the check said what it did. Solve again to run it.</span>
                  )}
                </dd>
              </div>
            );
          })}
        </dl>
      </details>
    </div>
  );
}

export function DimensionCheck({ results }: { results: RevisionResults }) {
  // Only results the port has: no "Isc in A" for a port without a Norton form.
  const checks = results.dimensions?.checks ?? {};
  const entries = (Object.entries(checks) as [keyof typeof checks, (typeof checks)[keyof typeof checks]][]).filter(([name]) => results[name] !== null);
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
