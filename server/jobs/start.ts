// One process's part in the job engine: the mail queue and the solve queue on one pg-boss, and,
// where this process works them, the mail delivery and the solve workers. Used alike by the server
// (server/index.ts), the worker process (server/worker.ts) and the test servers.
import type PgBoss from "pg-boss";
import type { Logger } from "pino";
import { config, defaultSettings, type AppSettings } from "../config.js";
import type { Database } from "../db/client.js";
import { runSolveJob } from "../domain/solve.js";
import { createSolveQueue, type SolveQueue } from "../domain/solve-queue.js";
import { failInterruptedJobs } from "../domain/solve-jobs.js";
import { createSmtpMailer, smtpTarget, type Mailer } from "../mail/mailer.js";
import { createMailQueues, createQueuedMailer, startMailWorker } from "../mail/queue.js";
import { createSolver, type Solver } from "../solver/pool.js";
import { startBoss, stopBoss, type QueueWorker } from "./boss.js";

export interface Jobs {
  boss: PgBoss;
  // What requests send mail with: it only queues.
  mailer: Mailer;
  solveQueue: SolveQueue;
  stop(): Promise<void>;
}

export interface JobsOptions {
  databaseUrl: string;
  db: Database;
  settings: AppSettings;
  solveQueueName: string;
  log: Logger;
  // Deliver queued mail over this SMTP mailer (absent: another process delivers).
  deliverMail?: { smtp: Mailer; pollingIntervalSeconds?: number };
  // Run solves on these threads (absent: another process solves).
  solveOn?: Solver;
}

export async function startJobs(options: JobsOptions): Promise<Jobs> {
  const { db, settings, log } = options;
  const boss = await startBoss(options.databaseUrl, log);
  let mailWorker: QueueWorker | null = null;
  let solveQueue: SolveQueue | null = null;
  try {
    await createMailQueues(boss, settings.mailQueue);
    if (options.deliverMail) mailWorker = startMailWorker(boss, settings.mailQueue, options.deliverMail.smtp, { pollingIntervalSeconds: options.deliverMail.pollingIntervalSeconds, log });
    solveQueue = await createSolveQueue(boss, db, { databaseUrl: options.databaseUrl, name: options.solveQueueName, settings: settings.solve, log });
    const solver = options.solveOn;
    // As many jobs at once as there are threads: the rest wait in the queue, where any worker may take them.
    if (solver) await solveQueue.work(settings.solve.threads, (data) => runSolveJob({ db, solver, settings, log }, data));
  } catch (error) {
    // A half-started process part leaves nothing running behind it.
    await solveQueue?.close().catch(() => undefined);
    await mailWorker?.stop().catch(() => undefined);
    await stopBoss(boss).catch(() => undefined);
    throw error;
  }
  const queue = solveQueue;
  const delivery = mailWorker;
  return {
    boss,
    mailer: createQueuedMailer(boss, settings.mailQueue, log),
    solveQueue: queue,
    stop: async () => {
      await queue.close();
      await delivery?.stop();
      await stopBoss(boss);
    },
  };
}

/**
 * A process's start as the configuration says (server/index.ts, server/worker.ts): jobs it left
 * unfinished when it last stopped are failed now, its solver threads load the engine, and it works the
 * mail and solve queues where asked.
 */
export async function startProcessJobs(db: Database, log: Logger, work: { deliverMail: boolean; solve: boolean; capturePort?: number }) {
  const settings = defaultSettings();
  const interrupted = await failInterruptedJobs(db, settings.instanceName).catch(() => 0);
  if (interrupted > 0) log.warn({ interrupted }, "solve jobs left unfinished by the previous run were marked failed");
  const solver = createSolver(settings.solve);
  // Threads start now, so the first solve does not wait for the engine to load.
  solver.warm();
  const jobs = await startJobs({
    databaseUrl: config.databaseUrl,
    db,
    settings,
    solveQueueName: "solve",
    log,
    deliverMail: work.deliverMail ? { smtp: createSmtpMailer(smtpTarget(work.capturePort), config.mail.from, log) } : undefined,
    solveOn: work.solve ? solver : undefined,
  });
  return { settings, solver, jobs };
}
