// A worker process on its own (`npm run worker`): delivers the mail and runs the solves that any
// server process queued in DATABASE_URL, on this machine's solver threads under the same caps.
import { config } from "./config.js";
import { createDatabase, createPool } from "./db/client.js";
import { startProcessJobs } from "./jobs/start.js";
import { createLogger } from "./lib/logging.js";

const log = createLogger(config.logLevel);
const pool = createPool(config.databaseUrl, config.dbPoolSize);
const db = createDatabase(pool);
const { settings, solver, jobs } = await startProcessJobs(db, log, { deliverMail: true, solve: true });
console.log(`[portfold] worker ${settings.instanceName}: delivering "${settings.mailQueue.queue}", solving "${jobs.solveQueue.name}" on ${settings.solve.threads} thread(s)`);
const stop = () => void jobs.stop().then(() => Promise.all([solver.close(), pool.end()])).then(() => process.exit(0));
process.on("SIGINT", stop);
process.on("SIGTERM", stop);
