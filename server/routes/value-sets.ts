import { Router } from "express";
import { saveValueSetRequest as saveBody } from "../../shared/api/value-sets.js";
import { signedInUser } from "../auth/session.js";
import type { Services } from "../domain/services.js";
import { deleteValueSet, listValueSets, saveValueSet } from "../domain/value-sets.js";
import { idParam, parseBody } from "../lib/validate.js";

export function valueSetsRouter(services: Services): Router {
  const router = Router();
  const { db } = services;
  const path = "/networks/:networkId/value-sets";

  router.get(path, async (req, res) => {
    const user = signedInUser(res);
    res.json({ valueSets: await listValueSets(db, user.id, idParam(req.params.networkId, "That network")) });
  });

  router.post(path, async (req, res) => {
    const user = signedInUser(res);
    const networkId = idParam(req.params.networkId, "That network");
    const body = parseBody(saveBody, req.body);
    res.status(201).json(await saveValueSet(db, user.id, networkId, body));
  });

  router.delete(`${path}/:setId`, async (req, res) => {
    const user = signedInUser(res);
    const networkId = idParam(req.params.networkId, "That network");
    await deleteValueSet(db, user.id, networkId, idParam(req.params.setId, "That value set"));
    res.status(204).end();
  });

  return router;
}
