// PostgreSQL goes away in the middle of a save: the client gets a clear 503, nothing is half
// written, and once PostgreSQL is back the same server process serves again without a restart.
// Runs against a throwaway cluster of its own, never the shared test cluster.
import { eq, sql } from "drizzle-orm";
import pg from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { networks, revisionSteps, revisions } from "../../server/db/schema.js";
import { signedInPerson, type Person } from "../support/fixtures.js";
import { sensorSource } from "../support/networks.js";
import { startTestServer, type TestServer } from "../support/server.js";
import { createThrowawayCluster, type ThrowawayCluster } from "../support/throwaway-postgres.js";

async function until<T>(probe: () => Promise<T | null>, attempts = 200): Promise<T> {
  for (let attempt = 0; attempt < attempts; attempt++) {
    const found = await probe().catch(() => null);
    if (found !== null) return found;
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
  throw new Error("gave up waiting");
}

describe("PostgreSQL stopping during a save", () => {
  let cluster: ThrowawayCluster;
  let server: TestServer;
  let editor: Person;
  let teamId: string;
  beforeAll(async () => {
    cluster = await createThrowawayCluster();
    server = await startTestServer({ databaseUrl: cluster.url });
    editor = await signedInPerson(server, "outage");
    teamId = (await editor.client.post("/api/teams", { name: "Outage lab" })).body.id;
  }, 90_000);
  afterAll(async () => {
    await server?.close().catch(() => undefined);
    cluster?.destroy();
  });

  it("answers 503 with a clear message, keeps no half-written revision, and serves again once PostgreSQL is back", async () => {
    const networkId = (await editor.client.post(`/api/teams/${teamId}/networks`, { title: "Sensor at the terminals", circuit: sensorSource })).body.id;
    // Hold the save open after the revision row and its first step are written, so the stop lands mid-transaction.
    await server.pool.query(`
      create function hold_second_step() returns trigger language plpgsql as $$
      begin
        if new.ordinal = 2 then perform pg_sleep(60); end if;
        return new;
      end $$;
      create trigger hold_second_step before insert on revision_steps for each row execute function hold_second_step();`);
    const saving = editor.client.post(`/api/networks/${networkId}/solve`);
    const watcher = new pg.Client({ connectionString: cluster.url });
    await watcher.connect();
    await until(async () => ((await watcher.query("select 1 from pg_stat_activity where wait_event = 'PgSleep'")).rowCount ? true : null));
    await watcher.end();

    cluster.stop();
    const interrupted = await saving;
    expect(interrupted.status).toBe(503);
    expect(interrupted.body.error.code).toBe("database_unavailable");
    expect(interrupted.body.error.message).toMatch(/database is not reachable/);
    expect(interrupted.headers.get("retry-after")).toBe("5");

    // While it is down: every route that needs it says so the same way, and health reports it.
    const down = await Promise.all([
      editor.client.post(`/api/teams/${teamId}/networks`, { title: "Saved during the outage", circuit: sensorSource }),
      editor.client.get(`/api/networks/${networkId}`),
      editor.client.patch(`/api/networks/${networkId}`, { title: "Renamed during the outage" }),
    ]);
    for (const response of down) {
      expect(response.status).toBe(503);
      expect(response.body.error.code).toBe("database_unavailable");
      expect(JSON.stringify(response.body)).not.toMatch(/ECONNREFUSED|at .*\.ts|stack/);
    }
    const health = await fetch(`${server.url}/api/health`);
    expect(health.status).toBe(503);
    expect(await health.json()).toEqual({ ok: false, db: "down" });

    cluster.start();
    // The same server process, not restarted: its pool reconnects by itself.
    await until(async () => ((await fetch(`${server.url}/api/health`)).status === 200 ? true : null));
    await server.pool.query("drop trigger hold_second_step on revision_steps; drop function hold_second_step();");
    expect(await server.db.select().from(revisions).where(eq(revisions.networkId, networkId))).toEqual([]);
    const orphans = await server.db.execute(sql`select count(*)::int as n from ${revisionSteps} s left join ${revisions} r on r.id = s.revision_id where r.id is null`);
    expect(orphans.rows[0]).toEqual({ n: 0 });
    const [network] = await server.db.select().from(networks).where(eq(networks.id, networkId));
    expect(network.title).toBe("Sensor at the terminals");
    expect((await server.db.select().from(networks).where(eq(networks.title, "Saved during the outage"))).length).toBe(0);

    const solved = await editor.client.post(`/api/networks/${networkId}/solve`);
    expect(solved.status).toBe(201);
    expect(solved.body.number).toBe(1);
    expect((await editor.client.patch(`/api/networks/${networkId}`, { title: "Renamed after the outage" })).status).toBe(200);
  });
});
