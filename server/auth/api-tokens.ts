// Bearer tokens for scripts: who is calling, and which routes a token of that scope and team may reach.
import type { RequestHandler } from "express";
import { verifyRequestOrigin } from "lucia";
import type { TokenScope } from "../../shared/api/tokens.js";
import { authenticateApiToken, teamOfNetwork, type TokenCaller } from "../domain/api-tokens.js";
import type { Services } from "../domain/services.js";
import { HttpError, notFound } from "../lib/errors.js";

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Locals {
      // Set when the request authenticated with `Authorization: Bearer …` instead of the session cookie.
      apiToken?: TokenCaller["token"];
    }
  }
}

const uuid = "[0-9a-fA-F]{8}-[0-9a-fA-F]{4}-[0-9a-fA-F]{4}-[0-9a-fA-F]{4}-[0-9a-fA-F]{12}";

type TeamFrom = "team" | "network" | "slug" | null;

// Every route a token reaches; anything else (token management, accounts, teams, reviews, shares) needs a browser session.
export const tokenRoutes: { method: string; path: RegExp; scope: TokenScope; team: TeamFrom; route: string }[] = [
  { method: "GET", path: /^\/account\/tokens\/current$/, scope: "read", team: null, route: "/account/tokens/current" },
  { method: "GET", path: new RegExp(`^/teams/(${uuid})$`), scope: "read", team: "team", route: "/teams/:teamId" },
  { method: "GET", path: new RegExp(`^/teams/(${uuid})/members$`), scope: "read", team: "team", route: "/teams/:teamId/members" },
  { method: "GET", path: new RegExp(`^/teams/(${uuid})/networks$`), scope: "read", team: "team", route: "/teams/:teamId/networks" },
  { method: "GET", path: new RegExp(`^/teams/(${uuid})/cells$`), scope: "read", team: "team", route: "/teams/:teamId/cells" },
  { method: "GET", path: /^\/networks\/by-slug\/([a-z0-9-]{1,80})$/, scope: "read", team: "slug", route: "/networks/by-slug/:slug" },
  { method: "GET", path: new RegExp(`^/networks/(${uuid})$`), scope: "read", team: "network", route: "/networks/:networkId" },
  { method: "GET", path: new RegExp(`^/networks/(${uuid})/revisions$`), scope: "read", team: "network", route: "/networks/:networkId/revisions" },
  { method: "GET", path: new RegExp(`^/networks/(${uuid})/revisions/[^/]+$`), scope: "read", team: "network", route: "/networks/:networkId/revisions/:number" },
  { method: "GET", path: new RegExp(`^/networks/(${uuid})/revisions/[^/]+/compare/[^/]+$`), scope: "read", team: "network", route: "/networks/:networkId/revisions/:from/compare/:to" },
  { method: "GET", path: new RegExp(`^/networks/(${uuid})/solve-jobs/[^/]+$`), scope: "read", team: "network", route: "/networks/:networkId/solve-jobs/:jobId" },
  { method: "POST", path: new RegExp(`^/teams/(${uuid})/networks$`), scope: "solve", team: "team", route: "/teams/:teamId/networks" },
  { method: "POST", path: new RegExp(`^/teams/(${uuid})/networks/import$`), scope: "solve", team: "team", route: "/teams/:teamId/networks/import" },
  { method: "PATCH", path: new RegExp(`^/networks/(${uuid})$`), scope: "solve", team: "network", route: "/networks/:networkId" },
  { method: "POST", path: new RegExp(`^/networks/(${uuid})/solve$`), scope: "solve", team: "network", route: "/networks/:networkId/solve" },
];

const scopeCovers = (granted: TokenScope, needed: TokenScope) => granted === "solve" || needed === "read";

async function teamOfRequest(services: Services, from: TeamFrom, key: string): Promise<string | null> {
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
