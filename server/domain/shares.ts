// Share links: read-only, revocable, optionally expiring access to one revision, no account needed.
import { and, asc, eq, gt, isNull, or, sql } from "drizzle-orm";
import type { Database } from "../db/client.js";
import { networks, revisions, shareLinks, teamMembers, users } from "../db/schema.js";
import { Invalid, forbidden, notFound } from "./errors.js";
import { hashToken, newToken } from "../lib/tokens.js";
import { roleAtLeast } from "../../shared/api/common.js";
import { requireRevision, revisionView } from "./revisions.js";
import { link, type Services } from "./services.js";
import { valueSetsOf } from "./value-sets.js";

type ShareRow = typeof shareLinks.$inferSelect;

function status(row: Pick<ShareRow, "revokedAt" | "expiresAt">): "active" | "revoked" | "expired" {
  if (row.revokedAt) return "revoked";
  if (row.expiresAt && row.expiresAt.getTime() <= Date.now()) return "expired";
  return "active";
}

export async function createShare(services: Services, userId: string, networkId: string, number: number, expiresAt: Date | null) {
  const { revision } = await requireRevision(services.db, userId, networkId, number, "editor");
  if (expiresAt && expiresAt.getTime() <= Date.now()) {
    throw new Invalid("invalid_body", "The expiry must be in the future.", { fields: { expiresAt: "must be in the future" } });
  }
  const { token, hash } = newToken();
  const [row] = await services.db.insert(shareLinks).values({ revisionId: revision.id, tokenHash: hash, createdBy: userId, expiresAt }).returning();
  return {
    id: row.id,
    token,
    url: link(services, `/s/${token}`),
    revision: revision.number,
    expiresAt: row.expiresAt?.toISOString() ?? null,
    createdAt: row.createdAt.toISOString(),
  };
}

// Every link of a revision with its state, so the team sees who outside it can read what.
export async function listShares(db: Database, userId: string, networkId: string, number: number) {
  await requireRevision(db, userId, networkId, number, "viewer");
  const rows = await db
    .select({ share: shareLinks, revision: revisions.number, creatorName: users.name })
    .from(shareLinks)
    .innerJoin(revisions, eq(revisions.id, shareLinks.revisionId))
    .leftJoin(users, eq(users.id, shareLinks.createdBy))
    .where(and(eq(revisions.networkId, networkId), eq(revisions.number, number)))
    .orderBy(asc(shareLinks.createdAt));
  return rows.map(({ share, revision, creatorName }) => ({
    id: share.id,
    revision,
    status: status(share),
    createdBy: share.createdBy && creatorName ? { id: share.createdBy, name: creatorName } : null,
    createdAt: share.createdAt.toISOString(),
    expiresAt: share.expiresAt?.toISOString() ?? null,
    revokedAt: share.revokedAt?.toISOString() ?? null,
  }));
}

async function revoke(db: Database, shareId: string): Promise<void> {
  await db.update(shareLinks).set({ revokedAt: sql`coalesce(${shareLinks.revokedAt}, now())` }).where(eq(shareLinks.id, shareId));
}

// Revoking by token: for whoever holds the link and edits in its team; others learn nothing.
export async function revokeShareByToken(db: Database, userId: string, token: string): Promise<void> {
  const [row] = await db
    .select({ id: shareLinks.id, role: teamMembers.role })
    .from(shareLinks)
    .innerJoin(revisions, eq(revisions.id, shareLinks.revisionId))
    .innerJoin(networks, eq(networks.id, revisions.networkId))
    .innerJoin(teamMembers, and(eq(teamMembers.teamId, networks.teamId), eq(teamMembers.userId, userId)))
    .where(eq(shareLinks.tokenHash, hashToken(token)));
  if (!row) throw notFound("That share link");
  if (!roleAtLeast(row.role, "editor")) throw forbidden();
  await revoke(db, row.id);
}

export async function revokeShare(db: Database, userId: string, networkId: string, number: number, shareId: string): Promise<void> {
  const { revision } = await requireRevision(db, userId, networkId, number, "editor");
  const [row] = await db
    .select({ id: shareLinks.id })
    .from(shareLinks)
    .where(and(eq(shareLinks.id, shareId), eq(shareLinks.revisionId, revision.id)));
  if (!row) throw notFound("That share link");
  await revoke(db, row.id);
}

async function liveShare(db: Database, token: string) {
  const [row] = await db
    // The network's own circuit is not needed here: the revision carries its snapshot.
    .select({ share: shareLinks, revision: revisions, network: { id: networks.id, teamId: networks.teamId, slug: networks.slug, title: networks.title, description: networks.description } })
    .from(shareLinks)
    .innerJoin(revisions, eq(revisions.id, shareLinks.revisionId))
    .innerJoin(networks, eq(networks.id, revisions.networkId))
    .where(and(eq(shareLinks.tokenHash, hashToken(token)), isNull(shareLinks.revokedAt), or(isNull(shareLinks.expiresAt), gt(shareLinks.expiresAt, sql`now()`))));
  return row ?? null;
}

const shareGone = () => notFound("That share link");

// What a share link shows: the revision read-only, without the team's review discussion.
export async function sharedRevision(db: Database, token: string) {
  const row = await liveShare(db, token);
  if (!row) throw shareGone();
  const revision = await revisionView(db, row.network, row.revision);
  return {
    readOnly: true as const,
    network: { title: row.network.title, description: row.network.description, slug: row.network.slug },
    revision,
    // The network's value sets, so the reviewer reads the same numbers the designer chose.
    valueSets: await valueSetsOf(db, row.network.id),
    expiresAt: row.share.expiresAt?.toISOString() ?? null,
  };
}

// Title and one plain line of results for link previews (chat, review tools); null when the link is dead.
export async function sharePreview(db: Database, token: string): Promise<{ title: string; description: string } | null> {
  const row = await liveShare(db, token);
  if (!row) return null;
  const results = row.revision.results as Record<string, { compact?: string; infix?: string } | null>;
  const form = (name: string) => results[name]?.compact ?? results[name]?.infix ?? "none";
  return {
    title: `${row.network.title} — revision ${row.revision.number} · Portfold`,
    description: `Vth = ${form("vth")}, Rth = ${form("rth")}`,
  };
}
