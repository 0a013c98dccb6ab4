// Personal API tokens: created and revoked by their owner in a browser session, used by scripts as a bearer secret.
import { randomBytes } from "node:crypto";
import { and, desc, eq, gt, isNull, lt, or } from "drizzle-orm";
import type { ApiToken, CreateTokenRequest, CreatedToken, CurrentToken } from "../../shared/api/tokens.js";
import type { Database } from "../db/client.js";
import { apiTokens, networks, teams, users } from "../db/schema.js";
import { Unauthenticated, notFound } from "./errors.js";
import { hashToken } from "../lib/tokens.js";
import { accountOverview, publicUser } from "./accounts.js";
import { requireTeamRole } from "./access.js";

// A recognisable prefix lets secret scanners and people tell a Portfold token from other secrets.
const tokenPrefix = "pft_";
const secretPattern = /^pft_[A-Za-z0-9_-]{43}$/;
// last_used_at is written at most this often per token, so a busy script does not write on every request.
const touchEveryMs = 60_000;

type TokenRow = typeof apiTokens.$inferSelect;

function view(row: TokenRow, team: { id: string; name: string } | null, now = new Date()): ApiToken {
  return {
    id: row.id,
    name: row.name,
    hint: row.hint,
    scope: row.scope,
    team,
    expiresAt: row.expiresAt.toISOString(),
    lastUsedAt: row.lastUsedAt?.toISOString() ?? null,
    createdAt: row.createdAt.toISOString(),
    expired: row.expiresAt <= now,
  };
}

async function tokenTeam(db: Database, teamId: string | null): Promise<{ id: string; name: string } | null> {
  if (teamId === null) return null;
  const [row] = await db.select({ id: teams.id, name: teams.name }).from(teams).where(eq(teams.id, teamId));
  return row ?? null;
}

export async function listApiTokens(db: Database, userId: string): Promise<ApiToken[]> {
  const rows = await db
    .select({ token: apiTokens, teamName: teams.name })
    .from(apiTokens)
    .leftJoin(teams, eq(teams.id, apiTokens.teamId))
    .where(and(eq(apiTokens.userId, userId), isNull(apiTokens.revokedAt)))
    .orderBy(desc(apiTokens.createdAt));
  return rows.map(({ token, teamName }) => view(token, token.teamId && teamName !== null ? { id: token.teamId, name: teamName } : null));
}

export async function createApiToken(db: Database, userId: string, input: CreateTokenRequest): Promise<CreatedToken> {
  // A token for one team needs membership of it; the role stays the person's, checked on every use.
  if (input.teamId !== null) await requireTeamRole(db, userId, input.teamId, "viewer");
  const team = await tokenTeam(db, input.teamId);
  const secret = tokenPrefix + randomBytes(32).toString("base64url");
  const [row] = await db
    .insert(apiTokens)
    .values({
      userId,
      name: input.name,
      tokenHash: hashToken(secret),
      hint: secret.slice(-4),
      scope: input.scope,
      teamId: input.teamId,
      expiresAt: new Date(Date.now() + input.expiresInDays * 86_400_000),
    })
    .returning();
  return { token: view(row, team), secret };
}

export async function revokeApiToken(db: Database, userId: string, tokenId: string): Promise<void> {
  const revoked = await db
    .update(apiTokens)
    .set({ revokedAt: new Date() })
    .where(and(eq(apiTokens.id, tokenId), eq(apiTokens.userId, userId), isNull(apiTokens.revokedAt)))
    .returning({ id: apiTokens.id });
  if (revoked.length === 0) throw notFound("That token");
}

export interface TokenCaller {
  user: { id: string; email: string; name: string; emailVerified: boolean };
  token: TokenRow;
}

const invalidApiToken = () =>
  new Unauthenticated("invalid_token", "This API token is unknown, revoked or expired; create a new one on your account page.", true);

// The person behind a bearer secret, or a 401: unknown, revoked and expired tokens answer alike.
export async function authenticateApiToken(db: Database, secret: string): Promise<TokenCaller> {
  if (!secretPattern.test(secret)) throw invalidApiToken();
  const now = new Date();
  const [row] = await db
    .select({ token: apiTokens, user: users })
    .from(apiTokens)
    .innerJoin(users, eq(users.id, apiTokens.userId))
    .where(and(eq(apiTokens.tokenHash, hashToken(secret)), isNull(apiTokens.revokedAt), gt(apiTokens.expiresAt, now)));
  if (!row) throw invalidApiToken();
  await db
    .update(apiTokens)
    .set({ lastUsedAt: now })
    .where(and(eq(apiTokens.id, row.token.id), or(isNull(apiTokens.lastUsedAt), lt(apiTokens.lastUsedAt, new Date(now.getTime() - touchEveryMs)))));
  return { user: publicUser(row.user), token: { ...row.token, lastUsedAt: now } };
}

// The token a script sends, with the teams it reaches and the person's role in each.
export async function describeApiToken(db: Database, caller: TokenCaller): Promise<CurrentToken> {
  const { user, teams: memberships } = await accountOverview(db, caller.user.id);
  const reached = memberships.filter((team) => caller.token.teamId === null || team.id === caller.token.teamId);
  return {
    token: view(caller.token, await tokenTeam(db, caller.token.teamId)),
    user: { id: user.id, name: user.name, email: user.email },
    teams: reached,
  };
}

// The team a path's network belongs to, for a token kept to one team; null when there is no such network.
export async function teamOfNetwork(db: Database, by: { id: string } | { slug: string }): Promise<string | null> {
  const [row] = await db
    .select({ teamId: networks.teamId })
    .from(networks)
    .where("id" in by ? eq(networks.id, by.id) : eq(networks.slug, by.slug));
  return row?.teamId ?? null;
}
