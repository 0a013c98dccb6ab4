import { DrizzlePostgreSQLAdapter } from "@lucia-auth/adapter-drizzle";
import { Lucia } from "lucia";
import type { Database } from "../db/client.js";
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

declare module "lucia" {
  interface Register {
    Lucia: Auth;
    // The drizzle adapter hands over the user row keyed by the schema's property names.
    DatabaseUserAttributes: { email: string; name: string; emailVerifiedAt: Date | null };
  }
}
