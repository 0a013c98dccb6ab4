import express, { type Express } from "express";
import helmet from "helmet";
import { existsSync } from "node:fs";
import { join, resolve } from "node:path";
import type pg from "pg";
import pino, { type Logger } from "pino";
import { pinoHttp } from "pino-http";
import { createLucia } from "./auth/lucia.js";
import { createRateLimits } from "./auth/rate-limits.js";
import { checkOrigin, loadSession } from "./auth/session.js";
import { defaultSettings, type AppSettings } from "./config.js";
import type { Database } from "./db/client.js";
import type { Services } from "./domain/services.js";
import { errorHandler, notFoundApi } from "./lib/errors.js";
import { createSmtpMailer, smtpTarget, type Mailer } from "./mail/mailer.js";
import { attachmentsRouter } from "./routes/attachments.js";
import { authRouter } from "./routes/auth.js";
import { devMailRouter } from "./routes/dev-mail.js";
import { healthRouter } from "./routes/health.js";
import { networksRouter } from "./routes/networks.js";
import { reviewsRouter } from "./routes/reviews.js";
import { revisionsRouter } from "./routes/revisions.js";
import { sharePageRouter } from "./routes/share-page.js";
import { sharesRouter } from "./routes/shares.js";
import { teamsRouter } from "./routes/teams.js";

export interface AppContext {
  pool: pg.Pool;
  db: Database;
  clientDir?: string;
  mailer?: Mailer;
  logger?: Logger;
  settings?: Partial<AppSettings>;
}

// Tokens travel in some paths (share links, invitations); logs keep the route, not the secret.
export function redactTokens(url: string): string {
  return url.replace(/\/(s|share|invitations)\/[A-Za-z0-9_-]{20,}/g, "/$1/[token]").replace(/token=[^&]+/g, "token=[token]");
}

// PostgreSQL text and jsonb cannot hold U+0000; refusing it while parsing makes it a 400, not a database error.
function refuseNul(key: string, value: unknown): unknown {
  if (key.includes("\u0000") || (typeof value === "string" && value.includes("\u0000"))) throw new SyntaxError("U+0000 is not allowed in text");
  return value;
}

export function createApp(context: AppContext): Express {
  const settings: AppSettings = { ...defaultSettings(), ...context.settings };
  const log = context.logger ?? pino({ level: settings.logLevel });
  const mailer = context.mailer ?? createSmtpMailer(smtpTarget(), settings.mailFrom, log);
  const services: Services = { db: context.db, auth: createLucia(context.db, { secureCookie: settings.production }), mailer, settings, log };

  const app = express();
  app.disable("x-powered-by");
  app.set("trust proxy", "loopback");
  app.use(
    pinoHttp({
      logger: log,
      // Requests to the API and share pages are worth a line each; static assets are not.
      autoLogging: { ignore: (req) => !/^\/(api|s|dev)\//.test(req.url ?? "") },
      serializers: {
        req: (req: { id: unknown; method: string; url: string }) => ({ id: req.id, method: req.method, url: redactTokens(req.url) }),
        res: (res: { statusCode: number }) => ({ statusCode: res.statusCode }),
      },
    }),
  );
  // helmet's defaults (a same-origin Content-Security-Policy, nosniff, no referrer); HTTPS-only
  // headers only in production, so plain http on loopback keeps working.
  app.use(
    helmet({
      contentSecurityPolicy: { directives: { upgradeInsecureRequests: settings.production ? [] : null } },
      strictTransportSecurity: settings.production,
    }),
  );
  app.use(express.json({ limit: "256kb", reviver: refuseNul }));

  app.use("/api/health", healthRouter(context.pool));
  app.use("/api", checkOrigin(settings.publicUrl), loadSession(services.auth));
  app.use(
    "/api",
    authRouter(services, createRateLimits(settings.limits)),
    teamsRouter(services),
    networksRouter(services),
    revisionsRouter(services),
    reviewsRouter(services),
    sharesRouter(services),
    attachmentsRouter(services),
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
