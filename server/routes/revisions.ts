import { Router } from "express";
import { signedInUser } from "../auth/session.js";
import { compareRevisions } from "../domain/compare.js";
import { getRevision, listRevisions } from "../domain/revisions.js";
import type { Services } from "../domain/services.js";
import { solve } from "../domain/solve.js";
import { idParam, revisionNumberParam } from "../lib/validate.js";

export function revisionsRouter(services: Services): Router {
  const router = Router();
  const { db } = services;

  router.post("/networks/:networkId/solve", async (req, res) => {
    const user = signedInUser(res);
    res.status(201).json(await solve(db, idParam(req.params.networkId, "That network"), user.id));
  });

  router.get("/networks/:networkId/revisions", async (req, res) => {
    const user = signedInUser(res);
    res.json({ revisions: await listRevisions(db, idParam(req.params.networkId, "That network"), user.id) });
  });

  router.get("/networks/:networkId/revisions/:number", async (req, res) => {
    const user = signedInUser(res);
    const networkId = idParam(req.params.networkId, "That network");
    res.json(await getRevision(db, networkId, revisionNumberParam(req.params.number), user.id));
  });

  router.get("/networks/:networkId/revisions/:from/compare/:to", async (req, res) => {
    const user = signedInUser(res);
    const networkId = idParam(req.params.networkId, "That network");
    res.json(await compareRevisions(db, networkId, revisionNumberParam(req.params.from), revisionNumberParam(req.params.to), user.id));
  });

  return router;
}
