// Verdicts on a revision: a kept history of approvals, change requests and withdrawals, and the
// revision's state derived from it (each person's latest entry stands; the team sets how many approvals count).
import { and, desc, eq, inArray, lt, sql, type SQL } from "drizzle-orm";
import type { Database } from "../db/client.js";
import { revisionVerdicts, revisions, teams, users, type Role, type Verdict } from "../db/schema.js";
import { Conflict, Forbidden, Invalid, NotFound, forbidden } from "./errors.js";
import { verdictMail } from "../mail/templates.js";
import type { PublicUser } from "./accounts.js";
import { mailPeople } from "./review-mail.js";
import { permalink, requireRevision } from "./revisions.js";
import { link, type Services } from "./services.js";

type Person = { id: string; name: string } | null;

export interface VerdictEntry {
  id: string;
  revision: number;
  // "open": a withdrawal of the entry named in `withdraws`.
  verdict: Verdict;
  by: Person;
  role: Role | null;
  note: string | null;
  at: string;
  withdraws: string | null;
  // Set on an approval or change request that its giver later took back.
  withdrawnAt: string | null;
}

export interface RevisionState {
  verdict: Verdict;
  // Who decided the state and when: the latest change request, or the approval that completed the count.
  by: Person;
  at: string | null;
  approvals: number;
  requiredApprovals: number;
}

const verdictLabel: Record<Verdict, string> = { open: "open", approved: "approved", needs_changes: "needs changes" };

interface HistoryRow {
  id: string;
  revisionId: string;
  verdict: Verdict;
  userId: string | null;
  userName: string | null;
  role: Role | null;
  note: string | null;
  withdrawsId: string | null;
  createdAt: Date;
}

const person = (row: HistoryRow): Person => (row.userId && row.userName !== null ? { id: row.userId, name: row.userName } : null);

// Every entry of the given revisions, newest first.
async function historyRows(db: Database, revisionIds: string[]): Promise<Map<string, HistoryRow[]>> {
  const out = new Map<string, HistoryRow[]>(revisionIds.map((id) => [id, []]));
  if (revisionIds.length === 0) return out;
  const rows = await db
    .select({
      id: revisionVerdicts.id,
      revisionId: revisionVerdicts.revisionId,
      verdict: revisionVerdicts.verdict,
      userId: revisionVerdicts.userId,
      userName: users.name,
      role: revisionVerdicts.role,
      note: revisionVerdicts.note,
      withdrawsId: revisionVerdicts.withdrawsId,
      createdAt: revisionVerdicts.createdAt,
    })
    .from(revisionVerdicts)
    .leftJoin(users, eq(users.id, revisionVerdicts.userId))
    .where(inArray(revisionVerdicts.revisionId, revisionIds))
    .orderBy(desc(revisionVerdicts.createdAt), desc(revisionVerdicts.id));
  for (const row of rows) out.get(row.revisionId)!.push(row);
  return out;
}

// Each person's latest entry, when it is a verdict (not a withdrawal).
function standing(history: HistoryRow[]): HistoryRow[] {
  const latest = new Map<string | null, HistoryRow>();
  for (const row of history) if (!latest.has(row.userId)) latest.set(row.userId, row);
  return [...latest.values()].filter((row) => row.verdict !== "open");
}

/** The state of a revision from its history (newest first): any standing change request wins; else enough approvals by others than its author. */
function deriveState(history: HistoryRow[], requiredApprovals: number, authorId: string | null): RevisionState {
  const current = standing(history);
  const changes = current.filter((row) => row.verdict === "needs_changes");
  const approvals = current.filter((row) => row.verdict === "approved" && row.userId !== authorId);
  const base = { approvals: approvals.length, requiredApprovals };
  if (changes.length > 0) return { verdict: "needs_changes", by: person(changes[0]), at: changes[0].createdAt.toISOString(), ...base };
  if (approvals.length >= requiredApprovals) return { verdict: "approved", by: person(approvals[0]), at: approvals[0].createdAt.toISOString(), ...base };
  return { verdict: "open", by: null, at: null, ...base };
}

function entryView(row: HistoryRow, number: number, history: HistoryRow[]): VerdictEntry {
  const withdrawal = history.find((other) => other.withdrawsId === row.id);
  return {
    id: row.id,
    revision: number,
    verdict: row.verdict,
    by: person(row),
    role: row.role,
    note: row.note,
    at: row.createdAt.toISOString(),
    withdraws: row.withdrawsId,
    withdrawnAt: withdrawal?.createdAt.toISOString() ?? null,
  };
}

async function requiredApprovalsOf(db: Database, teamId: string): Promise<number> {
  const [team] = await db.select({ required: teams.requiredApprovals }).from(teams).where(eq(teams.id, teamId));
  return team?.required ?? 1;
}

/** States of revisions of one team's networks, by revision id. */
export async function revisionStates(db: Database, teamId: string, list: { id: string; createdBy: string | null }[]): Promise<Map<string, RevisionState>> {
  const [required, histories] = await Promise.all([requiredApprovalsOf(db, teamId), historyRows(db, list.map((r) => r.id))]);
  return new Map(list.map((r) => [r.id, deriveState(histories.get(r.id)!, required, r.createdBy)]));
}

/** The same derivation for many revisions of many teams (the review pages). */
export async function statesAcrossTeams(db: Database, list: { id: string; createdBy: string | null; requiredApprovals: number }[]) {
  const histories = await historyRows(db, list.map((r) => r.id));
  return new Map(list.map((r) => [r.id, { state: deriveState(histories.get(r.id)!, r.requiredApprovals, r.createdBy), history: histories.get(r.id)! }]));
}

/** Whether this person has a standing verdict in a history. */
export function hasStandingVerdict(history: HistoryRow[], userId: string): boolean {
  return standing(history).some((row) => row.userId === userId);
}

// The same rule as deriveState, in SQL, for sorting and summarising network lists.
export function revisionStateSql(revisionId: SQL, authorId: SQL, requiredApprovals: SQL): SQL<Verdict> {
  return sql<Verdict>`(select case
      when bool_or(c.verdict = 'needs_changes') then 'needs_changes'
      when count(*) filter (where c.verdict = 'approved' and c.user_id is distinct from ${authorId}) >= ${requiredApprovals} then 'approved'
      else 'open' end
    from (select distinct on (v.user_id) v.verdict, v.user_id from revision_verdicts v
          where v.revision_id = ${revisionId} order by v.user_id, v.created_at desc, v.id desc) c)`;
}

/** The latest earlier revision of the network that reads as approved, if any. */
export async function approvedBefore(db: Database, networkId: string, teamId: string, number: number) {
  const earlier = await db
    .select({ id: revisions.id, number: revisions.number, createdBy: revisions.createdBy })
    .from(revisions)
    .where(and(eq(revisions.networkId, networkId), lt(revisions.number, number)))
    .orderBy(desc(revisions.number));
  const states = await revisionStates(db, teamId, earlier);
  const approved = earlier.find((r) => states.get(r.id)!.verdict === "approved");
  if (!approved) return null;
  const state = states.get(approved.id)!;
  return { number: approved.number, by: state.by, at: state.at };
}

export async function listVerdicts(db: Database, userId: string, networkId: string, number: number) {
  const { network, revision } = await requireRevision(db, userId, networkId, number, "viewer");
  const [history, required] = await Promise.all([historyRows(db, [revision.id]).then((m) => m.get(revision.id)!), requiredApprovalsOf(db, network.teamId)]);
  return { verdicts: history.map((row) => entryView(row, revision.number, history)), state: deriveState(history, required, revision.createdBy) };
}

const selfApproval = () =>
  new Forbidden("self_approval", "You solved this revision, so you cannot approve it; another reviewer of the team has to.");

// Revision author and network author hear of every verdict, unless they gave it or turned review mail off.
async function mailVerdict(services: Services, actor: PublicUser, context: Awaited<ReturnType<typeof requireRevision>>, entry: VerdictEntry, state: RevisionState) {
  const { network, revision } = context;
  const action = entry.verdict === "open" ? "withdrew their verdict" : entry.verdict === "approved" ? "approved" : "requested changes on";
  await mailPeople(services, actor.id, [revision.createdBy, network.authorId], (to) =>
    verdictMail(to, {
      reviewer: actor.name,
      action,
      networkTitle: network.title,
      revision: revision.number,
      state: `${verdictLabel[state.verdict]}${state.verdict === "open" ? ` (${state.approvals} of ${state.requiredApprovals} approvals)` : ""}`,
      note: entry.note,
      url: link(services, permalink(network.slug, revision.number)),
    }),
  );
}

export async function giveVerdict(services: Services, actor: PublicUser, networkId: string, number: number, input: { verdict: "approved" | "needs_changes"; note?: string }) {
  const { db } = services;
  const context = await requireRevision(db, actor.id, networkId, number, "reviewer");
  const { revision, role } = context;
  if (input.verdict === "approved" && revision.createdBy === actor.id) throw selfApproval();
  const note = input.note?.trim() || null;
  if (input.verdict === "needs_changes" && !note)
    throw new Invalid("note_required", "Say what has to change: a change request needs a note.", { fields: { note: "required when requesting changes" } });
  await db.insert(revisionVerdicts).values({ revisionId: revision.id, verdict: input.verdict, userId: actor.id, role, note });
  const result = await listVerdicts(db, actor.id, networkId, number);
  await mailVerdict(services, actor, context, result.verdicts[0], result.state);
  return { verdict: result.verdicts[0], state: result.state };
}

// Only the giver takes a verdict back, and only while it stands (not already withdrawn or replaced).
export async function withdrawVerdict(services: Services, actor: PublicUser, networkId: string, number: number, verdictId: string | null) {
  const { db } = services;
  const context = await requireRevision(db, actor.id, networkId, number, "reviewer");
  const history = (await historyRows(db, [context.revision.id])).get(context.revision.id)!;
  const mine = standing(history).find((row) => row.userId === actor.id) ?? null;
  if (verdictId !== null) {
    const target = history.find((row) => row.id === verdictId && row.verdict !== "open");
    if (!target) throw new NotFound("not_found", "That verdict was not found on this revision.");
    if (target.userId !== actor.id) throw forbidden("Only the person who gave a verdict can withdraw it.");
    if (mine?.id !== target.id) throw new Conflict("verdict_not_standing", "That verdict was already withdrawn or replaced by a later one.");
  }
  if (!mine) return null;
  await db.insert(revisionVerdicts).values({ revisionId: context.revision.id, verdict: "open", userId: actor.id, role: context.role, withdrawsId: mine.id });
  const result = await listVerdicts(db, actor.id, networkId, number);
  await mailVerdict(services, actor, context, result.verdicts[0], result.state);
  return { verdict: result.verdicts[0], state: result.state };
}
