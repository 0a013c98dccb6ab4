// Review of a revision: note threads on its steps, the verdict history and the revision's state,
// and the two review pages (awaiting my review, my revisions in review).
import { z } from "zod";
import { isoTime, person, revisionState, roles, verdicts } from "./common.js";

const body = z.string().trim().min(1, { error: "Write something first." }).max(10_000);
// The words of a step a note is about: part of its explanation or formula, and where the text starts.
export const noteAnchor = z
  .object({
    part: z.enum(["explanation", "formula"]),
    text: z.string().min(1, { error: "Highlight some text." }).max(2_000),
    start: z.number().int().min(0).max(1_000_000).optional(),
  })
  .meta({ id: "NoteAnchor" });
export const commentRequest = z.object({ stepId: z.string().min(1).max(200), body, parentId: z.uuid().optional(), anchor: noteAnchor.optional() }).meta({ id: "CommentRequest" });
export const editCommentRequest = z.object({ body }).meta({ id: "EditCommentRequest" });
const note = z.string().trim().max(10_000).optional();
export const verdictRequest = z.object({ verdict: z.enum(["approved", "needs_changes"]), note }).meta({ id: "VerdictRequest" });
// The original verdict route: "open" withdraws the caller's standing verdict.
export const legacyVerdictRequest = z.object({ verdict: z.enum(verdicts), note }).meta({ id: "LegacyVerdictRequest" });
export const pageQuery = z.object({ page: z.coerce.number().int().min(1).max(100_000).default(1), pageSize: z.coerce.number().int().min(1).max(100).default(20) });

const stamp = z.object({ by: person.nullable(), at: isoTime });
const commentFields = {
  id: z.uuid(),
  stepId: z.string(),
  parentId: z.uuid().nullable(),
  author: person.nullable(),
  body: z.string(),
  deleted: z.boolean(),
  createdAt: isoTime,
  updatedAt: isoTime,
  anchor: noteAnchor.nullable(),
  // Thread state, on a thread's first note (null on replies and open threads).
  resolved: stamp.nullable(),
  reopened: stamp.nullable(),
};
// Threads are one level deep: a reply has no replies of its own.
export const reply = z.object({ ...commentFields, replies: z.array(z.unknown()).max(0) }).meta({ id: "Reply" });
export const comment = z.object({ ...commentFields, replies: z.array(reply) }).meta({ id: "Comment" });
export const commentList = z.object({ comments: z.array(comment) }).meta({ id: "CommentList" });

export const verdictEntry = z
  .object({
    id: z.uuid(),
    revision: z.number().int(),
    // "open": a withdrawal of the entry named in `withdraws`.
    verdict: z.enum(verdicts),
    by: person.nullable(),
    role: z.enum(roles).nullable(),
    note: z.string().nullable(),
    at: isoTime,
    withdraws: z.uuid().nullable(),
    // Set on an approval or change request that its giver later took back.
    withdrawnAt: isoTime.nullable(),
  })
  .meta({ id: "VerdictEntry" });
export const verdictHistory = z.object({ verdicts: z.array(verdictEntry), state: revisionState }).meta({ id: "VerdictHistory" });
export const verdictGiven = z.object({ verdict: verdictEntry, state: revisionState }).meta({ id: "VerdictGiven" });

const reviewQueueItem = z
  .object({
    network: z.object({ id: z.uuid(), slug: z.string(), title: z.string(), teamId: z.uuid(), teamName: z.string() }),
    revision: z.number().int(),
    permalink: z.string(),
    author: person.nullable(),
    createdAt: isoTime,
    state: revisionState,
    openNotes: z.number().int(),
  })
  .meta({ id: "ReviewQueueItem" });
export const reviewQueuePage = z
  .object({ items: z.array(reviewQueueItem), total: z.number().int(), page: z.number().int(), pageSize: z.number().int() })
  .meta({ id: "ReviewQueuePage" });
