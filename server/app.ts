import express, { type Express } from "express";
import { existsSync } from "node:fs";
import { join, resolve } from "node:path";
import type pg from "pg";
import type { Database } from "./db/client.js";
import { errorHandler, notFoundApi } from "./lib/errors.js";
import { healthRouter } from "./routes/health.js";

export interface AppContext {
  pool: pg.Pool;
  db: Database;
  clientDir?: string;
}

export function createApp(context: AppContext): Express {
  const app = express();
  app.disable("x-powered-by");
  app.set("trust proxy", "loopback");
  app.use(express.json({ limit: "256kb" }));

  app.use("/api/health", healthRouter(context.pool));
  app.use("/api", notFoundApi);

  const clientDir = context.clientDir ?? resolve("dist/client");
  if (existsSync(join(clientDir, "index.html"))) {
    app.use(express.static(clientDir, { index: false, maxAge: "1h" }));
    // Client-side routes: every other GET gets the app shell; React Router takes it from there.
    app.get(/^\/(?!api\/).*/, (_req, res) => res.sendFile(join(clientDir, "index.html")));
  }

  app.use(errorHandler);
  return app;
}
