// Solve jobs: every solve the cache cannot answer is a row (queued → solving → done | failed) and a
// pg-boss job (server/domain/solve-queue.ts). Rows live in PostgreSQL, so any server can answer the poll.
import { and, eq, inArray, lt, sql } from "drizzle-orm";
import type { SolveSettings } from "../config.js";
import type { Database } from "../db/client.js";
import { networks, solveJobs, type SolveJobStatus } from "../db/schema.js";
import { notFound } from "./errors.js";
import { requireNetworkRole } from "./access.js";
import { permalink } from "./revisions.js";

interface Progress {
  status: SolveJobStatus;
  cacheHit: boolean | null;
  revisionNumber: number | null;
  error: Record<string, unknown> | null;
  createdAt: Date;
  startedAt: Date | null;
  finishedAt: Date | null;
}

export interface SolveJobView {
  id: string;
  networkId: string;
  status: SolveJobStatus;
  cacheHit: boolean | null;
  revision: { number: number; permalink: string } | null;
  error: Record<string, unknown> | null;
  createdAt: string;
  startedAt: string | null;
  finishedAt: string | null;
  poll: string;
}

function jobPath(networkId: string, jobId: string): string {
  return `/api/networks/${networkId}/solve-jobs/${jobId}`;
}

function view(id: string, networkId: string, slug: string, progress: Progress): SolveJobView {
  return {
    id,
    networkId,
    status: progress.status,
    cacheHit: progress.cacheHit,
    revision: progress.revisionNumber === null ? null : { number: progress.revisionNumber, permalink: permalink(slug, progress.revisionNumber) },
    error: progress.error,
    createdAt: progress.createdAt.toISOString(),
    startedAt: progress.startedAt?.toISOString() ?? null,
    finishedAt: progress.finishedAt?.toISOString() ?? null,
    poll: jobPath(networkId, id),
  };
}

const dayMs = 24 * 60 * 60 * 1000;
let lastPrune = 0;

export type SolveJobRow = typeof solveJobs.$inferSelect;

/** The one channel a finished job is announced on (payload: its id), for the requests waiting on it. */
export const solveJobChannel = "portfold_solve_jobs";

export function solveJobView(row: SolveJobRow, slug: string): SolveJobView {
  return view(row.id, row.networkId, slug, { ...row, error: row.error as Record<string, unknown> | null });
}

export interface SolveAdmission {
  job: SolveJobRow;
  // pg-boss priority (higher first): minus the team's solves already queued or running, so a free
  // worker takes the next solve of the team with the fewest in hand (fair order between teams).
  priority: number;
}

/**
 * Admits one solve as a queued job row, or refuses it per person and per team (queued plus running,
 * over every process; the queue as a whole is the solve queue's own count). The counts and the insert run in
 * one transaction under advisory locks on the person and the team, so concurrent requests cannot both
 * take the last place. Rows older than the staleness bound no longer count (their server is gone).
 */
export async function admitSolveJob(
  db: Database,
  settings: SolveSettings,
  owner: { userId: string; teamId: string; networkId: string },
): Promise<SolveAdmission> {
  const since = new Date(Date.now() - staleAfterMs(settings));
  const admission = await db.transaction(async (tx) => {
    await tx.execute(sql`select pg_advisory_xact_lock(hashtext(${`solve-user:${owner.userId}`}))`);
    await tx.execute(sql`select pg_advisory_xact_lock(hashtext(${`solve-team:${owner.teamId}`}))`);
    const { rows } = await tx.execute<{ mine: number; ours: number }>(sql`
      select count(*) filter (where j.requested_by = ${owner.userId})::int as mine,
             count(*) filter (where n.team_id = ${owner.teamId})::int as ours
        from ${solveJobs} j join ${networks} n on n.id = j.network_id
       where j.status in ('queued', 'solving') and coalesce(j.started_at, j.created_at) > ${since.toISOString()}`);
    const { mine, ours } = rows[0];
    if (mine >= settings.maxPerUser) return new SolveLimitError("user", mine, settings.maxPerUser);
    if (ours >= settings.maxPerTeam) return new SolveLimitError("team", ours, settings.maxPerTeam);
    const [job] = await tx.insert(solveJobs).values({ networkId: owner.networkId, requestedBy: owner.userId, status: "queued" }).returning();
    return { job, priority: -ours };
  });
  if (admission instanceof Error) throw admission;
  if (Date.now() - lastPrune > 60 * 60 * 1000) {
    lastPrune = Date.now();
    // Finished jobs matter only while a client polls; a day later they are history nobody reads.
    void db.delete(solveJobs).where(lt(solveJobs.finishedAt, new Date(Date.now() - dayMs))).catch(() => undefined);
  }
  return admission;
}

/** One person or one team already has as many solves queued or running as it may. */
export class SolveLimitError extends Error {
  constructor(
    readonly scope: "user" | "team",
    readonly count: number,
    readonly limit: number,
  ) {
    super(`${scope} solve limit reached`);
  }
}

/** A solve the cache answered, as the finished job a client that asked for the job at once (wait 0) polls. */
export async function recordAnsweredJob(db: Database, owner: { userId: string; networkId: string; runner: string }, revisionNumber: number): Promise<SolveJobRow> {
  const now = new Date();
  const [job] = await db
    .insert(solveJobs)
    .values({ networkId: owner.networkId, requestedBy: owner.userId, runner: owner.runner, status: "done", cacheHit: true, revisionNumber, startedAt: now, finishedAt: now })
    .returning();
  return job;
}

/** A worker takes a queued job: it names itself the runner; false when the job is no longer queued. */
export async function takeSolveJob(db: Database, id: string, runner: string): Promise<boolean> {
  const taken = await db.update(solveJobs).set({ runner }).where(and(eq(solveJobs.id, id), eq(solveJobs.status, "queued"))).returning({ id: solveJobs.id });
  return taken.length === 1;
}

export async function markSolving(db: Database, id: string): Promise<void> {
  await db.update(solveJobs).set({ status: "solving", startedAt: new Date() }).where(and(eq(solveJobs.id, id), eq(solveJobs.status, "queued")));
}

/** Done or failed, announced to whoever waits on the job. */
export async function finishSolveJob(db: Database, id: string, outcome: { revisionNumber: number; cacheHit: boolean } | { error: Record<string, unknown> }): Promise<void> {
  const now = new Date();
  const changes = "error" in outcome
    ? { status: "failed" as const, error: outcome.error, finishedAt: now }
    : { status: "done" as const, revisionNumber: outcome.revisionNumber, cacheHit: outcome.cacheHit, finishedAt: now };
  await db.transaction(async (tx) => {
    await tx.update(solveJobs).set({ ...changes, startedAt: sql`coalesce(${solveJobs.startedAt}, now())` }).where(eq(solveJobs.id, id));
    await tx.execute(sql`select pg_notify(${solveJobChannel}, ${id})`);
  });
}

/** A job whose end the request answered itself: nobody will poll it, so it leaves no row behind. */
export async function forgetSolveJob(db: Database, id: string): Promise<void> {
  await db.delete(solveJobs).where(eq(solveJobs.id, id));
}

export async function readSolveJob(db: Database, id: string): Promise<SolveJobRow | null> {
  const [row] = await db.select().from(solveJobs).where(eq(solveJobs.id, id));
  return row ?? null;
}

const interrupted = { code: "solve_interrupted", message: "The server running this solve stopped before it finished; solve the network again." };

/** At start-up: the jobs this process had taken (queued on its threads or solving) when it stopped can never finish; say so at once. */
export async function failInterruptedJobs(db: Database, runner: string): Promise<number> {
  const failed = await db
    .update(solveJobs)
    .set({ status: "failed", error: interrupted, finishedAt: new Date() })
    .where(and(eq(solveJobs.runner, runner), inArray(solveJobs.status, ["queued", "solving"])))
    .returning({ id: solveJobs.id });
  return failed.length;
}

/** How long a job may stay queued or solving before its server is presumed gone (one that never restarts). */
function staleAfterMs(settings: SolveSettings): number {
  const turns = 1 + Math.ceil(settings.queueMax / settings.threads);
  return settings.timeLimitMs * turns + 60_000;
}

export async function getSolveJob(db: Database, settings: SolveSettings, userId: string, networkId: string, jobId: string): Promise<SolveJobView> {
  await requireNetworkRole(db, userId, networkId, "viewer");
  const [row] = await db
    .select({ job: solveJobs, slug: networks.slug })
    .from(solveJobs)
    .innerJoin(networks, eq(networks.id, solveJobs.networkId))
    .where(and(eq(solveJobs.id, jobId), eq(solveJobs.networkId, networkId)));
  if (!row) throw notFound("That solve job");
  const { job } = row;
  const progress: Progress = { ...job, error: job.error as Record<string, unknown> | null };
  const pending = job.status === "queued" || job.status === "solving";
  if (pending && Date.now() - (job.startedAt ?? job.createdAt).getTime() > staleAfterMs(settings)) {
    return view(job.id, networkId, row.slug, { ...progress, status: "failed", error: interrupted });
  }
  return view(job.id, networkId, row.slug, progress);
}
