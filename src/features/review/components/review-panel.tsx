import type { Revision } from "@/lib/api-contract";
import { useVerdicts } from "../api/get-verdicts";
import { ReviewStatus } from "./review-status";
import { VerdictActions } from "./verdict-actions";
import { VerdictHistory } from "./verdict-history";

// The top of a revision for its team: the state, the verdict actions and the kept history.
// Outside the team (a share link) only the state shows.
export function ReviewPanel({ revision, member, canReview, currentUserId }: { revision: Revision; member: boolean; canReview: boolean; currentUserId: string | null }) {
  const verdicts = useVerdicts(revision.networkId, revision.number, member);
  const entries = verdicts.data?.verdicts ?? [];
  return (
    <section aria-label="Review" className="print:hidden">
      <div className="flex flex-wrap items-start justify-between gap-2">
        <div className="min-w-0 flex-1">
          <ReviewStatus revision={revision} compareLink={member} />
        </div>
        {member && canReview && currentUserId && verdicts.data && (
          <div className="mt-2">
            <VerdictActions revision={revision} entries={entries} currentUserId={currentUserId} />
          </div>
        )}
      </div>
      {member && verdicts.data && (
        <details className="mt-1.5 text-xs">
          <summary className="cursor-pointer text-ink/70 hover:text-copper">Verdict history ({entries.length})</summary>
          <div className="mt-1.5 pl-3">
            <VerdictHistory entries={entries} />
          </div>
        </details>
      )}
    </section>
  );
}
