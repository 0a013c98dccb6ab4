// Teams, their members and roles; invitations by e-mail with an expiring token.
import { and, asc, count, eq, gt, isNull, sql } from "drizzle-orm";
import type { Database } from "../db/client.js";
import { invitations, teamMembers, teams, users, type Role } from "../db/schema.js";
import { Conflict, Forbidden, notFound } from "./errors.js";
import { hashToken, newToken } from "../lib/tokens.js";
import { invitationMail } from "../mail/templates.js";
import { requireTeamRole } from "./access.js";
import type { PublicUser } from "./accounts.js";
import { link, type Services, type Transaction } from "./services.js";

const invitationLifetimeMs = 7 * 24 * 3_600_000;

interface TeamMember {
  userId: string;
  name: string;
  email: string;
  role: Role;
}

export interface TeamDetail {
  id: string;
  name: string;
  personal: boolean;
  role: Role;
  requiredApprovals: number;
  members: TeamMember[];
  createdAt: string;
}

export async function createTeam(db: Database, userId: string, name: string) {
  return db.transaction(async (tx) => {
    const [team] = await tx.insert(teams).values({ name }).returning();
    await tx.insert(teamMembers).values({ teamId: team.id, userId, role: "owner" });
    return { id: team.id, name: team.name, personal: false, role: "owner" as Role, requiredApprovals: team.requiredApprovals, createdAt: team.createdAt.toISOString() };
  });
}

export async function teamDetail(db: Database, userId: string, teamId: string): Promise<TeamDetail> {
  const role = await requireTeamRole(db, userId, teamId, "viewer");
  const [team] = await db.select().from(teams).where(eq(teams.id, teamId));
  const members = await db
    .select({ userId: users.id, name: users.name, email: users.email, role: teamMembers.role })
    .from(teamMembers)
    .innerJoin(users, eq(users.id, teamMembers.userId))
    .where(eq(teamMembers.teamId, teamId))
    .orderBy(asc(users.name));
  return {
    id: team.id,
    name: team.name,
    personal: team.personalUserId === userId,
    role,
    requiredApprovals: team.requiredApprovals,
    members,
    createdAt: team.createdAt.toISOString(),
  };
}

// Owners rename the team and set how many approvals a revision needs.
export async function updateTeam(db: Database, userId: string, teamId: string, changes: { name?: string; requiredApprovals?: number }): Promise<TeamDetail> {
  await requireTeamRole(db, userId, teamId, "owner");
  await db.update(teams).set(changes).where(eq(teams.id, teamId));
  return teamDetail(db, userId, teamId);
}

// A personal team belongs to one person for good: it cannot be left, given away or get another owner.
const personalTeam = (message: string) => new Conflict("personal_team", message);

async function personalHolder(db: Database, teamId: string): Promise<string | null> {
  const [team] = await db.select({ personalUserId: teams.personalUserId }).from(teams).where(eq(teams.id, teamId));
  return team?.personalUserId ?? null;
}

function checkPersonalRole(holder: string | null, memberId: string | null, role: Role) {
  if (!holder) return;
  if (memberId === holder && role !== "owner") throw personalTeam("A personal team cannot be given away: its holder stays its owner.");
  if (memberId !== holder && role === "owner") throw personalTeam("A personal team has one owner, its holder; invite others with another role.");
}

export async function deleteTeam(db: Database, userId: string, teamId: string): Promise<void> {
  await requireTeamRole(db, userId, teamId, "owner");
  const [team] = await db.select({ personalUserId: teams.personalUserId }).from(teams).where(eq(teams.id, teamId));
  if (team.personalUserId) throw new Conflict("personal_team", "A personal team cannot be deleted.");
  await db.delete(teams).where(eq(teams.id, teamId));
}

const lastOwner = () => new Conflict("last_owner", "A team keeps at least one owner; make someone else owner first.");

/**
 * Membership changes of one team run one at a time: the team row is locked for update, then the
 * acting member's role, the member's role and the owner count are read and the change written in
 * the same transaction, so two owners demoting each other (or both leaving) cannot leave none.
 */
async function changeMembership(
  db: Database,
  userId: string,
  teamId: string,
  memberId: string,
  minimum: Role,
  write: (tx: Transaction, current: Role, owners: number) => Promise<void>,
): Promise<void> {
  await db.transaction(async (tx) => {
    const locked = await tx.select({ id: teams.id }).from(teams).where(eq(teams.id, teamId)).for("update");
    if (locked.length === 0) throw notFound("That team");
    await requireTeamRole(tx, userId, teamId, minimum);
    const [member] = await tx.select({ role: teamMembers.role }).from(teamMembers).where(and(eq(teamMembers.teamId, teamId), eq(teamMembers.userId, memberId)));
    if (!member) throw notFound("That member");
    const [owners] = await tx.select({ n: count() }).from(teamMembers).where(and(eq(teamMembers.teamId, teamId), eq(teamMembers.role, "owner")));
    await write(tx, member.role, owners.n);
  });
}

export async function changeMemberRole(db: Database, userId: string, teamId: string, memberId: string, role: Role): Promise<TeamDetail> {
  await changeMembership(db, userId, teamId, memberId, "owner", async (tx, current, owners) => {
    checkPersonalRole(await personalHolder(tx, teamId), memberId, role);
    if (current === "owner" && role !== "owner" && owners <= 1) throw lastOwner();
    await tx.update(teamMembers).set({ role }).where(and(eq(teamMembers.teamId, teamId), eq(teamMembers.userId, memberId)));
  });
  return teamDetail(db, userId, teamId);
}

// Owners remove anyone; every member may leave by removing themselves.
export async function removeMember(db: Database, userId: string, teamId: string, memberId: string): Promise<void> {
  await changeMembership(db, userId, teamId, memberId, memberId === userId ? "viewer" : "owner", async (tx, current, owners) => {
    if ((await personalHolder(tx, teamId)) === memberId) throw personalTeam("A personal team cannot be left: it is its holder's own.");
    if (current === "owner" && owners <= 1) throw lastOwner();
    await tx.delete(teamMembers).where(and(eq(teamMembers.teamId, teamId), eq(teamMembers.userId, memberId)));
  });
}

// ---- invitations ----

type InvitationRow = typeof invitations.$inferSelect;

function invitationView(row: InvitationRow) {
  return {
    id: row.id,
    email: row.email,
    role: row.role,
    expiresAt: row.expiresAt.toISOString(),
    acceptedAt: row.acceptedAt?.toISOString() ?? null,
    createdAt: row.createdAt.toISOString(),
  };
}

const ownerWarning = "An owner can change every member's role, remove anyone, invite others and delete the team.";

export async function inviteMember(services: Services, inviter: PublicUser, teamId: string, email: string, role: Role) {
  const { db } = services;
  await requireTeamRole(db, inviter.id, teamId, "owner");
  // Mail to other people only from a confirmed address, so sign-ups cannot be used to send spam.
  if (!inviter.emailVerified) throw new Forbidden("email_unverified", "Confirm your own e-mail address before inviting others.");
  const [existing] = await db
    .select({ id: users.id })
    .from(teamMembers)
    .innerJoin(users, eq(users.id, teamMembers.userId))
    .where(and(eq(teamMembers.teamId, teamId), eq(users.email, email)));
  if (existing) throw new Conflict("already_member", "This address already belongs to a member of the team.", { fields: { email: "already a member" } });
  checkPersonalRole(await personalHolder(db, teamId), null, role);
  const [team] = await db.select({ name: teams.name }).from(teams).where(eq(teams.id, teamId));
  const { token, hash } = newToken();
  const [row] = await db
    .insert(invitations)
    .values({ teamId, email, role, tokenHash: hash, invitedBy: inviter.id, expiresAt: new Date(Date.now() + invitationLifetimeMs) })
    .returning();
  await services.mailer.send(invitationMail(email, inviter.name, team.name, role, link(services, `/invitations/accept?token=${token}`)));
  return { ...invitationView(row), ...(role === "owner" ? { warning: ownerWarning } : {}) };
}

export async function pendingInvitations(db: Database, userId: string, teamId: string) {
  await requireTeamRole(db, userId, teamId, "owner");
  const rows = await db
    .select()
    .from(invitations)
    .where(and(eq(invitations.teamId, teamId), isNull(invitations.acceptedAt), gt(invitations.expiresAt, sql`now()`)))
    .orderBy(asc(invitations.createdAt));
  return rows.map(invitationView);
}

export async function revokeInvitation(db: Database, userId: string, teamId: string, invitationId: string): Promise<void> {
  await requireTeamRole(db, userId, teamId, "owner");
  const deleted = await db
    .delete(invitations)
    .where(and(eq(invitations.id, invitationId), eq(invitations.teamId, teamId), isNull(invitations.acceptedAt)))
    .returning({ id: invitations.id });
  if (deleted.length === 0) throw notFound("That invitation");
}

async function openInvitation(db: Database, token: string) {
  const [row] = await db
    .select({ invitation: invitations, teamName: teams.name, inviterName: users.name })
    .from(invitations)
    .innerJoin(teams, eq(teams.id, invitations.teamId))
    .leftJoin(users, eq(users.id, invitations.invitedBy))
    .where(and(eq(invitations.tokenHash, hashToken(token)), isNull(invitations.acceptedAt), gt(invitations.expiresAt, sql`now()`)));
  return row ?? null;
}

// What the accept page shows before the invitee signs in: the token is the only credential.
export async function invitationPreview(db: Database, token: string) {
  const row = await openInvitation(db, token);
  if (!row) throw notFound("That invitation");
  return {
    team: { id: row.invitation.teamId, name: row.teamName },
    role: row.invitation.role,
    email: row.invitation.email,
    invitedBy: row.inviterName,
    expiresAt: row.invitation.expiresAt.toISOString(),
  };
}

// Only the invited address, signed in and confirmed, accepts: a forwarded link lets nobody else in.
export async function acceptInvitation(db: Database, user: PublicUser, token: string) {
  const userId = user.id;
  return db.transaction(async (tx) => {
    const [invitation] = await tx
      .update(invitations)
      .set({ acceptedAt: new Date(), acceptedBy: userId })
      .where(and(eq(invitations.tokenHash, hashToken(token)), isNull(invitations.acceptedAt), gt(invitations.expiresAt, sql`now()`)))
      .returning();
    if (!invitation) throw notFound("That invitation");
    if (invitation.email.toLowerCase() !== user.email.toLowerCase() || !user.emailVerified) {
      throw new Forbidden(
        "invitation_address",
        invitation.email.toLowerCase() !== user.email.toLowerCase()
          ? `This invitation is for ${invitation.email}. Sign in with that address to accept it; you are signed in as ${user.email}.`
          : `This invitation is for ${invitation.email}: confirm that address first (the link is in the mail we sent it), then accept.`,
      );
    }
    const joined = await tx
      .insert(teamMembers)
      .values({ teamId: invitation.teamId, userId, role: invitation.role })
      .onConflictDoNothing()
      .returning({ role: teamMembers.role });
    if (joined.length === 0) throw new Conflict("already_member", "You are already a member of this team.");
    const [team] = await tx.select().from(teams).where(eq(teams.id, invitation.teamId));
    return { id: team.id, name: team.name, role: invitation.role, personal: false };
  });
}
