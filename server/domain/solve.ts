// Solving a network: caps first, then the cache, then a solver thread; the revision and its steps
// are stored in one transaction. A solve that outlives the request's wait becomes a polled job.
import { HttpError } from "../lib/errors.js";
import { breachMessage, resultBreach, sizeBreach, type CapBreach } from "../solver/caps.js";
import { cachedDerivation, noteCacheHit, solveKey, storeDerivation } from "../solver/cache.js";
import { deriveOutcome, type Derivation, type SolveOutcome } from "../solver/derive.js";
import { SolveLimitError, SolverBusyError } from "../solver/pool.js";
import { requireNetworkRole } from "./access.js";
import { withTeamCells } from "./cells.js";
import type { Network, SolveOptions } from "./engine.js";
import { readNetwork } from "./reading.js";
import { revisionView, storeRevision, type RevisionView } from "./revisions.js";
import type { Services } from "./services.js";
import { SolveJobRecorder, type SolveJobView } from "./solve-jobs.js";

export function capExceeded(found: CapBreach): HttpError {
  return new HttpError(422, "solve_cap_exceeded", breachMessage(found), undefined, undefined, { details: { cap: found } });
}

function illPosed(diagnostics: unknown[]): HttpError {
  return new HttpError(422, "network_ill_posed", "The network cannot be solved as it stands; see the diagnostics.", undefined, diagnostics);
}

const solverBusy = () =>
  new HttpError(503, "solver_busy", "Every solver is busy and the queue is full; try again in a few seconds.", undefined, undefined, {
    headers: { "Retry-After": "5" },
  });

function solveLimited(error: SolveLimitError): HttpError {
  const who = error.scope === "user" ? "You already have" : "Your team already has";
  const setting = error.scope === "user" ? "SOLVE_MAX_PER_USER" : "SOLVE_MAX_PER_TEAM";
  return new HttpError(
    429,
    "solve_limit",
    `${who} ${error.count} solves queued or running, the most allowed at once (${setting}); this one starts when you ask again after one of them finishes.`,
    undefined,
    undefined,
    { details: { limit: { scope: error.scope, running: error.count, limit: error.limit, setting } }, headers: { "Retry-After": "10" } },
  );
}

const engineFailed = () =>
  new HttpError(422, "engine_failed", "Portfold's engine could not solve this network: it failed on something in it. The failure is in the server's log; try changing the network.");

export function derivationOf(outcome: SolveOutcome): Derivation {
  if (outcome.kind === "ill_posed") throw illPosed(outcome.diagnostics);
  if (outcome.kind === "engine_failed") throw engineFailed();
  if (outcome.kind === "capped") throw capExceeded(outcome.breach);
  return outcome.derivation;
}

/** In-process derivation, for the seed script only; requests go through the solver threads. */
export function derive(circuit: Network): Derivation {
  return derivationOf(deriveOutcome(circuit, {}, Number.POSITIVE_INFINITY));
}

export type SolveAnswer = { kind: "revision"; revision: RevisionView; cacheHit: boolean } | { kind: "job"; job: SolveJobView };

export async function solve(services: Services, networkId: string, userId: string, waitMs: number): Promise<SolveAnswer> {
  const { db, solver, settings } = services;
  const { network } = await requireNetworkRole(db, networkId, userId, "editor");
  const parsed = await readNetwork(services, network.circuit);
  if (!parsed.network) throw illPosed(parsed.diagnostics);
  // The team's cells go into the circuit itself, so the cache key and the revision carry their definitions.
  const circuit = await withTeamCells(db, network.teamId, parsed.network);
  const tooLarge = sizeBreach(circuit, settings.solve);
  if (tooLarge) throw capExceeded(tooLarge);

  const options: SolveOptions = {};
  const key = solveKey(circuit, options);
  const recorder = new SolveJobRecorder(db, network, userId, settings.instanceName);
  const owner = { userId, teamId: network.teamId };
  let release: () => void;
  try {
    release = solver.reserve(owner);
  } catch (error) {
    throw error instanceof SolveLimitError ? solveLimited(error) : error;
  }
  const fresh = async () => {
    const outcome = await solver.solve(circuit, options, key, owner, { onStart: () => recorder.started() }).catch((error: unknown) => {
      throw error instanceof SolverBusyError ? solverBusy() : error;
    });
    if (outcome.kind === "engine_failed") services.log.error({ networkId: network.id, engineError: outcome.message }, "the engine failed on a network");
    const derivation = derivationOf(outcome);
    await storeDerivation(db, key, derivation);
    return derivation;
  };
  const work = (async () => {
    const cached = await cachedDerivation(db, key);
    if (cached) {
      // The cache is shared by servers whose caps may differ: a cached result still has to fit this one's.
      const tooLargeHere = resultBreach(cached.results, settings.solve.maxResultTerms);
      if (tooLargeHere) throw capExceeded(tooLargeHere);
      await noteCacheHit(db, key);
    }
    const revision = await storeRevision(db, network.id, userId, cached ?? (await fresh()));
    return { revision, cacheHit: cached !== null };
  })();
  const settled = work.finally(release).then(
    (done) => {
      recorder.finished(done.revision.number, done.cacheHit);
      return { done };
    },
    (error: unknown) => {
      recorder.failed(error instanceof HttpError ? { status: error.status, ...error.body() } : { status: 500, code: "internal", message: "The solve failed on the server." });
      return { error };
    },
  );

  // wait 0: the client wants the job at once, to show queued → solving → done itself.
  let timer: NodeJS.Timeout | undefined;
  const waited = new Promise<null>((resolve) => {
    timer = setTimeout(() => resolve(null), waitMs);
  });
  const first = waitMs <= 0 ? null : await Promise.race([settled, waited]);
  clearTimeout(timer);
  if (first === null) return { kind: "job", job: await recorder.persist() };
  if ("error" in first) throw first.error;
  return { kind: "revision", revision: await revisionView(db, network, first.done.revision), cacheHit: first.done.cacheHit };
}
