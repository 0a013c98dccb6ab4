import { eq } from "drizzle-orm";
import { createApp } from "./app.js";
import { config, isProduction } from "./config.js";
import { createDatabase, createPool } from "./db/client.js";
import { demoReviewer, demoShareToken, demoUser } from "./db/demo-data.js";
import { users } from "./db/schema.js";
import { startCaptureServerNear, type CaptureServer } from "./mail/capture-server.js";
import { startProcessJobs } from "./jobs/start.js";
import { createLogger } from "./lib/logging.js";

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
// Requests only enqueue mail and solves; this process's workers (unless MAIL_WORKER / SOLVE_WORKER are
// false) deliver the mail over SMTP and run the solves on its threads.
const { solver, jobs } = await startProcessJobs(db, log, { deliverMail: config.mail.worker, solve: config.solve.worker, capturePort: capture?.port });
const app = createApp({ pool, db, logger: log, solver, mailer: jobs.mailer, solveQueue: jobs.solveQueue });

const server = app.listen(config.port, config.host, async () => {
  console.log(`[portfold] serving on ${ownUrl}`);
  if (isProduction) return;
  const [demo] = await db.select({ id: users.id }).from(users).where(eq(users.id, demoUser.id)).catch(() => []);
  if (!demo) return;
  console.log(`[portfold] demo login: ${demoUser.email} / ${config.demoPassword} (reviewer: ${demoReviewer.email}, same password)`);
  console.log(`[portfold] demo share link: ${config.publicUrl}/s/${demoShareToken}`);
});

function shutdown() {
  server.close(() => void jobs.stop().then(() => Promise.all([pool.end(), capture?.close(), solver.close()])).then(() => process.exit(0)));
}
process.on("SIGINT", shutdown);
process.on("SIGTERM", shutdown);
