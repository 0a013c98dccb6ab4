// Applies the drizzle-kit migrations in migrations/ to DATABASE_URL.
import { migrate } from "drizzle-orm/node-postgres/migrator";
import { config, defaultSettings } from "../config.js";
import { startMailBoss, stopMailBoss } from "../mail/queue.js";
import { createDatabase, createPool } from "./client.js";

const pool = createPool(config.databaseUrl, 1);
try {
  await migrate(createDatabase(pool), { migrationsFolder: "migrations" });
  // The mail queue's tables live in their own schema (pgboss), which pg-boss creates and upgrades on start.
  await stopMailBoss(await startMailBoss(config.databaseUrl, defaultSettings().mailQueue));
  console.log("[portfold] migrations applied (and the mail queue's schema)");
} finally {
  await pool.end();
}
