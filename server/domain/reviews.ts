// Review notes on a revision: threads anchored to a step (optionally to part of it), one level of
// replies, resolved and reopened by the people the thread concerns. Verdicts live in verdicts.ts.
import { and, asc, eq, inArray, or } from "drizzle-orm";
import { alias } from "drizzle-orm/pg-core";
import type { Database } from "../db/client.js";
import { comments, revisionSteps, users, type NoteAnchor } from "../db/schema.js";
import { Conflict, Invalid, forbidden, notFound } from "./errors.js";
import { commentMail } from "../mail/templates.js";
import type { PublicUser } from "./accounts.js";
import { mailPeople } from "./review-mail.js";
import { permalink, requireRevision } from "./revisions.js";
import { link, type Services } from "./services.js";

type CommentRow = typeof comments.$inferSelect;
type Person = { id: string; name: string } | null;

export interface CommentView {
  id: string;
  stepId: string;
  parentId: string | null;
  author: { id: string; name: string } | null;
  body: string;
  deleted: boolean;
  createdAt: string;
  updatedAt: string;
  anchor: NoteAnchor | null;
  // Thread state, on a thread's first comment (null on replies and open threads).
  resolved: { by: Person; at: string } | null;
  reopened: { by: Person; at: string } | null;
  replies: CommentView[];
}

const resolver = alias(users, "resolver");
const reopener = alias(users, "reopener");
const who = (id: string | null, name: string | null): Person => (id && name !== null ? { id, name } : null);

function view(row: CommentRow, names: { author: string | null; resolver?: string | null; reopener?: string | null }): CommentView {
  const deleted = row.deletedAt !== null;
  return {
    id: row.id,
    stepId: row.stepKey,
    parentId: row.parentId,
    author: !deleted && row.authorId && names.author ? { id: row.authorId, name: names.author } : null,
    body: deleted ? "" : row.body,
    deleted,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
    anchor: row.anchor ?? null,
    resolved: row.resolvedAt ? { by: who(row.resolvedBy, names.resolver ?? null), at: row.resolvedAt.toISOString() } : null,
    reopened: row.reopenedAt ? { by: who(row.reopenedBy, names.reopener ?? null), at: row.reopenedAt.toISOString() } : null,
    replies: [],
  };
}

async function threadsOf(db: Database, revisionId: string): Promise<CommentView[]> {
  const rows = await db
    .select({ comment: comments, authorName: users.name, resolverName: resolver.name, reopenerName: reopener.name })
    .from(comments)
    .leftJoin(users, eq(users.id, comments.authorId))
    .leftJoin(resolver, eq(resolver.id, comments.resolvedBy))
    .leftJoin(reopener, eq(reopener.id, comments.reopenedBy))
    .where(eq(comments.revisionId, revisionId))
    .orderBy(asc(comments.createdAt), asc(comments.id));
  const threads = new Map<string, CommentView>();
  for (const { comment, authorName, resolverName, reopenerName } of rows) {
    const entry = view(comment, { author: authorName, resolver: resolverName, reopener: reopenerName });
    if (comment.parentId === null) threads.set(comment.id, entry);
    else threads.get(comment.parentId)?.replies.push(entry);
  }
  return [...threads.values()];
}

export async function listComments(db: Database, userId: string, networkId: string, number: number): Promise<CommentView[]> {
  const { revision } = await requireRevision(db, userId, networkId, number, "viewer");
  return threadsOf(db, revision.id);
}

/** Open note threads per revision id. */
export async function openNoteCounts(db: Database, revisionIds: string[]): Promise<Map<string, number>> {
  const out = new Map<string, number>(revisionIds.map((id) => [id, 0]));
  if (revisionIds.length === 0) return out;
  const rows = await db
    .select({ id: comments.id, revisionId: comments.revisionId, parentId: comments.parentId, deletedAt: comments.deletedAt, resolvedAt: comments.resolvedAt })
    .from(comments)
    .where(inArray(comments.revisionId, revisionIds));
  const live = new Set(rows.filter((r) => r.deletedAt === null).map((r) => r.parentId ?? r.id));
  for (const row of rows) if (row.parentId === null && row.resolvedAt === null && live.has(row.id)) out.set(row.revisionId, out.get(row.revisionId)! + 1);
  return out;
}

// A highlighted stretch must be in the step as stored: a quote of its explanation, or a term of its formula.
function checkAnchor(anchor: NoteAnchor, step: { explanation: string; tex: string }): NoteAnchor {
  const source = anchor.part === "explanation" ? step.explanation : step.tex;
  const at = anchor.start ?? source.indexOf(anchor.text);
  if (at < 0 || source.slice(at, at + anchor.text.length) !== anchor.text) {
    throw new Invalid("unknown_anchor", `The highlighted text is not in this step's ${anchor.part}.`, { fields: { anchor: `not part of the step's ${anchor.part}` } });
  }
  return { part: anchor.part, text: anchor.text, start: at };
}

export async function addComment(
  services: Services,
  actor: PublicUser,
  networkId: string,
  number: number,
  input: { stepId: string; body: string; parentId?: string; anchor?: NoteAnchor },
): Promise<CommentView> {
  const { db } = services;
  const { network, revision } = await requireRevision(db, actor.id, networkId, number, "reviewer");
  const [step] = await db
    .select({ title: revisionSteps.title, explanation: revisionSteps.explanation, tex: revisionSteps.tex })
    .from(revisionSteps)
    .where(and(eq(revisionSteps.revisionId, revision.id), eq(revisionSteps.stepKey, input.stepId)));
  if (!step) throw new Invalid("unknown_step", "This revision has no step with that id.", { fields: { stepId: "no such step in this revision" } });
  let parentId: string | null = null;
  if (input.parentId && input.anchor) throw new Invalid("anchor_on_reply", "A reply belongs to its thread's anchor; only a new note takes one.", { fields: { anchor: "not on a reply" } });
  const anchor = input.anchor ? checkAnchor(input.anchor, step) : null;
  if (input.parentId) {
    const [parent] = await db.select().from(comments).where(and(eq(comments.id, input.parentId), eq(comments.revisionId, revision.id)));
    if (!parent) throw new Invalid("unknown_parent", "The comment you reply to is not on this revision.", { fields: { parentId: "no such comment" } });
    if (parent.stepKey !== input.stepId) throw new Invalid("step_mismatch", "A reply belongs to the same step as its thread.", { fields: { stepId: "differs from the thread's step" } });
    // Threads are one level deep: a reply to a reply joins the thread's first comment.
    parentId = parent.parentId ?? parent.id;
  }
  const [row] = await db
    .insert(comments)
    .values({ revisionId: revision.id, stepKey: input.stepId, parentId, authorId: actor.id, body: input.body, anchor })
    .returning();
  // A new note tells the authors; a reply also tells everyone who wrote in the thread.
  const thread = parentId
    ? await db.select({ authorId: comments.authorId }).from(comments).where(and(eq(comments.revisionId, revision.id), or(eq(comments.id, parentId), eq(comments.parentId, parentId))))
    : [];
  await mailPeople(services, actor.id, [revision.createdBy, network.authorId, ...thread.map((c) => c.authorId)], (to) =>
    commentMail(to, {
      commenter: actor.name,
      networkTitle: network.title,
      revision: revision.number,
      stepTitle: step.title,
      body: input.body,
      reply: parentId !== null,
      url: link(services, permalink(network.slug, revision.number)),
    }),
  );
  return view(row, { author: actor.name });
}

async function ownComment(db: Database, revisionId: string, commentId: string) {
  const [row] = await db.select().from(comments).where(and(eq(comments.id, commentId), eq(comments.revisionId, revisionId)));
  if (!row || row.deletedAt) throw notFound("That comment");
  return row;
}

export async function editComment(db: Database, actor: PublicUser, networkId: string, number: number, commentId: string, body: string) {
  const { revision } = await requireRevision(db, actor.id, networkId, number, "reviewer");
  const row = await ownComment(db, revision.id, commentId);
  if (row.authorId !== actor.id) throw forbidden("Only the author of a comment can edit it.");
  const [updated] = await db.update(comments).set({ body, updatedAt: new Date() }).where(eq(comments.id, commentId)).returning();
  return view(updated, { author: actor.name });
}

// Authors delete their own comments; team owners may remove any.
export async function deleteComment(db: Database, actor: PublicUser, networkId: string, number: number, commentId: string): Promise<void> {
  const { revision, role } = await requireRevision(db, actor.id, networkId, number, "reviewer");
  const row = await ownComment(db, revision.id, commentId);
  if (row.authorId !== actor.id && role !== "owner") throw forbidden("Only the author of a comment or a team owner can delete it.");
  await db.update(comments).set({ deletedAt: new Date(), body: "" }).where(eq(comments.id, commentId));
}

// A thread is resolved or reopened by its first note's author, the revision's author, or a team owner.
export async function setThreadResolved(db: Database, actor: PublicUser, networkId: string, number: number, commentId: string, resolved: boolean): Promise<CommentView> {
  const { revision, role } = await requireRevision(db, actor.id, networkId, number, "viewer");
  const [row] = await db.select().from(comments).where(and(eq(comments.id, commentId), eq(comments.revisionId, revision.id)));
  if (!row) throw notFound("That comment");
  if (row.parentId !== null) throw new Invalid("not_a_thread", "Resolve the thread through its first note, not a reply.");
  if (row.authorId !== actor.id && revision.createdBy !== actor.id && role !== "owner") {
    throw forbidden("Only the note's author, the revision's author or a team owner can resolve or reopen this thread.");
  }
  if (resolved && row.resolvedAt) throw new Conflict("already_resolved", "This thread is resolved already.");
  if (!resolved && !row.resolvedAt) throw new Conflict("not_resolved", "This thread is open already.");
  const now = new Date();
  await db
    .update(comments)
    .set(resolved ? { resolvedAt: now, resolvedBy: actor.id } : { resolvedAt: null, resolvedBy: null, reopenedAt: now, reopenedBy: actor.id })
    .where(eq(comments.id, commentId));
  const thread = (await threadsOf(db, revision.id)).find((t) => t.id === commentId)!;
  return thread;
}
