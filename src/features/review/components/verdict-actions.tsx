import { useId, useState } from "react";
import { Button } from "@/components/ui/button";
import { Dialog } from "@/components/ui/dialog";
import { controlClass } from "@/components/ui/field";
import { InlineError } from "@/components/ui/states";
import type { Revision, VerdictEntry } from "@/lib/api-contract";
import { useGiveVerdict } from "../api/give-verdict";
import { useWithdrawVerdict } from "../api/withdraw-verdict";

type Action = "approve" | "request" | "withdraw";

// Explicit verdicts, each confirmed before it is recorded: Approve (not for the revision's author),
// Request changes (with a note saying what), Withdraw (one's own standing verdict).
export function VerdictActions({ revision, entries, currentUserId }: { revision: Revision; entries: VerdictEntry[]; currentUserId: string }) {
  const [action, setAction] = useState<Action | null>(null);
  const [note, setNote] = useState("");
  const noteId = useId();
  const give = useGiveVerdict();
  const withdraw = useWithdrawVerdict();
  const latestMine = entries.find((entry) => entry.by?.id === currentUserId);
  const standing = latestMine && latestMine.verdict !== "open" ? latestMine : null;
  const isAuthor = revision.createdBy?.id === currentUserId;
  const openNotes = revision.openNotes ?? 0;
  const close = () => {
    setAction(null);
    setNote("");
    give.reset();
    withdraw.reset();
  };
  const target = { networkId: revision.networkId, number: revision.number };
  const record = () => {
    if (action === "withdraw" && standing) withdraw.mutate({ ...target, verdictId: standing.id }, { onSuccess: close });
    if (action === "approve") give.mutate({ ...target, verdict: "approved", note: note.trim() || undefined }, { onSuccess: close });
    if (action === "request") give.mutate({ ...target, verdict: "needs_changes", note: note.trim() }, { onSuccess: close });
  };
  const pending = give.isPending || withdraw.isPending;
  const titles: Record<Action, string> = { approve: `Approve revision ${revision.number}`, request: `Request changes on revision ${revision.number}`, withdraw: "Withdraw your verdict" };
  return (
    <div className="flex flex-wrap items-center gap-2">
      {!isAuthor && (
        <Button variant="primary" onClick={() => setAction("approve")}>
          Approve
        </Button>
      )}
      <Button onClick={() => setAction("request")}>Request changes</Button>
      {standing && (
        <Button variant="quiet" onClick={() => setAction("withdraw")}>
          Withdraw
        </Button>
      )}
      {action && (
        <Dialog open onClose={close} title={titles[action]}>
          <form
            className="space-y-3 text-sm"
            onSubmit={(event) => {
              event.preventDefault();
              record();
            }}
          >
            {action === "withdraw" && standing ? (
              <p>
                You {standing.verdict === "approved" ? "approved" : "requested changes on"} this revision. Withdraw it? It stays in the history, marked as withdrawn.
              </p>
            ) : (
              <>
                {action === "approve" && openNotes > 0 && (
                  <p className="rounded border border-copper/50 bg-copper/5 px-2 py-1.5" role="alert">
                    {openNotes} note thread{openNotes === 1 ? " is" : "s are"} still open on this revision. Approve anyway?
                  </p>
                )}
                <div>
                  <label htmlFor={noteId} className="block text-xs font-medium">
                    {action === "request" ? "What has to change (required)" : "Note (optional)"}
                  </label>
                  <textarea id={noteId} value={note} onChange={(e) => setNote(e.target.value)} rows={4} maxLength={10_000} className={`${controlClass} mt-1 text-sm`} required={action === "request"} autoFocus />
                </div>
                <p className="text-xs text-ink/60">The verdict is recorded with your name, your role and the time, and the authors are told by e-mail.</p>
              </>
            )}
            <InlineError error={give.error ?? withdraw.error} />
            <div className="flex gap-2">
              <Button type="submit" variant={action === "withdraw" ? "danger" : "primary"} disabled={pending || (action === "request" && !note.trim())}>
                {pending ? "Recording…" : action === "approve" ? (openNotes > 0 ? "Approve with open notes" : "Record approval") : action === "request" ? "Record change request" : "Withdraw verdict"}
              </Button>
              <Button onClick={close}>Cancel</Button>
            </div>
          </form>
        </Dialog>
      )}
    </div>
  );
}
