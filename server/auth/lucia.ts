import { DrizzlePostgreSQLAdapter } from "@lucia-auth/adapter-drizzle";
import { Lucia } from "lucia";
import type { Database } from "../db/client.js";
import { hashToken, newToken } from "../lib/tokens.js";
import { sessions, users } from "../db/schema.js";

export const sessionCookieName = "portfold_session";

export function createLucia(db: Database, options: { secureCookie: boolean }) {
  return new Lucia(new DrizzlePostgreSQLAdapter(db, sessions, users), {
    sessionCookie: {
      name: sessionCookieName,
      // httpOnly is always set by lucia; Secure everywhere except local development.
      attributes: { secure: options.secureCookie, sameSite: "lax" },
    },
    getUserAttributes: (row) => ({
      email: row.email,
      name: row.name,
      emailVerified: row.emailVerifiedAt !== null,
    }),
  });
}

export type Auth = ReturnType<typeof createLucia>;

/**
 * A new session: the cookie holds a 256-bit random token, the sessions table only its SHA-256 (lucia's
 * session id), so a leaked table or backup opens no session. Returns the token for the cookie.
 */
export async function createSessionToken(auth: Auth, userId: string): Promise<string> {
  const { token, hash } = newToken();
  await auth.createSession(userId, {}, { sessionId: hash });
  return token;
}

/** The session id (as stored) that a cookie's token stands for. */
export function sessionIdOf(token: string): string {
  return hashToken(token);
}

declare module "lucia" {
  interface Register {
    Lucia: Auth;
    // The drizzle adapter hands over the user row keyed by the schema's property names.
    DatabaseUserAttributes: { email: string; name: string; emailVerifiedAt: Date | null };
  }
}
