import { useId, useState } from "react";
import { Button } from "@/components/ui/button";
import { controlClass } from "@/components/ui/field";
import { InlineError } from "@/components/ui/states";
import { MathTex } from "@/components/ui/math";
import { shortDateTime as when } from "@/lib/dates";
import type { Comment, NoteAnchor, Reply } from "@/lib/api-contract";
import { useCreateComment } from "../api/create-comment";
import { useDeleteComment } from "../api/delete-comment";
import { useSetThreadResolved } from "../api/set-thread-resolved";
import { useUpdateComment } from "../api/update-comment";
import { formulaTerms } from "../lib/formula-terms";

export interface ReviewContext {
  networkId: string;
  number: number;
  canComment: boolean;
  currentUserId: string | null;
  /** Who may resolve any thread besides its author: the revision's author and team owners. */
  revisionAuthorId?: string | null;
  isOwner?: boolean;
  /** Shown in the margin when commenting is not possible (e.g. "Sign in to comment"). */
  commentPath?: React.ReactNode;
}

function AnchorQuote({ anchor }: { anchor: NoteAnchor }) {
  if (anchor.part === "formula") {
    return (
      <p className="mb-0.5 text-[11px] text-ink/60">
        on the term <span className="rounded bg-copper/10 px-0.5 text-ink/80"><MathTex tex={anchor.text} /></span> of the formula
      </p>
    );
  }
  return (
    <p className="mb-0.5 text-[11px] text-ink/60">
      on <q className="bg-copper/10 italic text-ink/80">{anchor.text}</q>
    </p>
  );
}

// A new note may point at one term of the step's formula instead of the whole step.
function TermPicker({ formula, value, onChange }: { formula: string; value: string; onChange: (term: string) => void }) {
  const id = useId();
  const terms = formulaTerms(formula);
  if (terms.length < 2) return null;
  return (
    <div className="mt-1">
      <label htmlFor={id} className="text-[11px] text-ink/60">
        On a term of the formula (optional)
      </label>
      <select id={id} value={value} onChange={(e) => onChange(e.target.value)} className={`${controlClass} text-xs`}>
        <option value="">the whole step</option>
        {terms.map((term) => (
          <option key={term} value={term}>
            {term.length > 60 ? `${term.slice(0, 57)}…` : term}
          </option>
        ))}
      </select>
    </div>
  );
}

function ThreadState({ comment, review }: { comment: Reply; review: ReviewContext }) {
  const toggle = useSetThreadResolved();
  const me = review.currentUserId;
  const may = me !== null && (me === comment.author?.id || me === review.revisionAuthorId || review.isOwner);
  return (
    <>
      {comment.reopened && !comment.resolved && (
        <span className="text-ink/50">
          reopened by {comment.reopened.by?.name ?? "someone"} · {when(comment.reopened.at)}
        </span>
      )}
      {may && (
        <button
          type="button"
          className="text-ink/60 hover:text-verdigris"
          disabled={toggle.isPending}
          onClick={() => toggle.mutate({ networkId: review.networkId, number: review.number, commentId: comment.id, resolved: !comment.resolved })}
        >
          {comment.resolved ? "Reopen" : "Resolve"}
        </button>
      )}
      <InlineError error={toggle.error} />
    </>
  );
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

// A thread's first note with its replies, or one reply (which has none of its own).
function CommentItem({ comment, replies, review, stepTitle }: { comment: Reply; replies: Reply[]; review: ReviewContext; stepTitle: string }) {
  const [mode, setMode] = useState<"read" | "edit" | "reply">("read");
  const create = useCreateComment(() => setMode("read"));
  const update = useUpdateComment();
  const remove = useDeleteComment();
  const own = review.currentUserId !== null && comment.author?.id === review.currentUserId;
  const thread = comment.parentId === null;
  if (thread && comment.resolved && mode === "read") {
    // Resolved threads fold away, still there to open and to reopen.
    return (
      <li className="border-l-2 border-verdigris/40 pl-2">
        <details>
          <summary className="cursor-pointer text-[11px] text-ink/60">
            Resolved by {comment.resolved.by?.name ?? "someone"} · {when(comment.resolved.at)} · {replies.length + 1} note{replies.length ? "s" : ""}
          </summary>
          <div className="mt-1 space-y-1 opacity-80">
            {comment.anchor && <AnchorQuote anchor={comment.anchor} />}
            <p className="whitespace-pre-wrap break-words text-xs leading-snug">{comment.deleted ? <i>note deleted</i> : comment.body}</p>
            <p className="text-[11px] text-ink/50">
              {comment.author?.name ?? "someone"} · {when(comment.createdAt)}
            </p>
            {replies.map((reply) => (
              <p key={reply.id} className="whitespace-pre-wrap break-words border-l border-rule pl-2 text-xs">
                {reply.deleted ? <i>note deleted</i> : reply.body} <span className="text-[11px] text-ink/50">— {reply.author?.name ?? "someone"}</span>
              </p>
            ))}
          </div>
        </details>
        <div className="flex gap-2 text-[11px] print:hidden">
          <ThreadState comment={comment} review={review} />
        </div>
      </li>
    );
  }
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
          onSubmit={(body) => update.mutate({ networkId: review.networkId, number: review.number, commentId: comment.id, body }, { onSuccess: () => setMode("read") })}
        />
      ) : (
        <>
          {thread && comment.anchor && <AnchorQuote anchor={comment.anchor} />}
          {/* User text: rendered as text, never as HTML. */}
          {comment.deleted ? (
            <p className="text-xs italic text-ink/50">note deleted</p>
          ) : (
            <p className="whitespace-pre-wrap break-words text-xs leading-snug">{comment.body}</p>
          )}
          <p className="mt-0.5 text-[11px] text-ink/50">
            {comment.author?.name ?? "someone"} · {when(comment.createdAt)}
            {comment.updatedAt && comment.updatedAt !== comment.createdAt ? " · edited" : ""}
          </p>
          {thread && (
            <div className="flex flex-wrap gap-2 text-[11px] print:hidden">
              <ThreadState comment={comment} review={review} />
            </div>
          )}
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
                      if (window.confirm("Delete this note? This cannot be undone.")) remove.mutate({ networkId: review.networkId, number: review.number, commentId: comment.id });
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
          label={`Reply to ${comment.author?.name ?? "this note"}`}
          submitLabel="Reply"
          pending={create.isPending}
          error={create.error}
          onCancel={() => setMode("read")}
          onSubmit={(body) => create.mutate({ networkId: review.networkId, number: review.number, stepId: comment.stepId, body, parentId: comment.parentId ?? comment.id })}
        />
      )}
    </li>
  );
}

// The margin beside one step: its notes, threaded, and a way to add one.
export function StepComments({ stepId, stepTitle, formula = "", comments, review, highlight, onHighlightUsed }: {
  stepId: string;
  stepTitle: string;
  /** The step's TeX, whose terms a new note may point at. */
  formula?: string;
  comments: Comment[];
  review: ReviewContext;
  /** Text the reader highlighted in this step's explanation, offered as the anchor of a new note. */
  highlight?: NoteAnchor | null;
  onHighlightUsed?: () => void;
}) {
  const [adding, setAdding] = useState<false | "step" | "highlight">(false);
  const [term, setTerm] = useState("");
  const create = useCreateComment(() => {
    setAdding(false);
    onHighlightUsed?.();
  });
  const top = comments.filter((c) => c.stepId === stepId);
  return (
    <aside aria-label={`Review notes on ${stepTitle}`} className="text-xs">
      {top.length > 0 && (
        <ul className="space-y-2">
          {top.map((c) => (
            <CommentItem key={c.id} comment={c} replies={c.replies} review={review} stepTitle={stepTitle} />
          ))}
        </ul>
      )}
      {review.canComment ? (
        adding ? (
          <>
            {adding === "highlight" && highlight && <AnchorQuote anchor={highlight} />}
            {adding === "step" && formula && <TermPicker formula={formula} value={term} onChange={setTerm} />}
            <CommentForm
              label={`Note on ${stepTitle}`}
              submitLabel="Add note"
              pending={create.isPending}
              error={create.error}
              onCancel={() => setAdding(false)}
              onSubmit={(body) => {
                const anchor: NoteAnchor | undefined = adding === "highlight" && highlight ? highlight : adding === "step" && term ? { part: "formula", text: term } : undefined;
                create.mutate({ networkId: review.networkId, number: review.number, stepId, body, ...(anchor ? { anchor } : {}) }, { onSuccess: () => setTerm("") });
              }}
            />
          </>
        ) : (
          <div className="flex flex-col items-start">
            <button type="button" onClick={() => setAdding("step")} className="mt-1 text-[11px] text-ink/50 hover:text-copper print:hidden" aria-label={`Add a note on ${stepTitle}`}>
              + note
            </button>
            {highlight && (
              <button type="button" onClick={() => setAdding("highlight")} className="mt-1 text-left text-[11px] text-copper hover:underline print:hidden" aria-label={`Add a note on the highlighted text of ${stepTitle}`}>
                + note on the highlighted text
              </button>
            )}
          </div>
        )
      ) : (
        top.length === 0 && review.commentPath ? <div className="print:hidden">{review.commentPath}</div> : null
      )}
    </aside>
  );
}
