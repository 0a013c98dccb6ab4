import type { Logger } from "pino";
import type { Auth } from "../auth/lucia.js";
import type { AppSettings } from "../config.js";
import type { Database } from "../db/client.js";
import type { Mailer } from "../mail/mailer.js";
import type { Solver } from "../solver/pool.js";
import type { SolveQueue } from "./solve-queue.js";

// What domain functions may touch: the database, sessions, outgoing mail, the solver threads, the solve queue and the settings.
export interface Services {
  db: Database;
  auth: Auth;
  mailer: Mailer;
  solver: Solver;
  // Where solves go; null in an app made without a job engine (route listings, the health probe).
  solveQueue: SolveQueue | null;
  settings: AppSettings;
  log: Logger;
}

export type Transaction = Parameters<Parameters<Database["transaction"]>[0]>[0];

// Links in e-mails and share links point at client routes under PUBLIC_URL.
export function link(services: Services, path: string): string {
  return `${services.settings.publicUrl}${path}`;
}
