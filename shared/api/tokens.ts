// Personal API tokens: what the account page and scripts send and get back.
import { z } from "zod";

export const tokenScopes = ["read", "solve"] as const;
export type TokenScope = (typeof tokenScopes)[number];

// A year at most: a forgotten token stops working on its own.
const maxTokenDays = 366;

export const createTokenRequest = z
  .object({
    name: z.string().trim().min(1, { error: "Give the token a name." }).max(100),
    scope: z.enum(tokenScopes, { error: "The scope is read or solve." }),
    // null: every team the person belongs to, now and later.
    teamId: z.uuid({ error: "Choose a team or all teams." }).nullable(),
    expiresInDays: z.number().int().min(1).max(maxTokenDays, { error: `At most ${maxTokenDays} days.` }),
  })
  .meta({ id: "CreateTokenRequest" });
export type CreateTokenRequest = z.infer<typeof createTokenRequest>;

const apiToken = z
  .object({
    id: z.uuid(),
    name: z.string(),
    // The secret's last four characters.
    hint: z.string(),
    scope: z.enum(tokenScopes),
    team: z.object({ id: z.uuid(), name: z.string() }).nullable(),
    expiresAt: z.iso.datetime({ offset: true }),
    lastUsedAt: z.iso.datetime({ offset: true }).nullable(),
    createdAt: z.iso.datetime({ offset: true }),
    expired: z.boolean(),
  })
  .meta({ id: "ApiToken" });
export type ApiToken = z.infer<typeof apiToken>;

export const tokenList = z.object({ tokens: z.array(apiToken) }).meta({ id: "TokenList" });
export type TokenList = z.infer<typeof tokenList>;

// The only answer that carries the secret: it is shown once and never again.
export const createdToken = z.object({ token: apiToken, secret: z.string() }).meta({ id: "CreatedToken" });
export type CreatedToken = z.infer<typeof createdToken>;

// What a script learns about the token it sends: its scope and the teams it reaches, with the person's role.
export const currentToken = z
  .object({
    token: apiToken,
    user: z.object({ id: z.string(), name: z.string(), email: z.string() }),
    teams: z.array(z.object({ id: z.uuid(), name: z.string(), role: z.enum(["owner", "editor", "reviewer", "viewer"]), personal: z.boolean() })),
  })
  .meta({ id: "CurrentToken" });
export type CurrentToken = z.infer<typeof currentToken>;
