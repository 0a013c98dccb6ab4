// Starts the real Express app on an ephemeral loopback port against the test database,
// with the SMTP capture server in-process on its own ephemeral port.
import { randomUUID } from "node:crypto";
import { mkdtempSync, writeFileSync } from "node:fs";
import { createServer, type Server } from "node:http";
import { tmpdir } from "node:os";
import { join } from "node:path";
import type { AddressInfo } from "node:net";
import type { Logger } from "pino";
import { createApp } from "../../server/app.js";
import { defaultSettings, type AppSettings } from "../../server/config.js";
import { createDatabase, createPool } from "../../server/db/client.js";
import { startCaptureServer, type CaptureServer } from "../../server/mail/capture-server.js";
import { createSmtpMailer, type Mailer, type SmtpTarget } from "../../server/mail/mailer.js";
import { startJobs, type Jobs } from "../../server/jobs/start.js";
import { createLogger } from "../../server/lib/logging.js";
import { deleteMailQueues, type MailQueueSettings } from "../../server/mail/queue.js";
import { createSolver, type Solver } from "../../server/solver/pool.js";

export interface TestServer {
  url: string;
  pool: ReturnType<typeof createPool>;
  db: ReturnType<typeof createDatabase>;
  capture: CaptureServer;
  solver: Solver;
  // The queued mailer the app uses (requests enqueue; this server's worker delivers).
  mailer: Mailer;
  // This server's own mail queue: what other test servers left queued never holds up its waits.
  mailQueue: string;
  // Its own solve queue, likewise (unless a test gives several servers one queue).
  solveQueue: string;
  close(): Promise<void>;
}

export interface TestServerOptions {
  settings?: Partial<Omit<AppSettings, "limits" | "solve">>;
  limits?: Partial<AppSettings["limits"]>;
  // Caps and threads of this server's solver; the rest stays at the defaults.
  solve?: Partial<AppSettings["solve"]>;
  clientDir?: string;
  logger?: Logger;
  // Another database than the shared test database (the fault tests bring their own cluster).
  databaseUrl?: string;
  // Where this server's mail worker delivers (default: its capture server) and its own queue.
  smtp?: SmtpTarget;
  mailQueue?: Partial<MailQueueSettings>;
  // A solve queue shared with other test servers, and whether this one runs solves (default: yes).
  solveQueue?: string;
  solveWorker?: boolean;
}

// Quick retries, so a failing delivery reaches the dead-letter queue within a test.
const testMailQueue: Omit<MailQueueSettings, "queue"> = { retryLimit: 5, retryDelaySeconds: 1, retryBackoff: false };

// Generous by default: only the rate-limit tests want to hit the limits.
const testLimits: Partial<AppSettings["limits"]> = { loginFailuresPer15Min: 1_000, passwordResetsPer15Min: 1_000, signupsPerHour: 1_000 };
// One solver thread per test server; requests wait for their solve (a loaded machine must not turn a
// 201 into a 202), except where a test asks for the job with ?wait=0.
const testSolve: Partial<AppSettings["solve"]> = { threads: 1, waitMs: 60_000 };

export function testDatabaseUrl(): string {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error("DATABASE_URL is not set: run the suite with `npm test`, which starts the test database");
  return url;
}

// Many test servers make and drop their queues at once (pg-boss creates a table per queue), which
// PostgreSQL may answer with a deadlock for one of them: try again a few times before going without.
async function startJobsRetrying(options: Parameters<typeof startJobs>[0]): Promise<Jobs | null> {
  for (let attempt = 1; ; attempt++) {
    try {
      return await startJobs(options);
    } catch (error) {
      if (attempt === 3) {
        console.error(`[test server] running without job queues: ${error instanceof Error ? error.message : String(error)}`);
        return null;
      }
      await new Promise((resolve) => setTimeout(resolve, 200 * attempt));
    }
  }
}

export async function startTestServer(options: TestServerOptions = {}): Promise<TestServer> {
  const pool = createPool(options.databaseUrl ?? testDatabaseUrl(), 5);
  const db = createDatabase(pool);
  const capture = await startCaptureServer(db, { port: 0 });
  // Listen first, so PUBLIC_URL (links in mail, the origin check) can name the real port.
  const server: Server = createServer();
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  const { port } = server.address() as AddressInfo;
  const url = `http://127.0.0.1:${port}`;
  const settings: Partial<AppSettings> = {
    publicUrl: url,
    logLevel: "silent",
    instanceName: `test-server-${port}`,
    ...options.settings,
    limits: { ...defaultSettings().limits, ...testLimits, ...options.limits },
    solve: { ...defaultSettings().solve, ...testSolve, ...options.solve },
  };
  const ownQueue = !options.mailQueue?.queue;
  const mailQueue: MailQueueSettings = { queue: `mail-test-${randomUUID().slice(0, 8)}`, ...testMailQueue, ...options.mailQueue };
  settings.mailQueue = mailQueue;
  const ownSolveQueue = !options.solveQueue;
  const solveQueue = options.solveQueue ?? `solve-test-${randomUUID().slice(0, 8)}`;
  const smtp = createSmtpMailer(options.smtp ?? { host: capture.host, port: capture.port }, "Portfold tests <tests@portfold.local>");
  const solver = createSolver(settings.solve!);
  // As server/index.ts does: the thread loads the engine now, not during the first solve.
  solver.warm();
  // A database that is away (the fault tests) leaves the server without queues: mail is then not sent, solves 503.
  const jobs = await startJobsRetrying({
    databaseUrl: options.databaseUrl ?? testDatabaseUrl(),
    db,
    settings: { ...defaultSettings(), ...settings } as AppSettings,
    solveQueueName: solveQueue,
    log: options.logger ?? createLogger("silent"),
    deliverMail: { smtp, pollingIntervalSeconds: 0.5 },
    solveOn: options.solveWorker === false ? undefined : solver,
  });
  const mailer: Mailer = jobs?.mailer ?? { send: async () => false };
  server.on("request", createApp({ pool, db, mailer, settings, solver, solveQueue: jobs?.solveQueue, clientDir: options.clientDir, logger: options.logger }));
  return {
    url,
    pool,
    db,
    capture,
    solver,
    mailer,
    mailQueue: mailQueue.queue,
    solveQueue,
    close: async () => {
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await solver.close();
      if (jobs) {
        // Queues made for this server alone go with it (pg-boss keeps a table per queue).
        if (ownQueue) await deleteMailQueues(jobs.boss, mailQueue).catch(() => undefined);
        if (ownSolveQueue) await jobs.boss.deleteQueue(solveQueue).catch(() => undefined);
        await jobs.stop();
      }
      await capture.close();
      await pool.end();
    },
  };
}

// A stand-in for the built client (dist/client), so tests do not depend on a build having run.
export function clientShellDir(): string {
  const dir = mkdtempSync(join(tmpdir(), "portfold-shell-"));
  writeFileSync(
    join(dir, "index.html"),
    `<!doctype html>
<html lang="en">
  <head>
    <meta charset="UTF-8" />
    <meta name="description" content="Portfold: exact Thevenin and Norton equivalents." />
    <title>Portfold</title>
  </head>
  <body><div id="root"></div></body>
</html>
`,
  );
  return dir;
}
