// Review across teams: the latest revisions waiting for my verdict, and my own revisions still in review.
import { and, eq, inArray, ne, or, isNull, sql } from "drizzle-orm";
import type { Database } from "../db/client.js";
import { networks, revisions, teamMembers, teams, users } from "../db/schema.js";
import { openNoteCounts } from "./reviews.js";
import { permalink } from "./revisions.js";
import { hasStandingVerdict, statesAcrossTeams, type RevisionState } from "./verdicts.js";

export interface QueuePage {
  page: number;
  pageSize: number;
}

interface QueueItem {
  network: { id: string; slug: string; title: string; teamId: string; teamName: string };
  revision: number;
  permalink: string;
  author: { id: string; name: string } | null;
  createdAt: string;
  state: RevisionState;
  openNotes: number;
}

const isLatest = sql`${revisions.number} = (select max(r2.number) from revisions r2 where r2.network_id = ${networks.id})`;

// The latest revision of each network in the caller's teams, with the caller's role there.
async function latestRevisions(db: Database, userId: string, where: ReturnType<typeof and>) {
  return db
    .select({
      revisionId: revisions.id,
      number: revisions.number,
      createdBy: revisions.createdBy,
      createdAt: revisions.createdAt,
      authorName: users.name,
      network: { id: networks.id, slug: networks.slug, title: networks.title, teamId: networks.teamId, teamName: teams.name },
      requiredApprovals: teams.requiredApprovals,
    })
    .from(revisions)
    .innerJoin(networks, eq(networks.id, revisions.networkId))
    .innerJoin(teams, eq(teams.id, networks.teamId))
    .innerJoin(teamMembers, and(eq(teamMembers.teamId, networks.teamId), eq(teamMembers.userId, userId)))
    .leftJoin(users, eq(users.id, revisions.createdBy))
    .where(and(isLatest, where));
}

type Candidate = Awaited<ReturnType<typeof latestRevisions>>[number];

async function pageOf(db: Database, rows: Candidate[], states: Map<string, { state: RevisionState }>, query: QueuePage) {
  const slice = rows.slice((query.page - 1) * query.pageSize, query.page * query.pageSize);
  const notes = await openNoteCounts(db, slice.map((r) => r.revisionId));
  const items: QueueItem[] = slice.map((r) => ({
    network: r.network,
    revision: r.number,
    permalink: permalink(r.network.slug, r.number),
    author: r.createdBy && r.authorName !== null ? { id: r.createdBy, name: r.authorName } : null,
    createdAt: r.createdAt.toISOString(),
    state: states.get(r.revisionId)!.state,
    openNotes: notes.get(r.revisionId)!,
  }));
  return { items, total: rows.length, page: query.page, pageSize: query.pageSize };
}

/** Open revisions where I review (reviewer or owner), did not solve them and have no standing verdict; oldest first. */
export async function awaitingMyReview(db: Database, userId: string, query: QueuePage) {
  const rows = await latestRevisions(db, userId, and(inArray(teamMembers.role, ["reviewer", "owner"]), or(isNull(revisions.createdBy), ne(revisions.createdBy, userId))));
  const states = await statesAcrossTeams(db, rows.map((r) => ({ id: r.revisionId, createdBy: r.createdBy, requiredApprovals: r.requiredApprovals })));
  const waiting = rows
    .filter((r) => {
      const { state, history } = states.get(r.revisionId)!;
      return state.verdict === "open" && !hasStandingVerdict(history, userId);
    })
    .sort((a, b) => a.createdAt.getTime() - b.createdAt.getTime() || a.revisionId.localeCompare(b.revisionId));
  return pageOf(db, waiting, states, query);
}

/** Revisions I solved that are the latest of their network and not approved yet; newest first. */
export async function myRevisionsInReview(db: Database, userId: string, query: QueuePage) {
  const rows = await latestRevisions(db, userId, eq(revisions.createdBy, userId));
  const states = await statesAcrossTeams(db, rows.map((r) => ({ id: r.revisionId, createdBy: r.createdBy, requiredApprovals: r.requiredApprovals })));
  const inReview = rows
    .filter((r) => states.get(r.revisionId)!.state.verdict !== "approved")
    .sort((a, b) => b.createdAt.getTime() - a.createdAt.getTime() || a.revisionId.localeCompare(b.revisionId));
  return pageOf(db, inReview, states, query);
}
