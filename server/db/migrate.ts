// Applies the drizzle-kit migrations in migrations/ to DATABASE_URL.
import { migrate } from "drizzle-orm/node-postgres/migrator";
import { config } from "../config.js";
import { createDatabase, createPool } from "./client.js";

const pool = createPool(config.databaseUrl, 1);
try {
  await migrate(createDatabase(pool), { migrationsFolder: "migrations" });
  console.log("[portfold] migrations applied");
} finally {
  await pool.end();
}
