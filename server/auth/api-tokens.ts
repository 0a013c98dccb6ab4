// Bearer tokens for scripts: who is calling, and which routes a token of that scope and team may reach.
import type { RequestHandler } from "express";
import { verifyRequestOrigin } from "lucia";
import { endpoints } from "../../shared/api/routes.js";
import type { TokenScope } from "../../shared/api/tokens.js";
import { authenticateApiToken, teamOfNetwork, type TokenCaller } from "../domain/api-tokens.js";
import type { Services } from "../domain/services.js";
import { notFound } from "../domain/errors.js";
import { HttpError } from "../lib/errors.js";

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Locals {
      // Set when the request authenticated with `Authorization: Bearer …` instead of the session cookie.
      apiToken?: TokenCaller["token"];
    }
  }
}

type TeamFrom = "team" | "network" | "slug" | null;

// Every route a token reaches, from the contract's table; anything else (token management, accounts,
// teams, reviews, shares) needs a browser session.
export const tokenRoutes = endpoints
  .filter((endpoint) => endpoint.token !== undefined)
  .map((endpoint) => {
    const route = endpoint.path.replace(/^\/api/, "");
    const first = /:([a-zA-Z]+)/.exec(route)?.[1];
    const team: TeamFrom = first === "teamId" ? "team" : first === "networkId" ? "network" : first === "slug" ? "slug" : null;
    // The first parameter is captured (it names the team or network); the rest only have to be one path segment.
    let captured = false;
    const pattern = route.replace(/:[a-zA-Z]+/g, () => (captured ? "[^/]+" : ((captured = true), "([^/]+)")));
    return { method: endpoint.method, path: new RegExp(`^${pattern}$`), scope: endpoint.token!, team, route };
  });

const scopeCovers = (granted: TokenScope, needed: TokenScope) => granted === "solve" || needed === "read";

const uuidPattern = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

async function teamOfRequest(services: Services, from: TeamFrom, key: string): Promise<string | null> {
  // An id that cannot exist is left to the route, which answers 404.
  if ((from === "team" || from === "network") && !uuidPattern.test(key)) return null;
  if (from === "team") return key.toLowerCase();
  if (from === "network") return teamOfNetwork(services.db, { id: key.toLowerCase() });
  if (from === "slug") return teamOfNetwork(services.db, { slug: key });
  return null;
}

// Reads `Authorization: Bearer …` only (never a cookie, form field or query parameter), so a browser form
// post can never carry a token; a token sent from another site's page is refused like a foreign form.
export function apiTokenAuth(services: Services): RequestHandler {
  return async (req, res, next) => {
    const header = req.headers.authorization?.trim() ?? "";
    // Other schemes (a proxy's Basic credentials) are not ours to judge.
    if (!/^Bearer\b/i.test(header)) return next();
    const match = /^Bearer +([^\s]+)$/i.exec(header);
    if (!match) throw new HttpError(401, "invalid_token", "Send the token as `Authorization: Bearer <token>`.");
    const origin = req.headers.origin;
    if (origin !== undefined && !verifyRequestOrigin(origin, [services.settings.publicUrl, req.headers.host ?? ""].filter(Boolean))) {
      throw new HttpError(403, "origin_mismatch", "API tokens are for scripts and programs, not for other sites' pages.");
    }
    const caller = await authenticateApiToken(services.db, match[1]);
    const entry = tokenRoutes.find((route) => route.method === (req.method === "HEAD" ? "GET" : req.method) && route.path.test(req.path));
    if (!entry) throw new HttpError(403, "token_not_allowed", "API tokens cannot do this; sign in to Portfold in a browser (tokens never create or revoke tokens).");
    if (!scopeCovers(caller.token.scope, entry.scope)) {
      throw new HttpError(403, "token_scope", "This token may only read; create a token with the read + solve scope to store and solve networks.");
    }
    if (caller.token.teamId !== null && entry.team !== null) {
      const team = await teamOfRequest(services, entry.team, entry.path.exec(req.path)![1]);
      // Outside the token's team reads as absent, like a team the person is not in.
      if (team !== null && team !== caller.token.teamId) throw notFound(entry.team === "team" ? "That team" : "That network");
    }
    res.locals.user = caller.user;
    res.locals.session = null;
    res.locals.apiToken = caller.token;
    next();
  };
}

// The cookie session and its origin check apply only to requests that did not come with a token.
export function unlessToken(handler: RequestHandler): RequestHandler {
  return (req, res, next) => (res.locals.apiToken ? next() : handler(req, res, next));
}
