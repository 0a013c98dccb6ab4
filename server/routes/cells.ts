import { Router } from "express";
import { createCellRequest as createBody } from "../../shared/api/cells.js";
import { signedInUser } from "../auth/session.js";
import { createCell, deleteCell, listCells } from "../domain/cells.js";
import type { Services } from "../domain/services.js";
import { notFound } from "../domain/errors.js";
import { idParam, parseBody } from "../lib/validate.js";

// A cell id as the engine spells it: letters, digits, underscore and hyphen.
function cellIdParam(value: unknown): string {
  if (typeof value !== "string" || !/^[\p{L}\p{N}_-]{1,100}$/u.test(value)) throw notFound("That cell");
  return value;
}

export function cellsRouter(services: Services): Router {
  const router = Router();
  const { db } = services;

  router.get("/teams/:teamId/cells", async (req, res) => {
    const user = signedInUser(res);
    res.json(await listCells(db, user.id, idParam(req.params.teamId, "That team")));
  });

  router.post("/teams/:teamId/cells", async (req, res) => {
    const user = signedInUser(res);
    const teamId = idParam(req.params.teamId, "That team");
    const body = parseBody(createBody, req.body);
    res.status(201).json(await createCell(services, user.id, teamId, body.definition));
  });

  router.delete("/teams/:teamId/cells/:cellId", async (req, res) => {
    const user = signedInUser(res);
    await deleteCell(db, user.id, idParam(req.params.teamId, "That team"), cellIdParam(req.params.cellId));
    res.status(204).end();
  });

  return router;
}
