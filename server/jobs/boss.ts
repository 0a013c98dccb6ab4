// The job engine: pg-boss on the same PostgreSQL (schema `pgboss`), one instance per process, shared
// by the mail queue (server/mail/queue.ts) and the solve queue (server/domain/solve-queue.ts).
import PgBoss from "pg-boss";
import type { Logger } from "pino";

export const jobSchema = "pgboss";

// Starting pg-boss creates (or upgrades) its schema; the migrate step and the test set-up rely on that.
export async function startBoss(databaseUrl: string, log?: Logger): Promise<PgBoss> {
  const boss = new PgBoss({ connectionString: databaseUrl, schema: jobSchema, max: 3, application_name: "portfold-jobs" });
  // A lost database connection is logged and retried by pg-boss, never an unhandled 'error' that ends the process.
  boss.on("error", (error) => log?.error({ err: error }, "job queue error"));
  await boss.start();
  return boss;
}

export async function stopBoss(boss: PgBoss): Promise<void> {
  // Graceful: an active job may finish (bounded by the SMTP timeouts and the solve cap), then the pool closes.
  await boss.stop({ graceful: true, wait: true, timeout: 5_000 });
}

export interface QueueWorker {
  /** Look for a job now rather than at the next poll (a job was just sent from this process). */
  wake(): void;
  /** No new jobs; resolves when the jobs in hand are finished. */
  stop(): Promise<void>;
}

/**
 * Works a queue with `concurrency` loops, each taking one job at a time (pg-boss `fetch`), handing it
 * to `handle` and recording the end (`complete`, or `fail` when `handle` throws, which pg-boss
 * retries as the job's retry settings say). pg-boss's own `work` leaves the end's write unawaited,
 * so a database blip at that moment would be an unhandled rejection that ends the process; here
 * every write is awaited and a lost one is logged (the job then expires and is retried or failed).
 */
export function workQueue<T extends object>(
  boss: PgBoss,
  name: string,
  options: { concurrency: number; pollingIntervalSeconds: number; log?: Logger },
  handle: (data: T) => Promise<void>,
): QueueWorker {
  const { log } = options;
  let stopping = false;
  const sleepers = new Set<() => void>();
  const pause = (ms: number) =>
    new Promise<void>((resolve) => {
      const wake = () => {
        clearTimeout(timer);
        sleepers.delete(wake);
        resolve();
      };
      const timer = setTimeout(wake, ms);
      sleepers.add(wake);
    });
  const loop = async () => {
    while (!stopping) {
      const job = await boss.fetch<T>(name, { batchSize: 1 }).then(
        ([first]) => first,
        (error: unknown) => {
          log?.warn({ err: error, queue: name }, "could not take a job");
          return undefined;
        },
      );
      if (!job) {
        await pause(options.pollingIntervalSeconds * 1000);
        continue;
      }
      try {
        await handle(job.data);
        await boss.complete(name, job.id).catch((error: unknown) => log?.warn({ err: error, queue: name }, "a finished job's end was not recorded"));
      } catch (failure) {
        const reason = { message: failure instanceof Error ? failure.message : String(failure) };
        await boss.fail(name, job.id, reason).catch((error: unknown) => log?.warn({ err: error, queue: name }, "a failed job's end was not recorded"));
      }
    }
  };
  const loops = Array.from({ length: options.concurrency }, loop);
  return {
    wake: () => {
      for (const wake of [...sleepers]) wake();
    },
    stop: async () => {
      stopping = true;
      for (const wake of [...sleepers]) wake();
      await Promise.all(loops);
    },
  };
}
