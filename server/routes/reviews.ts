import { Router } from "express";
import { z } from "zod";
import { signedInUser } from "../auth/session.js";
import { verdicts } from "../db/schema.js";
import { addComment, deleteComment, editComment, listComments, setVerdict } from "../domain/reviews.js";
import type { Services } from "../domain/services.js";
import { idParam, parseBody, revisionNumberParam } from "../lib/validate.js";

const body = z.string().trim().min(1, { error: "Write something first." }).max(10_000);
const commentBody = z.object({ stepId: z.string().min(1).max(200), body, parentId: z.uuid().optional() });
const editBody = z.object({ body });
const verdictBody = z.object({ verdict: z.enum(verdicts) });

export function reviewsRouter(services: Services): Router {
  const router = Router();
  const { db } = services;
  const path = "/networks/:networkId/revisions/:number";
  const target = (params: Record<string, string>) =>
    [idParam(params.networkId, "That network"), revisionNumberParam(params.number)] as const;

  router.get(`${path}/comments`, async (req, res) => {
    const user = signedInUser(res);
    const [networkId, number] = target(req.params);
    res.json({ comments: await listComments(db, networkId, number, user.id) });
  });

  router.post(`${path}/comments`, async (req, res) => {
    const user = signedInUser(res);
    const [networkId, number] = target(req.params);
    const input = parseBody(commentBody, req.body);
    res.status(201).json(await addComment(services, networkId, number, user, input));
  });

  router.patch(`${path}/comments/:commentId`, async (req, res) => {
    const user = signedInUser(res);
    const [networkId, number] = target(req.params);
    const input = parseBody(editBody, req.body);
    res.json(await editComment(db, networkId, number, idParam(req.params.commentId, "That comment"), user, input.body));
  });

  router.delete(`${path}/comments/:commentId`, async (req, res) => {
    const user = signedInUser(res);
    const [networkId, number] = target(req.params);
    await deleteComment(db, networkId, number, idParam(req.params.commentId, "That comment"), user);
    res.status(204).end();
  });

  router.put(`${path}/verdict`, async (req, res) => {
    const user = signedInUser(res);
    const [networkId, number] = target(req.params);
    const { verdict } = parseBody(verdictBody, req.body);
    res.json(await setVerdict(services, networkId, number, user, verdict));
  });

  return router;
}
