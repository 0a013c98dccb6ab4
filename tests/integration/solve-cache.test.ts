// The solve cache: keyed by a canonical hash of (circuit, port, options), kept in PostgreSQL, so a
// network solved twice reaches a solver thread once, and a restarted server still knows it.
import { randomBytes } from "node:crypto";
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { solveCache } from "../../server/db/schema.js";
import { canonicalJson, solveKey } from "../../server/solver/cache.js";
import { ApiClient } from "../support/api.js";
import { evaluateInfix } from "../support/expressions.js";
import { signedInPerson, type Person } from "../support/fixtures.js";
import { startTestServer, type TestServer } from "../support/server.js";

// The cache outlives test runs too: symbols unique to this run keep earlier runs' entries out of it.
const run = randomBytes(4).toString("hex");
const Rs = `Rs_${run}`;
const Rl = `Rl_${run}`;

// A sensor behind a resistive divider: Vth = Vs·Rl/(Rs + Rl), Rth = Rs·Rl/(Rs + Rl) (common practice).
const divider = {
  ground: "0",
  port: { plus: "mid", minus: "0" },
  elements: [
    { name: "Sensor", kind: "voltage", nodes: ["top", "0"], value: "Vs" },
    { name: "Upper", kind: "resistor", nodes: ["top", "mid"], value: Rs },
    { name: "Lower", kind: "resistor", nodes: ["mid", "0"], value: Rl },
  ],
};

// The same circuit written differently: keys in another order, ground left to its default.
const dividerReordered = {
  elements: divider.elements.map(({ value, nodes, kind, name }) => ({ value, nodes, name, kind })),
  port: { minus: "0", plus: "mid" },
};

describe("the solve cache", () => {
  let server: TestServer;
  let editor: Person;
  let teamId: string;
  beforeAll(async () => {
    server = await startTestServer();
    editor = await signedInPerson(server, "cached");
    teamId = (await editor.client.post("/api/teams", { name: "Cache lab" })).body.id;
  });
  afterAll(async () => {
    await server?.close();
  });

  const newNetwork = async (title: string, circuit: unknown) =>
    (await editor.client.post(`/api/teams/${teamId}/networks`, { title, circuit })).body.id as string;
  const solve = (networkId: string) => editor.client.post(`/api/networks/${networkId}/solve`);

  it("derives a network once: the second solve is answered from the cache without a solver thread", async () => {
    const networkId = await newNetwork("Divider", divider);
    const first = await solve(networkId);
    expect(first.status, JSON.stringify(first.body)).toBe(201);
    expect(first.headers.get("portfold-solve-cache")).toBe("miss");
    const at = { Vs: 5, [Rs]: 1_000, [Rl]: 3_000 };
    expect(evaluateInfix(first.body.results.vth.infix, at)).toBeCloseTo((5 * 3_000) / 4_000, 12);
    expect(evaluateInfix(first.body.results.rth.infix, at)).toBeCloseTo((1_000 * 3_000) / 4_000, 12);
    const started = server.solver.stats().started;

    const second = await solve(networkId);
    expect(second.status).toBe(201);
    expect(second.headers.get("portfold-solve-cache")).toBe("hit");
    expect(second.body.number).toBe(2);
    expect(server.solver.stats().started).toBe(started);
    expect(second.body.results).toEqual(first.body.results);
    expect(second.body.steps.map((step: { id: string }) => step.id)).toEqual(first.body.steps.map((step: { id: string }) => step.id));

    // Another network with the same circuit, written with other key order and the default ground.
    const twin = await newNetwork("Divider, typed again", dividerReordered);
    const third = await solve(twin);
    expect(third.headers.get("portfold-solve-cache")).toBe("hit");
    expect(third.body.results).toEqual(first.body.results);
    expect(server.solver.stats().started).toBe(started);
    const [entry] = await server.db.select().from(solveCache).where(eq(solveCache.key, solveKey(divider as never, {})));
    expect(entry.hits).toBe(2);
  });

  it("solves again when the port changes, and shares one run between identical solves at the same time", async () => {
    const otherPort = await newNetwork("Divider read at the top", { ...divider, port: { plus: "top", minus: "0" } });
    const started = server.solver.stats().started;
    const moved = await solve(otherPort);
    expect(moved.headers.get("portfold-solve-cache")).toBe("miss");
    // Read across the ideal source: Vth = Vs, Rth = 0 (common practice).
    expect(evaluateInfix(moved.body.results.vth.infix, { Vs: 5 })).toBeCloseTo(5, 12);
    expect(server.solver.stats().started).toBe(started + 1);

    const fresh = { ...divider, elements: divider.elements.map((e) => (e.name === "Lower" ? { ...e, value: `${Rl}_b` } : e)) };
    const [a, b] = [await newNetwork("Race A", fresh), await newNetwork("Race B", fresh)];
    const [ra, rb] = await Promise.all([solve(a), solve(b)]);
    expect([ra.status, rb.status]).toEqual([201, 201]);
    expect(server.solver.stats().started).toBe(started + 2);
    expect(ra.body.results).toEqual(rb.body.results);
  });

  it("survives a restart: a new server with new solver threads answers from PostgreSQL", async () => {
    await server.close();
    server = await startTestServer();
    editor = { ...editor, client: new ApiClient(server.url, { cookie: editor.client.cookie }) };
    const networkId = await newNetwork("Divider after the restart", divider);
    const again = await solve(networkId);
    expect(again.status).toBe(201);
    expect(again.headers.get("portfold-solve-cache")).toBe("hit");
    expect(server.solver.stats().started).toBe(0);
  });

  it("keys on a canonical form and on the engine that derived it", () => {
    expect(canonicalJson({ b: [2, { d: 1, c: null }], a: "x" })).toBe('{"a":"x","b":[2,{"c":null,"d":1}]}');
    const circuit = divider as never;
    expect(solveKey(circuit, {}, "engine-a")).not.toBe(solveKey(circuit, {}, "engine-b"));
    expect(solveKey(circuit, {})).not.toBe(solveKey(circuit, { sensitivities: false }));
  });
});
