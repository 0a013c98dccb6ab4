import { Router } from "express";
import {
  commentRequest as commentBody,
  editCommentRequest as editBody,
  legacyVerdictRequest as legacyVerdictBody,
  pageQuery,
  verdictRequest as verdictBody,
} from "../../shared/api/reviews.js";
import { signedInUser } from "../auth/session.js";
import { awaitingMyReview, myRevisionsInReview } from "../domain/review-queue.js";
import { addComment, deleteComment, editComment, listComments, setThreadResolved } from "../domain/reviews.js";
import type { Services } from "../domain/services.js";
import { giveVerdict, listVerdicts, withdrawVerdict } from "../domain/verdicts.js";
import { idParam, parseBody, parseQuery, revisionNumberParam } from "../lib/validate.js";

export function reviewsRouter(services: Services): Router {
  const router = Router();
  const { db } = services;
  const path = "/networks/:networkId/revisions/:number";
  const target = (params: Record<string, string>) =>
    [idParam(params.networkId, "That network"), revisionNumberParam(params.number)] as const;

  router.get(`${path}/comments`, async (req, res) => {
    const user = signedInUser(res);
    const [networkId, number] = target(req.params);
    res.json({ comments: await listComments(db, user.id, networkId, number) });
  });

  router.post(`${path}/comments`, async (req, res) => {
    const user = signedInUser(res);
    const [networkId, number] = target(req.params);
    const input = parseBody(commentBody, req.body);
    res.status(201).json(await addComment(services, user, networkId, number, input));
  });

  router.patch(`${path}/comments/:commentId`, async (req, res) => {
    const user = signedInUser(res);
    const [networkId, number] = target(req.params);
    const input = parseBody(editBody, req.body);
    res.json(await editComment(db, user, networkId, number, idParam(req.params.commentId, "That comment"), input.body));
  });

  router.delete(`${path}/comments/:commentId`, async (req, res) => {
    const user = signedInUser(res);
    const [networkId, number] = target(req.params);
    await deleteComment(db, user, networkId, number, idParam(req.params.commentId, "That comment"));
    res.status(204).end();
  });

  for (const [action, resolved] of [["resolve", true], ["reopen", false]] as const) {
    router.post(`${path}/comments/:commentId/${action}`, async (req, res) => {
      const user = signedInUser(res);
      const [networkId, number] = target(req.params);
      res.json(await setThreadResolved(db, user, networkId, number, idParam(req.params.commentId, "That comment"), resolved));
    });
  }

  router.get(`${path}/verdicts`, async (req, res) => {
    const user = signedInUser(res);
    const [networkId, number] = target(req.params);
    res.json(await listVerdicts(db, user.id, networkId, number));
  });

  router.post(`${path}/verdicts`, async (req, res) => {
    const user = signedInUser(res);
    const [networkId, number] = target(req.params);
    const input = parseBody(verdictBody, req.body);
    res.status(201).json(await giveVerdict(services, user, networkId, number, input));
  });

  router.post(`${path}/verdicts/:verdictId/withdraw`, async (req, res) => {
    const user = signedInUser(res);
    const [networkId, number] = target(req.params);
    const withdrawn = await withdrawVerdict(services, user, networkId, number, idParam(req.params.verdictId, "That verdict"));
    res.status(201).json(withdrawn);
  });

  router.put(`${path}/verdict`, async (req, res) => {
    const user = signedInUser(res);
    const [networkId, number] = target(req.params);
    const input = parseBody(legacyVerdictBody, req.body);
    if (input.verdict === "open") {
      await withdrawVerdict(services, user, networkId, number, null);
      res.json((await listVerdicts(db, user.id, networkId, number)).state);
      return;
    }
    res.json((await giveVerdict(services, user, networkId, number, { verdict: input.verdict, note: input.note })).state);
  });

  router.get("/reviews/awaiting", async (req, res) => {
    const user = signedInUser(res);
    res.json(await awaitingMyReview(db, user.id, parseQuery(pageQuery, req.query)));
  });

  router.get("/reviews/mine", async (req, res) => {
    const user = signedInUser(res);
    res.json(await myRevisionsInReview(db, user.id, parseQuery(pageQuery, req.query)));
  });

  return router;
}
