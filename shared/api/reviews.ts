// Review of a revision: notes on its steps and the reviewer's verdict.
import { z } from "zod";
import { isoTime, verdicts } from "./common.js";

const body = z.string().trim().min(1, { error: "Write something first." }).max(10_000);
export const commentRequest = z.object({ stepId: z.string().min(1).max(200), body, parentId: z.uuid().optional() }).meta({ id: "CommentRequest" });
export const editCommentRequest = z.object({ body }).meta({ id: "EditCommentRequest" });
export const verdictRequest = z.object({ verdict: z.enum(verdicts) }).meta({ id: "VerdictRequest" });

export const comment = z.object({ id: z.uuid(), stepId: z.string(), body: z.string(), createdAt: isoTime }).loose().meta({ id: "Comment" });
export const commentList = z.object({ comments: z.array(comment) }).loose().meta({ id: "CommentList" });
