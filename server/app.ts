import express, { type Express } from "express";
import { existsSync } from "node:fs";
import { join, resolve } from "node:path";
import type pg from "pg";
import type { Logger } from "pino";
import { apiTokenAuth, unlessToken } from "./auth/api-tokens.js";
import { checkHost } from "./auth/hosts.js";
import { createLucia } from "./auth/lucia.js";
import { createRateLimits } from "./auth/rate-limits.js";
import { checkOrigin, loadSession } from "./auth/session.js";
import { defaultSettings, type AppSettings } from "./config.js";
import type { Database } from "./db/client.js";
import type { Services } from "./domain/services.js";
import { errorHandler, notFoundApi } from "./lib/errors.js";
import { createLogger, requestLogger } from "./lib/logging.js";
import { securityHeaders } from "./lib/security.js";
import { createSmtpMailer, smtpTarget, type Mailer } from "./mail/mailer.js";
import { apiTokensRouter } from "./routes/api-tokens.js";
import { attachmentsRouter } from "./routes/attachments.js";
import { authRouter } from "./routes/auth.js";
import { cellsRouter } from "./routes/cells.js";
import { devMailRouter } from "./routes/dev-mail.js";
import { healthRouter } from "./routes/health.js";
import { networksRouter } from "./routes/networks.js";
import { openApiRouter } from "./routes/openapi.js";
import { reviewsRouter } from "./routes/reviews.js";
import { revisionsRouter } from "./routes/revisions.js";
import { sharePageRouter } from "./routes/share-page.js";
import { sharesRouter } from "./routes/shares.js";
import { teamsRouter } from "./routes/teams.js";
import { valueSetsRouter } from "./routes/value-sets.js";
import { createSolver, type Solver } from "./solver/pool.js";
import type { SolveQueue } from "./domain/solve-queue.js";

;

export interface AppContext {
  pool: pg.Pool;
  db: Database;
  clientDir?: string;
  mailer?: Mailer;
  logger?: Logger;
  settings?: Partial<AppSettings>;
  // The solver threads; the caller that passes them closes them. Without, the app makes its own
  // (threads start on the first solve).
  solver?: Solver;
  // The solve queue requests send to (server/domain/solve-queue.ts); without, a solve the cache cannot answer is 503.
  solveQueue?: SolveQueue;
}

// PostgreSQL text and jsonb cannot hold U+0000; refusing it while parsing makes it a 400, not a database error.
function refuseNul(key: string, value: unknown): unknown {
  if (key.includes("\u0000") || (typeof value === "string" && value.includes("\u0000"))) throw new SyntaxError("U+0000 is not allowed in text");
  return value;
}

export function createApp(context: AppContext): Express {
  const settings: AppSettings = { ...defaultSettings(), ...context.settings };
  const log = context.logger ?? createLogger(settings.logLevel);
  const mailer = context.mailer ?? createSmtpMailer(smtpTarget(), settings.mailFrom, log);
  const solver = context.solver ?? createSolver(settings.solve);
  const services: Services = { db: context.db, auth: createLucia(context.db, { secureCookie: settings.production }), mailer, solver, solveQueue: context.solveQueue ?? null, settings, log };

  const app = express();
  app.disable("x-powered-by");
  // Off unless TRUST_PROXY names the balancers: otherwise any client could pick its own address for the rate limits.
  app.set("trust proxy", settings.trustProxy);
  app.use(requestLogger(log));
  // CSP of exactly what the client loads, nosniff, no referrer, no framing; HSTS only in production.
  app.use(securityHeaders(settings.production));
  app.use(express.json({ limit: settings.jsonBodyBytes, reviver: refuseNul }));

  // Health stays open to any name: balancers probe by address.
  app.use("/api/health", healthRouter(context.pool));
  app.use(checkHost(settings.publicUrl));
  app.use("/api/openapi.json", openApiRouter());
  // A bearer token (scripts) or the session cookie (the browser, with its origin check): never both.
  app.use("/api", apiTokenAuth(services), unlessToken(checkOrigin(settings.publicUrl)), unlessToken(loadSession(services.auth)));
  app.use(
    "/api",
    authRouter(services, createRateLimits(settings.limits)),
    apiTokensRouter(services),
    teamsRouter(services),
    cellsRouter(services),
    networksRouter(services),
    revisionsRouter(services),
    reviewsRouter(services),
    sharesRouter(services),
    attachmentsRouter(services),
    valueSetsRouter(services),
  );
  app.use(devMailRouter(services));
  app.use("/api", notFoundApi);

  const clientDir = context.clientDir ?? resolve("dist/client");
  const shell = join(clientDir, "index.html");
  if (existsSync(shell)) {
    app.use(sharePageRouter(services, shell));
    app.use(express.static(clientDir, { index: false, maxAge: "1h" }));
    // Client-side routes: every other GET gets the app shell; React Router takes it from there.
    app.get(/^\/(?!api\/).*/, (_req, res) => res.sendFile(shell));
  }

  app.use(errorHandler);
  return app;
}
