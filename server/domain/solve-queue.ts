// Solves on the job engine: a request admits a job row and sends a pg-boss job; any process with a
// solve worker (each server unless SOLVE_WORKER=false, or `npm run worker` on another machine with the
// same DATABASE_URL) takes it, runs it on its solver threads under the caps and stores the revision.
// Waiting requests hear of the end on one LISTEN connection per process, with a slow poll behind it.
import pg from "pg";
import type PgBoss from "pg-boss";
import type { Logger } from "pino";
import type { SolveSettings } from "../config.js";
import type { Database } from "../db/client.js";
import { workQueue, type QueueWorker } from "../jobs/boss.js";
import type { Network, SolveOptions } from "../solver/engine.js";
import { readSolveJob, solveJobChannel, type SolveJobRow } from "./solve-jobs.js";

export interface SolveJobData {
  jobId: string;
  networkId: string;
  userId: string;
  teamId: string;
  // The circuit as it stood at the request, with the team's cells in it, and its cache key.
  circuit: Network;
  options: SolveOptions;
  key: string;
}

export interface SolveQueue {
  readonly name: string;
  send(data: SolveJobData, priority: number): Promise<void>;
  /** Jobs sent and not yet taken by a worker, over every process. */
  waiting(): Promise<number>;
  /** The job's row once it is done or failed, or null when `waitMs` passes first. */
  waitFor(jobId: string, waitMs: number): Promise<SolveJobRow | null>;
  /** Takes jobs with `run`, as many at once as `concurrency` (the solver's threads). */
  work(concurrency: number, run: (data: SolveJobData) => Promise<void>): Promise<void>;
  close(): Promise<void>;
}

const finished = (row: SolveJobRow | null) => row !== null && (row.status === "done" || row.status === "failed");
// Behind LISTEN, in case a notification is missed (a dropped listening connection).
const pollMs = 1_000;

export async function createSolveQueue(boss: PgBoss, db: Database, options: { databaseUrl: string; name: string; settings: SolveSettings; log?: Logger }): Promise<SolveQueue> {
  const { name, settings, log } = options;
  await boss.createQueue(name, { name, retryLimit: 0 });
  const waiters = new Map<string, Set<() => void>>();
  const workers: QueueWorker[] = [];
  let listener: pg.Client | null = null;
  let listening: Promise<void> | null = null;
  let closed = false;

  const listen = () =>
    (listening ??= (async () => {
      const client = new pg.Client({ connectionString: options.databaseUrl, application_name: "portfold-solve-waits", connectionTimeoutMillis: 5_000 });
      client.on("notification", (message) => {
        for (const wake of waiters.get(message.payload ?? "") ?? []) wake();
      });
      // A lost connection is dropped; the next wait listens again and the poll covers the gap.
      client.on("error", (error) => {
        log?.warn({ err: error }, "solve notifications lost; waiting requests poll");
        listener = null;
        listening = null;
        void client.end().catch(() => undefined);
      });
      await client.connect();
      await client.query(`LISTEN ${solveJobChannel}`);
      listener = client;
    })().catch((error: unknown) => {
      log?.warn({ err: error }, "solve notifications unavailable; waiting requests poll");
      listening = null;
    }));

  return {
    name,
    async send(data, priority) {
      // A solve runs once: pg-boss does not retry it (a failed solve is the user's to ask again).
      const expireInSeconds = Math.ceil(settings.timeLimitMs / 1000) + 300;
      const job = { id: data.jobId, priority, retryLimit: 0, expireInSeconds };
      // Once more after a short pause: the queue's tables can answer a passing deadlock while another
      // process creates or drops a queue, and a solve should not be refused for that. The job id is
      // the key, so a first send that did land is not queued twice.
      await boss.send(name, data, job).catch(async () => {
        await new Promise((resolve) => setTimeout(resolve, 250));
        await boss.send(name, data, job);
      });
      // This process's idle workers look now rather than at their next poll.
      for (const worker of workers) worker.wake();
    },
    waiting: () => boss.getQueueSize(name),
    async waitFor(jobId, waitMs) {
      const deadline = Date.now() + waitMs;
      await listen();
      let wake: () => void = () => undefined;
      const set = waiters.get(jobId) ?? new Set();
      waiters.set(jobId, set);
      try {
        for (;;) {
          const row = await readSolveJob(db, jobId);
          if (finished(row)) return row;
          const left = deadline - Date.now();
          if (left <= 0 || closed) return null;
          await new Promise<void>((resolve) => {
            const timer = setTimeout(resolve, Math.min(left, pollMs));
            set.delete(wake);
            wake = () => {
              clearTimeout(timer);
              resolve();
            };
            set.add(wake);
          });
        }
      } finally {
        set.delete(wake);
        if (set.size === 0) waiters.delete(jobId);
      }
    },
    async work(concurrency, run) {
      workers.push(workQueue<SolveJobData>(boss, name, { concurrency, pollingIntervalSeconds: 0.5, log }, run));
    },
    async close() {
      closed = true;
      for (const set of waiters.values()) for (const wake of set) wake();
      for (const worker of workers.splice(0)) await worker.stop();
      await listening;
      await listener?.end().catch(() => undefined);
    },
  };
}
