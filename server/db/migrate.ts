// Applies the drizzle-kit migrations in migrations/ to DATABASE_URL.
import { migrate } from "drizzle-orm/node-postgres/migrator";
import { config } from "../config.js";
import { startBoss, stopBoss } from "../jobs/boss.js";
import { createDatabase, createPool } from "./client.js";

const pool = createPool(config.databaseUrl, 1);
try {
  await migrate(createDatabase(pool), { migrationsFolder: "migrations" });
  // The job queues' tables live in their own schema (pgboss), which pg-boss creates and upgrades on start.
  await stopBoss(await startBoss(config.databaseUrl));
  console.log("[portfold] migrations applied (and the job queues' schema)");
} finally {
  await pool.end();
}
