// Who may do what: every check the client mirrors is made here, on the server.
import { and, eq } from "drizzle-orm";
import type { Database } from "../db/client.js";
import { networks, teamMembers, type Role } from "../db/schema.js";
import { forbidden, notFound } from "./errors.js";
import type { Transaction } from "./services.js";

import { roleAtLeast } from "../../shared/api/common.js";

async function memberRole(db: Database | Transaction, userId: string, teamId: string): Promise<Role | null> {
  const [row] = await db
    .select({ role: teamMembers.role })
    .from(teamMembers)
    .where(and(eq(teamMembers.teamId, teamId), eq(teamMembers.userId, userId)));
  return row?.role ?? null;
}

// Not a member: 404, so a team's existence never shows outside it. Member with too low a role: 403.
export async function requireTeamRole(db: Database | Transaction, userId: string, teamId: string, minimum: Role): Promise<Role> {
  const role = await memberRole(db, userId, teamId);
  if (!role) throw notFound("That team");
  if (!roleAtLeast(role, minimum)) throw forbidden();
  return role;
}

export type NetworkRow = typeof networks.$inferSelect;

export async function requireNetworkRole(
  db: Database | Transaction,
  userId: string,
  networkId: string,
  minimum: Role,
): Promise<{ network: NetworkRow; role: Role }> {
  const [row] = await db
    .select({ network: networks, role: teamMembers.role })
    .from(networks)
    .innerJoin(teamMembers, and(eq(teamMembers.teamId, networks.teamId), eq(teamMembers.userId, userId)))
    .where(eq(networks.id, networkId));
  if (!row) throw notFound("That network");
  if (!roleAtLeast(row.role, minimum)) throw forbidden();
  return row;
}
