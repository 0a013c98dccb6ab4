// A PostgreSQL cluster of a test's own, in a temporary folder on its own port, that the test may stop
// and start at will: the fault tests never touch the shared cluster other tests run against.
import { spawnSync } from "node:child_process";
import { chownSync, mkdtempSync, rmSync } from "node:fs";
import { createServer } from "node:net";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { migrate } from "drizzle-orm/node-postgres/migrator";
import pg from "pg";
import { createDatabase, createPool } from "../../server/db/client.js";

const pgBin = process.env.PG_BIN ?? "/usr/lib/postgresql/15/bin";
const isRoot = process.getuid?.() === 0;

export interface ThrowawayCluster {
  url: string;
  port: number;
  stop(): void;
  start(): void;
  destroy(): void;
}

// PostgreSQL refuses to run as root: as root, its programs run as the unprivileged postgres user.
function asPostgres(program: string, args: string[]): string {
  const [command, fullArgs] = isRoot ? ["runuser", ["-u", "postgres", "--", join(pgBin, program), ...args]] : [join(pgBin, program), args];
  const result = spawnSync(command, fullArgs, { encoding: "utf8" });
  if (result.status !== 0) throw new Error(`${program} ${args.join(" ")} failed: ${result.stderr || result.stdout || result.error?.message}`);
  return result.stdout;
}

function idOf(flag: "-u" | "-g"): number {
  return Number(spawnSync("id", [flag, "postgres"], { encoding: "utf8" }).stdout.trim());
}

async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const probe = createServer();
    probe.once("error", reject);
    probe.listen(0, "127.0.0.1", () => {
      const { port } = probe.address() as { port: number };
      probe.close(() => resolve(port));
    });
  });
}

/** A cluster of the test's own, migrated with the given folder (the project's migrations by default). */
export async function createThrowawayCluster(options: { migrationsFolder?: string } = {}): Promise<ThrowawayCluster> {
  const dir = mkdtempSync(join(tmpdir(), "portfold-fault-pg-"));
  if (isRoot) chownSync(dir, idOf("-u"), idOf("-g"));
  const data = join(dir, "data");
  const port = await freePort();
  // Trust on loopback is fine for a cluster that lives for one test file and listens nowhere else.
  asPostgres("initdb", ["-D", data, "-U", "postgres", "-E", "UTF8", "--locale=C", "--auth=trust", "--no-sync"]);
  const cluster: ThrowawayCluster = {
    url: `postgres://postgres@127.0.0.1:${port}/portfold_fault`,
    port,
    start: () => {
      asPostgres("pg_ctl", ["-D", data, "-l", join(dir, "server.log"), "-w", "-t", "60", "-o", `-c listen_addresses=127.0.0.1 -p ${port} -k ${dir} -c fsync=off`, "start"]);
    },
    // Fast shutdown: open transactions are rolled back and their connections cut, as in a real outage.
    stop: () => {
      asPostgres("pg_ctl", ["-D", data, "-m", "fast", "-w", "-t", "60", "stop"]);
    },
    destroy: () => {
      spawnSync(isRoot ? "runuser" : join(pgBin, "pg_ctl"), isRoot ? ["-u", "postgres", "--", join(pgBin, "pg_ctl"), "-D", data, "-m", "immediate", "stop"] : ["-D", data, "-m", "immediate", "stop"]);
      rmSync(dir, { recursive: true, force: true });
    },
  };
  cluster.start();
  const admin = new pg.Client({ connectionString: `postgres://postgres@127.0.0.1:${port}/postgres` });
  await admin.connect();
  await admin.query("create database portfold_fault");
  await admin.end();
  const pool = createPool(cluster.url, 1);
  try {
    await migrate(createDatabase(pool), { migrationsFolder: options.migrationsFolder ?? "migrations" });
  } finally {
    await pool.end();
  }
  return cluster;
}
