import { Router } from "express";
import { createTokenRequest } from "../../shared/api/tokens.js";
import { signedInUser } from "../auth/session.js";
import { createApiToken, describeApiToken, listApiTokens, revokeApiToken } from "../domain/api-tokens.js";
import type { Services } from "../domain/services.js";
import { HttpError } from "../lib/errors.js";
import { idParam, parseBody } from "../lib/validate.js";

export function apiTokensRouter(services: Services): Router {
  const router = Router();
  const { db } = services;

  // Reached with a token only: the token itself, the person and the teams it reaches.
  router.get("/account/tokens/current", async (_req, res) => {
    const user = signedInUser(res);
    const token = res.locals.apiToken;
    if (!token) throw new HttpError(400, "no_token", "This request did not come with an API token.");
    res.json(await describeApiToken(db, { user, token }));
  });

  router.get("/account/tokens", async (_req, res) => {
    res.json({ tokens: await listApiTokens(db, signedInUser(res).id) });
  });

  router.post("/account/tokens", async (req, res) => {
    const user = signedInUser(res);
    const body = parseBody(createTokenRequest, req.body);
    res.set("Cache-Control", "no-store");
    res.status(201).json(await createApiToken(db, user.id, body));
  });

  router.delete("/account/tokens/:tokenId", async (req, res) => {
    const user = signedInUser(res);
    await revokeApiToken(db, user.id, idParam(req.params.tokenId, "That token"));
    res.status(204).end();
  });

  return router;
}
