// Starts the real Express app on an ephemeral loopback port against the test database.
import type { AddressInfo } from "node:net";
import type { Server } from "node:http";
import { createApp } from "../../server/app.js";
import { createDatabase, createPool } from "../../server/db/client.js";

export interface TestServer {
  url: string;
  pool: ReturnType<typeof createPool>;
  db: ReturnType<typeof createDatabase>;
  close(): Promise<void>;
}

export function testDatabaseUrl(): string {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error("DATABASE_URL is not set: run the suite with `npm test`, which starts the test database");
  return url;
}

export async function startTestServer(): Promise<TestServer> {
  const pool = createPool(testDatabaseUrl(), 5);
  const db = createDatabase(pool);
  const app = createApp({ pool, db });
  const server: Server = await new Promise((resolve) => {
    const listening = app.listen(0, "127.0.0.1", () => resolve(listening));
  });
  const { port } = server.address() as AddressInfo;
  return {
    url: `http://127.0.0.1:${port}`,
    pool,
    db,
    close: async () => {
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await pool.end();
    },
  };
}
