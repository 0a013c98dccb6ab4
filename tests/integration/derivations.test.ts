import { eq, sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { revisionSteps, revisions } from "../../server/db/schema.js";
import { evaluateInfix } from "../support/expressions.js";
import { followerCircuit, signedInPerson, type Person } from "../support/fixtures.js";
import { startTestServer, type TestServer } from "../support/server.js";

describe("solving a network into derivation revisions", () => {
  let server: TestServer;
  let editor: Person;
  let teamId: string;
  beforeAll(async () => {
    server = await startTestServer();
    editor = await signedInPerson(server, "solver");
    teamId = (await editor.client.post("/api/teams", { name: "Derivation lab" })).body.id;
  });
  afterAll(async () => {
    await server.close();
  });

  const newNetwork = async (title: string, circuit: unknown = followerCircuit) =>
    (await editor.client.post(`/api/teams/${teamId}/networks`, { title, circuit })).body as { id: string; slug: string };

  it("stores an immutable revision with its results and every step, and reads it back by number", async () => {
    const network = await newNetwork("Finite-gain follower");
    const solved = await editor.client.post(`/api/networks/${network.id}/solve`);
    expect(solved.status).toBe(201);
    expect(solved.body.number).toBe(1);
    expect(solved.body.permalink).toBe(`/n/${network.slug}/r/1`);
    // Finite-gain voltage follower: Vth = A·Vs/(1 + A), Rout = Ro/(1 + A)
    // (Sedra & Smith, Microelectronic Circuits, feedback chapter; from memory). At A = 3, Ro = 2, Vs = 5.
    const at = { A: 3, Ro: 2, Vs: 5 };
    expect(evaluateInfix(solved.body.results.vth.infix, at)).toBeCloseTo(15 / 4, 12);
    expect(evaluateInfix(solved.body.results.rth.infix, at)).toBeCloseTo(2 / 4, 12);
    expect(evaluateInfix(solved.body.results.rth.compact, at)).toBeCloseTo(2 / 4, 12);
    expect(solved.body.results.agree).toBe(true);
    expect(solved.body.steps.length).toBeGreaterThan(5);
    expect(solved.body.steps.map((s: { ordinal: number }) => s.ordinal)).toEqual(solved.body.steps.map((_: unknown, i: number) => i + 1));
    expect(solved.body.steps[0]).toEqual(expect.objectContaining({ id: expect.any(String), kind: expect.any(String), title: expect.any(String), tex: expect.any(String) }));
    const rows = await server.db.select().from(revisionSteps).where(eq(revisionSteps.revisionId, solved.body.id));
    expect(rows).toHaveLength(solved.body.steps.length);

    const read = await editor.client.get(`/api/networks/${network.id}/revisions/1`);
    expect(read.status).toBe(200);
    // Members also read how many note threads are open.
    expect(read.body).toEqual({ ...solved.body, openNotes: 0 });
    expect((await editor.client.get(`/api/networks/${network.id}/revisions/2`)).status).toBe(404);
    expect((await editor.client.get(`/api/networks/${network.id}/revisions/zero`)).status).toBe(404);

    // Editing the network afterwards leaves the revision exactly as it was.
    await editor.client.patch(`/api/networks/${network.id}`, { circuit: { ...followerCircuit, elements: followerCircuit.elements.slice(0, 2) } });
    expect((await editor.client.get(`/api/networks/${network.id}/revisions/1`)).body.circuit).toEqual(followerCircuit);
  });

  it("numbers revisions per network, also when two solves race", async () => {
    const network = await newNetwork("Racing solves");
    const [a, b] = await Promise.all([editor.client.post(`/api/networks/${network.id}/solve`), editor.client.post(`/api/networks/${network.id}/solve`)]);
    expect([a.status, b.status]).toEqual([201, 201]);
    expect([a.body.number, b.body.number].sort()).toEqual([1, 2]);
    const list = await editor.client.get(`/api/networks/${network.id}/revisions`);
    expect(list.body.revisions.map((r: { number: number }) => r.number)).toEqual([2, 1]);
    expect(list.body.revisions[0]).toMatchObject({ verdict: { verdict: "open" }, summary: { rth: a.body.results.rth.infix } });
    const other = await newNetwork("Another network");
    expect((await editor.client.post(`/api/networks/${other.id}/solve`)).body.number).toBe(1);
    const listed = await editor.client.get(`/api/teams/${teamId}/networks?sort=title`);
    expect(listed.body.networks.find((n: { id: string }) => n.id === network.id)).toMatchObject({ latestRevision: 2, verdict: "open" });
  });

  it("compares two revisions: elements added, removed and changed, and which results changed", async () => {
    const network = await newNetwork("Follower with a load");
    await editor.client.post(`/api/networks/${network.id}/solve`);
    const loaded = {
      ...followerCircuit,
      elements: [
        followerCircuit.elements[0],
        { ...followerCircuit.elements[1], value: "mu" },
        { name: "Rload", kind: "resistor", nodes: ["out", "0"], value: "RL" },
      ],
    };
    await editor.client.patch(`/api/networks/${network.id}`, { circuit: loaded });
    await editor.client.post(`/api/networks/${network.id}/solve`);
    const diff = await editor.client.get(`/api/networks/${network.id}/revisions/1/compare/2`);
    expect(diff.status).toBe(200);
    expect(diff.body.circuit.added.map((e: { name: string }) => e.name)).toEqual(["Rload"]);
    expect(diff.body.circuit.removed.map((e: { name: string }) => e.name)).toEqual(["Rout"]);
    expect(diff.body.circuit.changed).toEqual([expect.objectContaining({ name: "Amp", fields: ["value"] })]);
    expect(diff.body.circuit.port).toBeNull();
    const changed = Object.fromEntries(diff.body.results.map((r: { name: string; changed: boolean }) => [r.name, r.changed]));
    expect(changed).toEqual({ vth: true, isc: true, rth: true, rthFromVocIsc: true });
    const same = await editor.client.get(`/api/networks/${network.id}/revisions/2/compare/2`);
    expect(same.body.results.every((r: { changed: boolean }) => !r.changed)).toBe(true);
    expect((await editor.client.get(`/api/networks/${network.id}/revisions/1/compare/9`)).status).toBe(404);
  });

  it("answers an ill-posed network with 422 and the engine's diagnostics, storing nothing", async () => {
    // Two ideal voltage sources in parallel: a loop of voltage sources (common practice: ill-posed).
    const network = await newNetwork("Fighting sources", {
      port: { plus: "a", minus: "0" },
      elements: [
        { name: "Supply", kind: "voltage", nodes: ["a", "0"], value: "V1" },
        { name: "Reference", kind: "voltage", nodes: ["a", "0"], value: "V2" },
      ],
    });
    const response = await editor.client.post(`/api/networks/${network.id}/solve`);
    expect(response.status).toBe(422);
    expect(response.body.error.code).toBe("network_ill_posed");
    expect(response.body.error.diagnostics.map((d: { code: string }) => d.code)).toContain("voltage-source-loop");
    expect(await server.db.select().from(revisions).where(eq(revisions.networkId, network.id))).toEqual([]);
  });

  it("leaves no revision at all when writing the steps fails part-way (one transaction)", async () => {
    const network = await newNetwork("Interrupted solve");
    // Failure injection in the database itself: the third step of this network's revision cannot be written.
    await server.pool.query(`
      create or replace function fail_third_step() returns trigger language plpgsql as $$
      begin
        if new.ordinal = 3 and exists (select 1 from revisions where id = new.revision_id and network_id = '${network.id}') then
          raise exception 'injected failure while writing steps';
        end if;
        return new;
      end $$;
      create trigger fail_third_step before insert on revision_steps for each row execute function fail_third_step();`);
    try {
      const response = await editor.client.post(`/api/networks/${network.id}/solve`);
      expect(response.status).toBe(500);
      expect(response.body.error).toEqual({ code: "internal", message: expect.any(String) });
      expect(JSON.stringify(response.body)).not.toContain("injected");
    } finally {
      await server.pool.query("drop trigger fail_third_step on revision_steps; drop function fail_third_step();");
    }
    const left = await server.db.select().from(revisions).where(eq(revisions.networkId, network.id));
    expect(left).toEqual([]);
    const orphans = await server.db.execute(sql`select count(*)::int as n from revision_steps s left join revisions r on r.id = s.revision_id where r.id is null`);
    expect(orphans.rows[0]).toEqual({ n: 0 });
    // Numbering is untouched by the failed attempt.
    expect((await editor.client.post(`/api/networks/${network.id}/solve`)).body.number).toBe(1);
  });
});
