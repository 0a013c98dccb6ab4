// Accounts: sign-up with a verified address, sign-in, password reset by e-mail link.
import { and, asc, eq, gt, isNull, sql } from "drizzle-orm";
import { generateIdFromEntropySize } from "lucia";
import { createSessionToken } from "../auth/lucia.js";
import { hashPassword, verifyDecoy, verifyPassword } from "../auth/password.js";
import type { Database } from "../db/client.js";
import { emailTokens, teamMembers, teams, users, type EmailTokenPurpose, type Role } from "../db/schema.js";
import { Conflict, Invalid, InvalidCredentials, signInRequired } from "./errors.js";
import { hashToken, newToken } from "../lib/tokens.js";
import { passwordResetMail, verificationMail } from "../mail/templates.js";
import { link, type Services, type Transaction } from "./services.js";

const hours = (n: number) => n * 3_600_000;
const tokenLifetime: Record<EmailTokenPurpose, number> = { verify_email: hours(48), reset_password: hours(1) };

export interface PublicUser {
  id: string;
  email: string;
  name: string;
  emailVerified: boolean;
}

type UserRow = typeof users.$inferSelect;

export function publicUser(row: Pick<UserRow, "id" | "email" | "name" | "emailVerifiedAt">): PublicUser {
  return { id: row.id, email: row.email, name: row.name, emailVerified: row.emailVerifiedAt !== null };
}

const invalidToken = () => new Invalid("invalid_token", "This link is invalid, already used or expired.");

export function personalTeamName(name: string): string {
  return `${name}'s networks`;
}

function isUniqueViolation(error: unknown, constraint: string): boolean {
  const e = error as { code?: string; constraint?: string; cause?: { code?: string; constraint?: string } };
  const pg = e?.code === "23505" ? e : e?.cause?.code === "23505" ? e.cause : null;
  return pg !== null && pg.constraint === constraint;
}

// The account and its personal team in one transaction; used by sign-up, the seed and test fixtures.
export async function createAccount(
  db: Database,
  input: { email: string; password: string; name: string; verified?: boolean; id?: string },
): Promise<PublicUser> {
  const passwordHash = await hashPassword(input.password);
  try {
    return await db.transaction(async (tx) => {
      const [user] = await tx
        .insert(users)
        .values({
          id: input.id ?? generateIdFromEntropySize(10),
          email: input.email,
          name: input.name,
          passwordHash,
          emailVerifiedAt: input.verified ? new Date() : null,
        })
        .returning();
      const [team] = await tx.insert(teams).values({ name: personalTeamName(input.name), personalUserId: user.id }).returning();
      await tx.insert(teamMembers).values({ teamId: team.id, userId: user.id, role: "owner" });
      return publicUser(user);
    });
  } catch (error) {
    if (isUniqueViolation(error, "users_email_unique")) {
      throw new Conflict("email_taken", "An account with this e-mail address already exists.", { fields: { email: "already registered" } });
    }
    throw error;
  }
}

export async function signUp(services: Services, input: { email: string; password: string; name: string }): Promise<PublicUser> {
  const user = await createAccount(services.db, input);
  await sendVerification(services, user);
  return user;
}

export async function sendVerification(services: Services, user: PublicUser): Promise<void> {
  const token = await issueEmailToken(services.db, user.id, "verify_email");
  await services.mailer.send(verificationMail(user.email, user.name, link(services, `/verify-email?token=${token}`)));
}

export async function signIn(db: Database, email: string, password: string): Promise<PublicUser> {
  const [row] = await db.select().from(users).where(eq(users.email, email));
  const valid = row?.passwordHash ? await verifyPassword(row.passwordHash, password) : await verifyDecoy(password);
  if (!row || !valid) throw new InvalidCredentials();
  return publicUser(row);
}

/** A new session for the user; returns the token for the cookie (the database keeps its hash). */
export function startSession(services: Services, userId: string): Promise<string> {
  return createSessionToken(services.auth, userId);
}

async function issueEmailToken(db: Database | Transaction, userId: string, purpose: EmailTokenPurpose): Promise<string> {
  const { token, hash } = newToken();
  await db.insert(emailTokens).values({ userId, purpose, tokenHash: hash, expiresAt: new Date(Date.now() + tokenLifetime[purpose]) });
  return token;
}

// Single use: the update that marks the token used is also the check, so two clicks cannot both pass.
async function consumeEmailToken(db: Database | Transaction, token: string, purpose: EmailTokenPurpose): Promise<string | null> {
  const [row] = await db
    .update(emailTokens)
    .set({ usedAt: new Date() })
    .where(
      and(
        eq(emailTokens.tokenHash, hashToken(token)),
        eq(emailTokens.purpose, purpose),
        isNull(emailTokens.usedAt),
        gt(emailTokens.expiresAt, sql`now()`),
      ),
    )
    .returning({ userId: emailTokens.userId });
  return row?.userId ?? null;
}

export async function verifyEmail(db: Database, token: string): Promise<PublicUser> {
  return db.transaction(async (tx) => {
    const userId = await consumeEmailToken(tx, token, "verify_email");
    if (!userId) throw invalidToken();
    const [user] = await tx
      .update(users)
      .set({ emailVerifiedAt: sql`coalesce(${users.emailVerifiedAt}, now())` })
      .where(eq(users.id, userId))
      .returning();
    return publicUser(user);
  });
}

// Answers the same, in the same time, whether or not the address has an account: the request only
// hands the address on; looking it up, issuing the token and mailing happen after the answer.
export function requestPasswordReset(services: Services, email: string): void {
  void sendPasswordReset(services, email).catch((error: unknown) => services.log.error({ err: error }, "a password-reset mail could not be prepared"));
}

async function sendPasswordReset(services: Services, email: string): Promise<void> {
  const [row] = await services.db.select().from(users).where(eq(users.email, email));
  if (!row) return;
  const token = await issueEmailToken(services.db, row.id, "reset_password");
  await services.mailer.send(passwordResetMail(row.email, row.name, link(services, `/reset-password?token=${token}`)));
}

export async function resetPassword(services: Services, token: string, password: string): Promise<PublicUser> {
  const passwordHash = await hashPassword(password);
  const user = await services.db.transaction(async (tx) => {
    const userId = await consumeEmailToken(tx, token, "reset_password");
    if (!userId) throw invalidToken();
    // Other reset links die with this one; the link also proves the address is the user's.
    await tx.delete(emailTokens).where(and(eq(emailTokens.userId, userId), eq(emailTokens.purpose, "reset_password"), isNull(emailTokens.usedAt)));
    const [row] = await tx
      .update(users)
      .set({ passwordHash, emailVerifiedAt: sql`coalesce(${users.emailVerifiedAt}, now())` })
      .where(eq(users.id, userId))
      .returning();
    return publicUser(row);
  });
  // Whoever knew the old password is signed out everywhere.
  await services.auth.invalidateUserSessions(user.id);
  return user;
}

export interface TeamMembership {
  id: string;
  name: string;
  role: Role;
  personal: boolean;
}

export interface AccountSettings {
  reviewMail: boolean;
}

export async function accountOverview(db: Database, userId: string): Promise<{ user: PublicUser; teams: TeamMembership[]; settings: AccountSettings }> {
  const [row] = await db.select().from(users).where(eq(users.id, userId));
  if (!row) throw signInRequired();
  const memberships = await db
    .select({ id: teams.id, name: teams.name, role: teamMembers.role, personalUserId: teams.personalUserId })
    .from(teamMembers)
    .innerJoin(teams, eq(teams.id, teamMembers.teamId))
    .where(eq(teamMembers.userId, userId))
    .orderBy(sql`${teams.personalUserId} is null`, asc(teams.name));
  return {
    user: publicUser(row),
    teams: memberships.map((m) => ({ id: m.id, name: m.name, role: m.role, personal: m.personalUserId === userId })),
    settings: { reviewMail: row.reviewMail },
  };
}

export async function updateAccountSettings(db: Database, userId: string, changes: Partial<AccountSettings>): Promise<AccountSettings> {
  const [row] = await db.update(users).set(changes).where(eq(users.id, userId)).returning({ reviewMail: users.reviewMail });
  if (!row) throw signInRequired();
  return { reviewMail: row.reviewMail };
}
