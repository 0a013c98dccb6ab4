// Solve jobs: a solve that outlives the request's wait becomes a row the client polls
// (queued → solving → done | failed). Rows live in PostgreSQL, so any server can answer the poll.
import { and, eq, inArray, lt } from "drizzle-orm";
import type { SolveSettings } from "../config.js";
import type { Database } from "../db/client.js";
import { networks, solveJobs, type SolveJobStatus } from "../db/schema.js";
import { notFound } from "../lib/errors.js";
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

export function jobPath(networkId: string, jobId: string): string {
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

/**
 * Follows one solve in memory and writes it to solve_jobs only once `persist` is called (when the
 * request stops waiting), so a solve answered within the wait leaves no job row behind.
 */
export class SolveJobRecorder {
  private progress: Progress = { status: "queued", cacheHit: null, revisionNumber: null, error: null, createdAt: new Date(), startedAt: null, finishedAt: null };
  private id: Promise<string> | null = null;
  // Writes run one after another, each with the latest progress, so the row never goes backwards.
  private writes: Promise<unknown> = Promise.resolve();

  constructor(
    private readonly db: Database,
    private readonly network: { id: string; slug: string },
    private readonly userId: string,
    private readonly runner: string,
  ) {}

  started(): void {
    if (this.progress.status !== "queued") return;
    this.progress = { ...this.progress, status: "solving", startedAt: new Date() };
    this.writeThrough();
  }

  finished(revisionNumber: number, cacheHit: boolean): void {
    const now = new Date();
    this.progress = { ...this.progress, status: "done", revisionNumber, cacheHit, startedAt: this.progress.startedAt ?? now, finishedAt: now };
    this.writeThrough();
  }

  failed(error: Record<string, unknown>): void {
    this.progress = { ...this.progress, status: "failed", error, finishedAt: new Date() };
    this.writeThrough();
  }

  async persist(): Promise<SolveJobView> {
    this.id ??= this.insert();
    return view(await this.id, this.network.id, this.network.slug, this.progress);
  }

  private async insert(): Promise<string> {
    const [row] = await this.db
      .insert(solveJobs)
      .values({ networkId: this.network.id, requestedBy: this.userId, runner: this.runner, ...this.progress })
      .returning({ id: solveJobs.id });
    if (Date.now() - lastPrune > 60 * 60 * 1000) {
      lastPrune = Date.now();
      // Finished jobs matter only while a client polls; a day later they are history nobody reads.
      void this.db.delete(solveJobs).where(lt(solveJobs.finishedAt, new Date(Date.now() - dayMs))).catch(() => undefined);
    }
    return row.id;
  }

  private writeThrough(): void {
    const id = this.id;
    if (!id) return;
    this.writes = this.writes
      .then(async () => {
        const { createdAt: _created, ...changes } = this.progress;
        await this.db.update(solveJobs).set(changes).where(eq(solveJobs.id, await id));
      })
      // A lost update (database briefly away) leaves the job to the staleness rule below.
      .catch(() => undefined);
  }
}

const interrupted = { code: "solve_interrupted", message: "The server running this solve stopped before it finished; solve the network again." };

/** At start-up: the jobs this process left queued or solving when it stopped can never finish; say so at once. */
export async function failInterruptedJobs(db: Database, runner: string): Promise<number> {
  const failed = await db
    .update(solveJobs)
    .set({ status: "failed", error: interrupted, finishedAt: new Date() })
    .where(and(eq(solveJobs.runner, runner), inArray(solveJobs.status, ["queued", "solving"])))
    .returning({ id: solveJobs.id });
  return failed.length;
}

/** How long a job may stay queued or solving before its server is presumed gone (one that never restarts). */
export function staleAfterMs(settings: SolveSettings): number {
  const turns = 1 + Math.ceil(settings.queueMax / settings.threads);
  return settings.timeLimitMs * turns + 60_000;
}

export async function getSolveJob(db: Database, settings: SolveSettings, networkId: string, jobId: string, userId: string): Promise<SolveJobView> {
  await requireNetworkRole(db, networkId, userId, "viewer");
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
