import { Router } from "express";
import { shareRequest as shareBody } from "../../shared/api/shares.js";
import { signedInUser } from "../auth/session.js";
import type { Services } from "../domain/services.js";
import { createShare, listShares, revokeShare, revokeShareByToken, sharedRevision } from "../domain/shares.js";
import { sendRevisionJson } from "../lib/json-stream.js";
import { idParam, parseBody, revisionNumberParam, tokenParam } from "../lib/validate.js";

export function sharesRouter(services: Services): Router {
  const router = Router();
  const { db } = services;
  const path = "/networks/:networkId/revisions/:number/share";

  router.post(path, async (req, res) => {
    const user = signedInUser(res);
    const networkId = idParam(req.params.networkId, "That network");
    const number = revisionNumberParam(req.params.number);
    const { expiresAt } = parseBody(shareBody, req.body);
    res.status(201).json(await createShare(services, user.id, networkId, number, expiresAt ? new Date(expiresAt) : null));
  });

  router.get(path, async (req, res) => {
    const user = signedInUser(res);
    const networkId = idParam(req.params.networkId, "That network");
    const number = revisionNumberParam(req.params.number);
    res.json({ shares: await listShares(db, user.id, networkId, number) });
  });

  router.delete(`${path}/:shareId`, async (req, res) => {
    const user = signedInUser(res);
    const networkId = idParam(req.params.networkId, "That network");
    const number = revisionNumberParam(req.params.number);
    await revokeShare(db, user.id, networkId, number, idParam(req.params.shareId, "That share link"));
    res.status(204).end();
  });

  // The link itself: no account needed to read; revoking by token needs an editor of its team.
  router.get("/share/:token", async (req, res) => {
    res.set("Cache-Control", "no-store");
    const shared = await sharedRevision(db, tokenParam(req.params.token));
    await sendRevisionJson(res, shared, shared.revision.steps);
  });

  router.delete("/share/:token", async (req, res) => {
    const user = signedInUser(res);
    await revokeShareByToken(db, user.id, tokenParam(req.params.token));
    res.status(204).end();
  });

  return router;
}
