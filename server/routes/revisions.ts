import { Router } from "express";
import { solveQuery } from "../../shared/api/revisions.js";
import { signedInUser } from "../auth/session.js";
import { compareRevisions } from "../domain/compare.js";
import { getRevision, listRevisions } from "../domain/revisions.js";
import type { Services } from "../domain/services.js";
import { getSolveJob } from "../domain/solve-jobs.js";
import { solve } from "../domain/solve.js";
import { recordedFailure } from "../lib/errors.js";
import { sendRevisionJson } from "../lib/json-stream.js";
import { idParam, parseQuery, revisionNumberParam } from "../lib/validate.js";

export function revisionsRouter(services: Services): Router {
  const router = Router();
  const { db } = services;

  // 201 with the revision when the solve ends within the wait; otherwise 202 with a job to poll.
  router.post("/networks/:networkId/solve", async (req, res) => {
    const user = signedInUser(res);
    const networkId = idParam(req.params.networkId, "That network");
    const { wait } = parseQuery(solveQuery, req.query);
    const answer = await solve(services, user.id, networkId, Math.min(wait ?? services.settings.solve.waitMs, services.settings.solve.waitMs));
    if (answer.kind === "failed") throw recordedFailure(answer.error);
    if (answer.kind === "job") {
      res.status(202).location(answer.job.poll).json({ job: answer.job });
      return;
    }
    res.set("Portfold-Solve-Cache", answer.cacheHit ? "hit" : "miss");
    res.status(201).json(answer.revision);
  });

  router.get("/networks/:networkId/solve-jobs/:jobId", async (req, res) => {
    const user = signedInUser(res);
    const networkId = idParam(req.params.networkId, "That network");
    const jobId = idParam(req.params.jobId, "That solve job");
    res.set("Cache-Control", "no-store");
    res.json(await getSolveJob(db, services.settings.solve, user.id, networkId, jobId));
  });

  router.get("/networks/:networkId/revisions", async (req, res) => {
    const user = signedInUser(res);
    res.json({ revisions: await listRevisions(db, user.id, idParam(req.params.networkId, "That network")) });
  });

  router.get("/networks/:networkId/revisions/:number", async (req, res) => {
    const user = signedInUser(res);
    const networkId = idParam(req.params.networkId, "That network");
    const revision = await getRevision(db, user.id, networkId, revisionNumberParam(req.params.number));
    await sendRevisionJson(res, revision, revision.steps);
  });

  router.get("/networks/:networkId/revisions/:from/compare/:to", async (req, res) => {
    const user = signedInUser(res);
    const networkId = idParam(req.params.networkId, "That network");
    res.json(await compareRevisions(db, user.id, networkId, revisionNumberParam(req.params.from), revisionNumberParam(req.params.to)));
  });

  return router;
}
