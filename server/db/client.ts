import { drizzle, type NodePgDatabase } from "drizzle-orm/node-postgres";
import pg from "pg";
import * as schema from "./schema.js";

export type Database = NodePgDatabase<typeof schema>;

export function createPool(connectionString: string, max = 10): pg.Pool {
  // Short connection timeout so a database outage answers fast instead of hanging requests.
  const pool = new pg.Pool({ connectionString, max, connectionTimeoutMillis: 2_000, idleTimeoutMillis: 30_000 });
  pool.on("error", () => {
    // Idle clients die when PostgreSQL restarts; the pool replaces them on next use.
  });
  // A client in use when PostgreSQL goes away also emits "error" after its query fails; unheard, that
  // event would end the process. The query's own error reaches the request (a 503); the pool drops the client.
  pool.on("connect", (client) => {
    client.on("error", () => undefined);
  });
  return pool;
}

export function createDatabase(pool: pg.Pool): Database {
  return drizzle(pool, { schema });
}
