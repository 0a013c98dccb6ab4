// Solving a network: caps first, then the cache, then a job on the solve queue that a worker runs on
// its solver threads; the revision and its steps are stored in one transaction. A solve that outlives
// the request's wait is answered as the job to poll.
import { and, eq } from "drizzle-orm";
import { revisions } from "../db/schema.js";
import { failureRecord } from "../lib/errors.js";
import { DomainError, rethrowSolverStopped, TooMany, Unavailable, Unprocessable } from "./errors.js";
import { breachMessage, resultBreach, sizeBreach, type CapBreach } from "../solver/caps.js";
import { cachedDerivation, noteCacheHit, solveKey, storeDerivation } from "../solver/cache.js";
import { deriveOutcome, type Derivation, type SolveOutcome } from "../solver/derive.js";
import { requireNetworkRole } from "./access.js";
import { withTeamCells } from "./cells.js";
import type { Network, SolveOptions } from "../solver/engine.js";
import { readNetwork } from "./reading.js";
import { revisionView, storeRevision, type RevisionView } from "./revisions.js";
import type { Services } from "./services.js";
import {
  admitSolveJob,
  finishSolveJob,
  forgetSolveJob,
  markSolving,
  readSolveJob,
  recordAnsweredJob,
  SolveLimitError,
  solveJobView,
  takeSolveJob,
  type SolveJobView,
} from "./solve-jobs.js";
import type { SolveJobData } from "./solve-queue.js";

function capExceeded(found: CapBreach): Unprocessable {
  return new Unprocessable("solve_cap_exceeded", breachMessage(found), { details: { cap: found } });
}

function illPosed(diagnostics: unknown[]): DomainError {
  return new Unprocessable("network_ill_posed", "The network cannot be solved as it stands; see the diagnostics.", { diagnostics });
}

const solverBusy = () =>
  new Unavailable("solver_busy", "Every solver is busy and the solve queue is full (SOLVE_QUEUE_MAX); try again in a few seconds.", { retryAfter: 5 });

function solveLimited(error: SolveLimitError): DomainError {
  const who = error.scope === "user" ? "You already have" : "Your team already has";
  const setting = error.scope === "user" ? "SOLVE_MAX_PER_USER" : "SOLVE_MAX_PER_TEAM";
  return new TooMany(
    "solve_limit",
    `${who} ${error.count} solves queued or running, the most allowed at once (${setting}); this one starts when you ask again after one of them finishes.`,
    { details: { limit: { scope: error.scope, running: error.count, limit: error.limit, setting } }, retryAfter: 10 },
  );
}

const engineFailed = () =>
  new Unprocessable("engine_failed", "Portfold's engine could not solve this network: it failed on something in it. The failure is in the server's log; try changing the network.");

function derivationOf(outcome: SolveOutcome): Derivation {
  if (outcome.kind === "ill_posed") throw illPosed(outcome.diagnostics);
  if (outcome.kind === "engine_failed") throw engineFailed();
  if (outcome.kind === "capped") throw capExceeded(outcome.breach);
  return outcome.derivation;
}

/** In-process derivation, for the seed script only; requests go through the solver threads. */
export function derive(circuit: Network): Derivation {
  return derivationOf(deriveOutcome(circuit, {}, Number.POSITIVE_INFINITY));
}

// "failed": the job's record of the answer the request would have had (status, code, message…).
export type SolveAnswer =
  | { kind: "revision"; revision: RevisionView; cacheHit: boolean }
  | { kind: "job"; job: SolveJobView }
  | { kind: "failed"; error: Record<string, unknown> | null };

const noQueue = () =>
  new Unavailable("solver_unavailable", "This server has no solve queue right now; try again in a few seconds.", { retryAfter: 5 });

async function revisionAnswer(db: Services["db"], network: Parameters<typeof revisionView>[1], number: number, cacheHit: boolean): Promise<SolveAnswer> {
  const [revision] = await db.select().from(revisions).where(and(eq(revisions.networkId, network.id), eq(revisions.number, number)));
  return { kind: "revision", revision: await revisionView(db, network, revision), cacheHit };
}

/**
 * A solve: the cache answers at once; otherwise the solve is admitted as a job (limits per person,
 * team and queue), sent to the solve queue, and the request waits up to `waitMs` for a worker to
 * finish it before answering with the job to poll.
 */
export async function solve(services: Services, userId: string, networkId: string, waitMs: number): Promise<SolveAnswer> {
  const { db, settings, solveQueue } = services;
  const { network } = await requireNetworkRole(db, userId, networkId, "editor");
  const parsed = await readNetwork(services, network.circuit);
  if (!parsed.network) throw illPosed(parsed.diagnostics);
  // The team's cells go into the circuit itself, so the cache key and the revision carry their definitions.
  const circuit = await withTeamCells(db, network.teamId, parsed.network);
  const tooLarge = sizeBreach(circuit, settings.solve);
  if (tooLarge) throw capExceeded(tooLarge);

  const options: SolveOptions = {};
  const key = solveKey(circuit, options);
  const cached = await cachedDerivation(db, key);
  if (cached) {
    // The cache is shared by servers whose caps may differ: a cached result still has to fit this one's.
    const tooLargeHere = resultBreach(cached.results, settings.solve.maxResultTerms);
    if (tooLargeHere) throw capExceeded(tooLargeHere);
    await noteCacheHit(db, key);
    const revision = await storeRevision(db, userId, network.id, cached);
    if (waitMs <= 0) {
      const job = await recordAnsweredJob(db, { userId, networkId: network.id, runner: settings.instanceName }, revision.number);
      return { kind: "job", job: solveJobView(job, network.slug) };
    }
    return { kind: "revision", revision: await revisionView(db, network, revision), cacheHit: true };
  }

  if (!solveQueue) throw noQueue();
  // Solves waiting to start, over every process: a full queue is refused before it grows (503).
  if ((await solveQueue.waiting()) >= settings.solve.queueMax) throw solverBusy();
  const admission = await admitSolveJob(db, settings.solve, { userId, teamId: network.teamId, networkId: network.id }).catch((error: unknown) => {
    if (error instanceof SolveLimitError) throw solveLimited(error);
    throw error;
  });
  const { job } = admission;
  try {
    await solveQueue.send({ jobId: job.id, networkId: network.id, userId, teamId: network.teamId, circuit, options, key }, admission.priority);
  } catch (error) {
    services.log.error({ err: error, networkId: network.id }, "solve not queued");
    await finishSolveJob(db, job.id, { error: failureRecord(noQueue())! }).catch(() => undefined);
    throw noQueue();
  }
  // wait 0: the client wants the job at once, to show queued → solving → done itself.
  const done = waitMs <= 0 ? null : await solveQueue.waitFor(job.id, waitMs);
  if (!done) return { kind: "job", job: solveJobView((await readSolveJob(db, job.id)) ?? job, network.slug) };
  await forgetSolveJob(db, job.id);
  if (done.status === "failed") return { kind: "failed", error: done.error as Record<string, unknown> | null };
  return revisionAnswer(db, network, done.revisionNumber!, done.cacheHit ?? false);
}

type WorkerServices = Pick<Services, "db" | "solver" | "settings" | "log">;

async function solveOnThread(services: WorkerServices, data: SolveJobData): Promise<Derivation> {
  const { db, solver, log } = services;
  const owner = { userId: data.userId, teamId: data.teamId };
  const outcome = await solver.solve(data.circuit, data.options, data.key, owner, { onStart: () => void markSolving(db, data.jobId).catch(() => undefined) }).catch(rethrowSolverStopped);
  if (outcome.kind === "engine_failed") log.error({ networkId: data.networkId, engineError: outcome.message }, "the engine failed on a network");
  const derivation = derivationOf(outcome);
  await storeDerivation(db, data.key, derivation);
  return derivation;
}

/**
 * What a solve worker does with one job: take it (naming itself the runner), solve it on a thread
 * under the caps (another job may have filled the cache meanwhile), store the revision, and record
 * done or failed. It never throws for the solve's own failure: the job row carries the answer.
 */
export async function runSolveJob(services: WorkerServices, data: SolveJobData): Promise<void> {
  const { db, settings, log } = services;
  if (!(await takeSolveJob(db, data.jobId, settings.instanceName))) return;
  try {
    const cached = await cachedDerivation(db, data.key);
    if (cached) {
      const tooLargeHere = resultBreach(cached.results, settings.solve.maxResultTerms);
      if (tooLargeHere) throw capExceeded(tooLargeHere);
      await noteCacheHit(db, data.key);
    }
    const derivation = cached ?? (await solveOnThread(services, data));
    const revision = await storeRevision(db, data.userId, data.networkId, derivation);
    await finishSolveJob(db, data.jobId, { revisionNumber: revision.number, cacheHit: cached !== null });
  } catch (error) {
    const record = failureRecord(error);
    if (!record) log.error({ err: error, networkId: data.networkId }, "a solve job failed on the server");
    const body = record ?? { status: 500, code: "internal", message: "The solve failed on the server." };
    await finishSolveJob(db, data.jobId, { error: body }).catch((lost: unknown) => log.error({ err: lost }, "a solve job's end was not recorded"));
  }
}
