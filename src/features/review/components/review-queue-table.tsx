import { useState } from "react";
import { Link } from "react-router-dom";
import { Pager } from "@/components/ui/pager";
import { EmptyState, ErrorState, LoadingState } from "@/components/ui/states";
import { shortDateTime } from "@/lib/dates";
import { useReviewQueue, type ReviewQueue } from "../api/get-review-queue";
import { VerdictMark } from "./verdict-mark";

// How long a revision has waited, in the largest whole unit.
function age(iso: string, now = Date.now()): string {
  const minutes = Math.max(0, Math.floor((now - new Date(iso).getTime()) / 60_000));
  if (minutes < 60) return `${minutes} min`;
  if (minutes < 48 * 60) return `${Math.floor(minutes / 60)} h`;
  return `${Math.floor(minutes / 1440)} days`;
}

export function ReviewQueueTable({ queue, empty }: { queue: ReviewQueue; empty: string }) {
  const [page, setPage] = useState(1);
  const list = useReviewQueue(queue, page);
  if (list.isLoading) return <LoadingState label="Loading revisions…" />;
  if (list.isError) return <ErrorState error={list.error} title="The revisions could not be loaded" />;
  const data = list.data!;
  if (data.total === 0) return <EmptyState title={empty} />;
  return (
    <>
      <table className="w-full text-sm">
        <thead>
          <tr className="border-b border-ink/30 text-left">
            <th scope="col" className="py-1 font-medium">Network</th>
            <th scope="col" className="py-1 font-medium">Team</th>
            <th scope="col" className="py-1 font-medium">Revision</th>
            <th scope="col" className="py-1 font-medium">{queue === "awaiting" ? "Author" : "State"}</th>
            <th scope="col" className="py-1 font-medium">Waiting</th>
            <th scope="col" className="py-1 font-medium">Open notes</th>
          </tr>
        </thead>
        <tbody className={list.isPlaceholderData ? "opacity-60" : ""}>
          {data.items.map((item) => (
            <tr key={`${item.network.id}-${item.revision}`} className="border-b border-rule">
              <td className="py-1.5 pr-3">
                <Link to={`/networks/${item.network.id}/r/${item.revision}`} className="font-medium hover:text-copper">
                  {item.network.title}
                </Link>
              </td>
              <td className="py-1.5 pr-3 text-xs text-ink/70">{item.network.teamName}</td>
              <td className="py-1.5 pr-3 text-xs">revision {item.revision}</td>
              <td className="py-1.5 pr-3 text-xs">
                {queue === "awaiting" ? (
                  (item.author?.name ?? "—")
                ) : (
                  <>
                    <VerdictMark verdict={item.state.verdict} /> · {item.state.approvals} of {item.state.requiredApprovals}
                  </>
                )}
              </td>
              <td className="py-1.5 pr-3 text-xs text-ink/70" title={shortDateTime(item.createdAt)}>
                {age(item.createdAt)}
              </td>
              <td className="py-1.5 text-xs">{item.openNotes}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <Pager page={data.page} pageSize={data.pageSize} total={data.total} onPage={setPage} />
    </>
  );
}
