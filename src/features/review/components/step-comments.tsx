import { useId, useState } from "react";
import { Button } from "@/components/ui/button";
import { controlClass } from "@/components/ui/field";
import { InlineError } from "@/components/ui/states";
import type { Comment } from "@/types/api";
import { useCreateComment } from "../api/create-comment";
import { useDeleteComment } from "../api/delete-comment";
import { useUpdateComment } from "../api/update-comment";

export interface ReviewContext {
  networkId: string;
  k: number;
  canComment: boolean;
  currentUserId: string | null;
  /** Shown in the margin when commenting is not possible (e.g. "Sign in to comment"). */
  commentPath?: React.ReactNode;
}

function when(iso: string) {
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? "" : date.toLocaleString("en-GB", { dateStyle: "medium", timeStyle: "short" });
}

function CommentForm({ label, submitLabel, initial = "", onSubmit, onCancel, pending, error }: {
  label: string;
  submitLabel: string;
  initial?: string;
  onSubmit: (body: string) => void;
  onCancel: () => void;
  pending: boolean;
  error: unknown;
}) {
  const id = useId();
  const [body, setBody] = useState(initial);
  return (
    <form
      className="mt-1 space-y-1"
      onSubmit={(event) => {
        event.preventDefault();
        if (body.trim()) onSubmit(body.trim());
      }}
    >
      <label htmlFor={id} className="sr-only">
        {label}
      </label>
      <textarea id={id} value={body} onChange={(e) => setBody(e.target.value)} rows={3} className={`${controlClass} text-xs`} autoFocus maxLength={5000} />
      <InlineError error={error} />
      <div className="flex gap-1">
        <Button type="submit" variant="primary" disabled={pending || !body.trim()} className="px-2 py-1 text-xs">
          {pending ? "Saving…" : submitLabel}
        </Button>
        <Button onClick={onCancel} className="px-2 py-1 text-xs">
          Cancel
        </Button>
      </div>
    </form>
  );
}

function CommentItem({ comment, replies, review, stepTitle }: { comment: Comment; replies: Comment[]; review: ReviewContext; stepTitle: string }) {
  const [mode, setMode] = useState<"read" | "edit" | "reply">("read");
  const create = useCreateComment(() => setMode("read"));
  const update = useUpdateComment();
  const remove = useDeleteComment();
  const own = review.currentUserId !== null && comment.authorId === review.currentUserId;
  return (
    <li className="border-l-2 border-copper/40 pl-2">
      {mode === "edit" ? (
        <CommentForm
          label={`Edit your note on ${stepTitle}`}
          submitLabel="Save"
          initial={comment.body}
          pending={update.isPending}
          error={update.error}
          onCancel={() => setMode("read")}
          onSubmit={(body) => update.mutate({ networkId: review.networkId, k: review.k, commentId: comment.id, body }, { onSuccess: () => setMode("read") })}
        />
      ) : (
        <>
          {/* User text: rendered as text, never as HTML. */}
          {comment.deleted ? (
            <p className="text-xs italic text-ink/50">note deleted</p>
          ) : (
            <p className="whitespace-pre-wrap break-words text-xs leading-snug">{comment.body}</p>
          )}
          <p className="mt-0.5 text-[11px] text-ink/50">
            {comment.author ?? "someone"} · {when(comment.createdAt)}
            {comment.updatedAt && comment.updatedAt !== comment.createdAt ? " · edited" : ""}
          </p>
          {review.canComment && !comment.deleted && (
            <div className="flex gap-2 text-[11px] print:hidden">
              <button type="button" className="text-ink/60 hover:text-copper" onClick={() => setMode("reply")}>
                Reply
              </button>
              {own && (
                <>
                  <button type="button" className="text-ink/60 hover:text-copper" onClick={() => setMode("edit")}>
                    Edit
                  </button>
                  <button
                    type="button"
                    className="text-ink/60 hover:text-signal"
                    disabled={remove.isPending}
                    onClick={() => {
                      if (window.confirm("Delete this note? This cannot be undone.")) remove.mutate({ networkId: review.networkId, k: review.k, commentId: comment.id });
                    }}
                  >
                    Delete
                  </button>
                </>
              )}
            </div>
          )}
        </>
      )}
      {replies.length > 0 && (
        <ul className="mt-1 space-y-1.5">
          {replies.map((reply) => (
            <CommentItem key={reply.id} comment={reply} replies={[]} review={review} stepTitle={stepTitle} />
          ))}
        </ul>
      )}
      {mode === "reply" && (
        <CommentForm
          label={`Reply to ${comment.author ?? "this note"}`}
          submitLabel="Reply"
          pending={create.isPending}
          error={create.error}
          onCancel={() => setMode("read")}
          onSubmit={(body) => create.mutate({ networkId: review.networkId, k: review.k, stepId: comment.stepId, body, parentId: comment.parentId ?? comment.id })}
        />
      )}
    </li>
  );
}

// The margin beside one step: its notes, threaded, and a way to add one.
export function StepComments({ stepId, stepTitle, comments, review }: { stepId: string; stepTitle: string; comments: Comment[]; review: ReviewContext }) {
  const [adding, setAdding] = useState(false);
  const create = useCreateComment(() => setAdding(false));
  const mine = comments.filter((c) => c.stepId === stepId);
  const top = mine.filter((c) => !c.parentId);
  const repliesOf = (id: string) => mine.filter((c) => c.parentId === id);
  return (
    <aside aria-label={`Review notes on ${stepTitle}`} className="text-xs">
      {top.length > 0 && (
        <ul className="space-y-2">
          {top.map((c) => (
            <CommentItem key={c.id} comment={c} replies={repliesOf(c.id)} review={review} stepTitle={stepTitle} />
          ))}
        </ul>
      )}
      {review.canComment ? (
        adding ? (
          <CommentForm
            label={`Note on ${stepTitle}`}
            submitLabel="Add note"
            pending={create.isPending}
            error={create.error}
            onCancel={() => setAdding(false)}
            onSubmit={(body) => create.mutate({ networkId: review.networkId, k: review.k, stepId, body })}
          />
        ) : (
          <button type="button" onClick={() => setAdding(true)} className="mt-1 text-[11px] text-ink/50 hover:text-copper print:hidden" aria-label={`Add a note on ${stepTitle}`}>
            + note
          </button>
        )
      ) : (
        top.length === 0 && review.commentPath ? <div className="print:hidden">{review.commentPath}</div> : null
      )}
    </aside>
  );
}
