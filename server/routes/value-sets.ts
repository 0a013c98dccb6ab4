import { Router } from "express";
import { z } from "zod";
import { signedInUser } from "../auth/session.js";
import type { Services } from "../domain/services.js";
import { deleteValueSet, listValueSets, saveValueSet } from "../domain/value-sets.js";
import { idParam, parseBody, plainText } from "../lib/validate.js";

// A symbol name as the engine writes it, and a value as typed (SI prefixes allowed); the client checks the syntax live.
const symbol = z.string().regex(/^[A-Za-z][A-Za-z0-9_]{0,63}$/, { error: "A symbol is a letter followed by letters, digits or _." });
const saveBody = z.object({
  name: plainText(80).pipe(z.string().trim().min(1, { error: "Give the value set a name." })),
  values: z.record(symbol, z.string().trim().min(1).max(200)).refine((v) => Object.keys(v).length <= 200, { error: "At most 200 symbols in one set." }),
});

export function valueSetsRouter(services: Services): Router {
  const router = Router();
  const { db } = services;
  const path = "/networks/:networkId/value-sets";

  router.get(path, async (req, res) => {
    const user = signedInUser(res);
    res.json({ valueSets: await listValueSets(db, idParam(req.params.networkId, "That network"), user.id) });
  });

  router.post(path, async (req, res) => {
    const user = signedInUser(res);
    const networkId = idParam(req.params.networkId, "That network");
    const body = parseBody(saveBody, req.body);
    res.status(201).json(await saveValueSet(db, networkId, user.id, body));
  });

  router.delete(`${path}/:setId`, async (req, res) => {
    const user = signedInUser(res);
    const networkId = idParam(req.params.networkId, "That network");
    await deleteValueSet(db, networkId, idParam(req.params.setId, "That value set"), user.id);
    res.status(204).end();
  });

  return router;
}
