import { Link } from "react-router-dom";
import { shortDateTime } from "@/lib/dates";
import type { Revision } from "@/lib/api-contract";
import { VerdictMark } from "./verdict-mark";

// The line a design review reads first: the state of this revision, who decided it and when.
export function ReviewStatus({ revision, compareLink }: { revision: Revision; compareLink: boolean }) {
  const { verdict: state, approvedBefore, openNotes, number } = revision;
  const tone = state.verdict === "approved" ? "border-verdigris/50 bg-verdigris/5" : state.verdict === "needs_changes" ? "border-copper/50 bg-copper/5" : "border-rule bg-white/40";
  const count = `${state.approvals} of ${state.requiredApprovals} approval${state.requiredApprovals === 1 ? "" : "s"}`;
  return (
    <div role="status" aria-label="Review state" data-review-state={state.verdict} className={`mt-2 rounded border px-3 py-1.5 text-sm ${tone}`}>
      <span className="font-medium">Revision {number}: </span>
      <VerdictMark verdict={state.verdict} />
      {state.verdict === "approved" && (
        <span>
          {" "}
          by {state.by?.name ?? "a former member"} · {shortDateTime(state.at)}
          {state.requiredApprovals > 1 ? ` · ${count}` : ""}
        </span>
      )}
      {state.verdict === "needs_changes" && (
        <span>
          {" "}
          · changes requested by {state.by?.name ?? "a former member"} · {shortDateTime(state.at)}
        </span>
      )}
      {state.verdict === "open" && (
        <span>
          {" "}
          ·{" "}
          {approvedBefore ? (
            <>
              revision {approvedBefore.number} approved; this one not yet reviewed
              {compareLink && (
                <>
                  {" "}
                  ·{" "}
                  <Link to={`/networks/${revision.networkId}/history?from=${approvedBefore.number}&to=${number}`} className="text-copper hover:underline">
                    compare with revision {approvedBefore.number}
                  </Link>
                </>
              )}
            </>
          ) : (
            "not yet reviewed"
          )}{" "}
          · {count}
        </span>
      )}
      {openNotes !== undefined && (
        <span className="text-ink/70">
          {" "}
          · {openNotes} open note{openNotes === 1 ? "" : "s"}
        </span>
      )}
    </div>
  );
}
