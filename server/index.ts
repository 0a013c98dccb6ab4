import { eq } from "drizzle-orm";
import { createApp } from "./app.js";
import { config, defaultSettings, isProduction } from "./config.js";
import { createDatabase, createPool } from "./db/client.js";
import { demoReviewer, demoShareToken, demoUser } from "./db/demo-data.js";
import { users } from "./db/schema.js";
import { startCaptureServerNear, type CaptureServer } from "./mail/capture-server.js";
import { createSmtpMailer, smtpTarget } from "./mail/mailer.js";
import { createQueuedMailer, startMailBoss, startMailWorker, stopMailBoss } from "./mail/queue.js";
import { createLogger } from "./lib/logging.js";
import { createSolver } from "./solver/pool.js";
import { failInterruptedJobs } from "./domain/solve-jobs.js";

const log = createLogger(config.logLevel);
const pool = createPool(config.databaseUrl, config.dbPoolSize);
const db = createDatabase(pool);
const ownUrl = config.servedUrl;

// Without SMTP_HOST, mail goes over real SMTP to a capture server on loopback that keeps it in PostgreSQL.
let capture: CaptureServer | null = null;
if (!config.mail.smtpHost) {
  capture = await startCaptureServerNear(db, config.mail.capturePort);
  console.log(`[portfold] mail capture (SMTP) on ${capture.host}:${capture.port}${isProduction ? "" : `; read it at ${ownUrl}/dev/mailbox`}`);
}
// Jobs this process left unfinished when it last stopped are failed now, not after the staleness wait.
const interrupted = await failInterruptedJobs(db, config.instanceName).catch(() => 0);
if (interrupted > 0) log.warn({ interrupted }, "solve jobs left unfinished by the previous run were marked failed");
const solver = createSolver(defaultSettings().solve);
// Threads start now, so the first solve does not wait for the engine to load.
solver.warm();
// Requests only enqueue mail; this process's worker (unless MAIL_WORKER=false) delivers it over SMTP.
const mailQueue = defaultSettings().mailQueue;
const boss = await startMailBoss(config.databaseUrl, mailQueue, log);
if (config.mail.worker) await startMailWorker(boss, mailQueue, createSmtpMailer(smtpTarget(capture?.port), config.mail.from, log));
const app = createApp({ pool, db, logger: log, solver, mailer: createQueuedMailer(boss, mailQueue, log) });

const server = app.listen(config.port, config.host, async () => {
  console.log(`[portfold] serving on ${ownUrl}`);
  if (isProduction) return;
  const [demo] = await db.select({ id: users.id }).from(users).where(eq(users.id, demoUser.id)).catch(() => []);
  if (!demo) return;
  console.log(`[portfold] demo login: ${demoUser.email} / ${config.demoPassword} (reviewer: ${demoReviewer.email}, same password)`);
  console.log(`[portfold] demo share link: ${config.publicUrl}/s/${demoShareToken}`);
});

function shutdown() {
  server.close(() => void stopMailBoss(boss).then(() => Promise.all([pool.end(), capture?.close(), solver.close()])).then(() => process.exit(0)));
}
process.on("SIGINT", shutdown);
process.on("SIGTERM", shutdown);
