import { shortDateTime } from "@/lib/dates";
import type { VerdictEntry } from "@/lib/api-contract";
import { VerdictMark } from "./verdict-mark";

const action = (entry: VerdictEntry) => (entry.verdict === "approved" ? "approved" : entry.verdict === "needs_changes" ? "requested changes" : "withdrew a verdict");

// Every verdict given on the revision, newest first: the record a quality process points to.
export function VerdictHistory({ entries }: { entries: VerdictEntry[] }) {
  if (entries.length === 0) return <p className="text-xs text-ink/60">No verdict has been given on this revision.</p>;
  return (
    <ol className="space-y-1.5 text-xs" aria-label="Verdict history">
      {entries.map((entry) => (
        <li key={entry.id} className={entry.withdrawnAt ? "text-ink/50" : ""}>
          <span className="font-medium">{entry.by?.name ?? "a former member"}</span>
          {entry.role ? ` (${entry.role})` : ""} {action(entry)}
          {entry.verdict !== "open" && (
            <>
              {" "}
              · <VerdictMark verdict={entry.verdict} />
            </>
          )}{" "}
          · {shortDateTime(entry.at)}
          {entry.withdrawnAt ? ` · withdrawn ${shortDateTime(entry.withdrawnAt)}` : ""}
          {entry.note && <p className="mt-0.5 whitespace-pre-wrap break-words border-l-2 border-rule pl-2 text-ink/80">{entry.note}</p>}
        </li>
      ))}
    </ol>
  );
}
