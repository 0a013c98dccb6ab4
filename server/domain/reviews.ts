// Review of a revision: comments anchored to a step, one level of replies, and the verdict.
import { and, asc, eq } from "drizzle-orm";
import type { Database } from "../db/client.js";
import { comments, revisionSteps, revisionVerdicts, users, type Verdict } from "../db/schema.js";
import { HttpError, forbidden, notFound } from "../lib/errors.js";
import { commentMail, verdictMail } from "../mail/templates.js";
import type { PublicUser } from "./accounts.js";
import { permalink, requireRevision } from "./revisions.js";
import { link, type Services } from "./services.js";

type CommentRow = typeof comments.$inferSelect;

export interface CommentView {
  id: string;
  stepId: string;
  parentId: string | null;
  author: { id: string; name: string } | null;
  body: string;
  deleted: boolean;
  createdAt: string;
  updatedAt: string;
  replies: CommentView[];
}

function view(row: CommentRow, authorName: string | null): CommentView {
  const deleted = row.deletedAt !== null;
  return {
    id: row.id,
    stepId: row.stepKey,
    parentId: row.parentId,
    author: !deleted && row.authorId && authorName ? { id: row.authorId, name: authorName } : null,
    body: deleted ? "" : row.body,
    deleted,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
    replies: [],
  };
}

export async function listComments(db: Database, networkId: string, number: number, userId: string): Promise<CommentView[]> {
  const { revision } = await requireRevision(db, networkId, number, userId, "viewer");
  const rows = await db
    .select({ comment: comments, authorName: users.name })
    .from(comments)
    .leftJoin(users, eq(users.id, comments.authorId))
    .where(eq(comments.revisionId, revision.id))
    .orderBy(asc(comments.createdAt), asc(comments.id));
  const threads = new Map<string, CommentView>();
  for (const { comment, authorName } of rows) {
    const entry = view(comment, authorName);
    if (comment.parentId === null) threads.set(comment.id, entry);
    else threads.get(comment.parentId)?.replies.push(entry);
  }
  return [...threads.values()];
}

// The network's author hears about review activity, unless the author did it.
async function notifyAuthor(services: Services, authorId: string | null, actor: PublicUser, mail: (to: string) => Parameters<Services["mailer"]["send"]>[0]) {
  if (!authorId || authorId === actor.id) return;
  const [author] = await services.db.select({ email: users.email }).from(users).where(eq(users.id, authorId));
  if (author) await services.mailer.send(mail(author.email));
}

export async function addComment(
  services: Services,
  networkId: string,
  number: number,
  actor: PublicUser,
  input: { stepId: string; body: string; parentId?: string },
): Promise<CommentView> {
  const { db } = services;
  const { network, revision } = await requireRevision(db, networkId, number, actor.id, "reviewer");
  const [step] = await db
    .select({ title: revisionSteps.title })
    .from(revisionSteps)
    .where(and(eq(revisionSteps.revisionId, revision.id), eq(revisionSteps.stepKey, input.stepId)));
  if (!step) throw new HttpError(400, "unknown_step", "This revision has no step with that id.", { stepId: "no such step in this revision" });
  let parentId: string | null = null;
  if (input.parentId) {
    const [parent] = await db.select().from(comments).where(and(eq(comments.id, input.parentId), eq(comments.revisionId, revision.id)));
    if (!parent) throw new HttpError(400, "unknown_parent", "The comment you reply to is not on this revision.", { parentId: "no such comment" });
    if (parent.stepKey !== input.stepId) throw new HttpError(400, "step_mismatch", "A reply belongs to the same step as its thread.", { stepId: "differs from the thread's step" });
    // Threads are one level deep: a reply to a reply joins the thread's first comment.
    parentId = parent.parentId ?? parent.id;
  }
  const [row] = await db
    .insert(comments)
    .values({ revisionId: revision.id, stepKey: input.stepId, parentId, authorId: actor.id, body: input.body })
    .returning();
  await notifyAuthor(services, network.authorId, actor, (to) =>
    commentMail(to, actor.name, network.title, revision.number, step.title, input.body, link(services, permalink(network.slug, revision.number))),
  );
  return view(row, actor.name);
}

async function ownComment(db: Database, revisionId: string, commentId: string) {
  const [row] = await db.select().from(comments).where(and(eq(comments.id, commentId), eq(comments.revisionId, revisionId)));
  if (!row || row.deletedAt) throw notFound("That comment");
  return row;
}

export async function editComment(db: Database, networkId: string, number: number, commentId: string, actor: PublicUser, body: string) {
  const { revision } = await requireRevision(db, networkId, number, actor.id, "reviewer");
  const row = await ownComment(db, revision.id, commentId);
  if (row.authorId !== actor.id) throw forbidden("Only the author of a comment can edit it.");
  const [updated] = await db.update(comments).set({ body, updatedAt: new Date() }).where(eq(comments.id, commentId)).returning();
  return view(updated, actor.name);
}

// Authors delete their own comments; team owners may remove any.
export async function deleteComment(db: Database, networkId: string, number: number, commentId: string, actor: PublicUser): Promise<void> {
  const { revision, role } = await requireRevision(db, networkId, number, actor.id, "reviewer");
  const row = await ownComment(db, revision.id, commentId);
  if (row.authorId !== actor.id && role !== "owner") throw forbidden("Only the author of a comment or a team owner can delete it.");
  await db.update(comments).set({ deletedAt: new Date(), body: "" }).where(eq(comments.id, commentId));
}

export const verdictLabel: Record<Verdict, string> = { open: "open", approved: "approved", needs_changes: "needs changes" };

export async function setVerdict(services: Services, networkId: string, number: number, actor: PublicUser, verdict: Verdict) {
  const { db } = services;
  const { network, revision } = await requireRevision(db, networkId, number, actor.id, "reviewer");
  const [row] = await db.insert(revisionVerdicts).values({ revisionId: revision.id, verdict, userId: actor.id }).returning();
  await notifyAuthor(services, network.authorId, actor, (to) =>
    verdictMail(to, actor.name, network.title, revision.number, verdictLabel[verdict], link(services, permalink(network.slug, revision.number))),
  );
  return { verdict: row.verdict, by: { id: actor.id, name: actor.name }, at: row.createdAt.toISOString() };
}
