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
