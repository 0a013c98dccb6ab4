// Solves run on solver threads under caps: size caps refuse before a thread is used, the time cap
// terminates the thread (a fresh one takes its place), and the server answers meanwhile.
import { eq, inArray } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { defaultSettings } from "../../server/config.js";
import { revisions, solveJobs } from "../../server/db/schema.js";
import { parseNetwork } from "../../server/solver/engine.js";
import { createSolver, SolverStopped } from "../../server/solver/pool.js";
import { evaluateInfix } from "../support/expressions.js";
import { signedInPerson, type Person } from "../support/fixtures.js";
import { completeMesh, resistorChain, sensorSource, type CircuitJson } from "../support/networks.js";
import { startTestServer, type TestServer } from "../support/server.js";

// A ten-node mesh (45 legs and its source) fits the size caps; its exact Rth has millions of terms
// (Cayley's formula: 10^8 spanning trees of the complete graph), far beyond any time cap.
const meshNodes = 10;
const caps = { timeLimitMs: 1_500, maxElements: 46, maxSymbols: 46, maxResultTerms: 2, queueMax: 1 };

describe("solver caps", () => {
  let server: TestServer;
  let editor: Person;
  let teamId: string;
  beforeAll(async () => {
    server = await startTestServer({ solve: caps });
    editor = await signedInPerson(server, "capped");
    teamId = (await editor.client.post("/api/teams", { name: "Cap lab" })).body.id;
  });
  afterAll(async () => {
    await server.close();
  });

  const newNetwork = async (title: string, circuit: CircuitJson) => {
    const created = await editor.client.post(`/api/teams/${teamId}/networks`, { title, circuit });
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    return created.body.id as string;
  };
  const storedRevisions = async (networkId: string) => server.db.select().from(revisions).where(eq(revisions.networkId, networkId));

  it("refuses a network over the element or symbol cap with a 422 naming the cap, before any thread runs", async () => {
    // 47 elements: the source and 46 links.
    const wide = await newNetwork("Long divider chain", resistorChain(46, (i) => `Rlink${i}`));
    // 24 elements, two symbols in each link: 1 + 23·2 = 47 symbols.
    const symbolic = await newNetwork("Trimmed chain", resistorChain(23, (i) => `Rfix${i} + Rtrim${i}`));
    const before = server.solver.stats().started;
    const tooWide = await editor.client.post(`/api/networks/${wide}/solve`);
    expect(tooWide.status).toBe(422);
    expect(tooWide.body.error).toMatchObject({ code: "solve_cap_exceeded", cap: { cap: "elements", limit: 46, actual: 47, setting: "SOLVE_MAX_ELEMENTS" } });
    expect(tooWide.body.error.message).toContain("SOLVE_MAX_ELEMENTS");
    const tooSymbolic = await editor.client.post(`/api/networks/${symbolic}/solve`);
    expect(tooSymbolic.status).toBe(422);
    expect(tooSymbolic.body.error).toMatchObject({ code: "solve_cap_exceeded", cap: { cap: "symbols", limit: 46, actual: 47, setting: "SOLVE_MAX_SYMBOLS" } });
    expect(server.solver.stats().started).toBe(before);
    expect([...(await storedRevisions(wide)), ...(await storedRevisions(symbolic))]).toEqual([]);
  });

  it("refuses a result larger than the result-term cap", async () => {
    // Finite-gain follower: Vth = A·Vs/(1 + A) and Rth = Ro/(1 + A), one term over two
    // (Sedra & Smith, Microelectronic Circuits, feedback chapter; from memory): 3 terms > 2.
    const follower = await newNetwork("Follower", {
      ground: "0",
      port: { plus: "out", minus: "0" },
      elements: [
        { name: "Vbridge", kind: "voltage", nodes: ["in", "0"], value: "Vs" },
        { name: "Amp", kind: "voltage", nodes: ["x", "0"], value: "A * across(in, out)" },
        { name: "Rout", kind: "resistor", nodes: ["x", "out"], value: "Ro" },
      ],
    });
    const response = await editor.client.post(`/api/networks/${follower}/solve`);
    expect(response.status).toBe(422);
    expect(response.body.error).toMatchObject({ code: "solve_cap_exceeded", cap: { cap: "resultTerms", limit: 2, actual: 3, setting: "SOLVE_MAX_RESULT_TERMS" } });
    expect(await storedRevisions(follower)).toEqual([]);
  });

  it("stops a solve at the time cap by terminating its thread, answers health meanwhile, and solves on a fresh thread after", async () => {
    const mesh = await newNetwork("Ten-node mesh", completeMesh(meshNodes));
    const terminatedBefore = server.solver.stats().terminated;
    let solveAnswered = false;
    const solving = editor.client.post(`/api/networks/${mesh}/solve`).finally(() => {
      solveAnswered = true;
    });
    // If the solve held the request thread, no health answer could arrive before the solve's.
    const healthBeforeSolve: number[] = [];
    while (!solveAnswered) {
      const health = await fetch(`${server.url}/api/health`);
      if (!solveAnswered) healthBeforeSolve.push(health.status);
    }
    const capped = await solving;
    expect(capped.status, JSON.stringify(capped.body)).toBe(422);
    expect(capped.body.error).toMatchObject({ code: "solve_cap_exceeded", cap: { cap: "time", limit: 1_500, setting: "SOLVE_TIME_LIMIT_MS" } });
    expect(capped.body.error.message).toContain("1.5 s");
    expect(healthBeforeSolve.length).toBeGreaterThanOrEqual(3);
    expect(new Set(healthBeforeSolve)).toEqual(new Set([200]));
    expect(server.solver.stats().terminated).toBe(terminatedBefore + 1);
    expect(await storedRevisions(mesh)).toEqual([]);

    const sensor = await newNetwork("Sensor terminals", sensorSource);
    const solved = await editor.client.post(`/api/networks/${sensor}/solve`);
    expect(solved.status).toBe(201);
    const at = { Vs: 1.25, Rs: 350 };
    expect(evaluateInfix(solved.body.results.vth.infix, at)).toBeCloseTo(1.25, 12);
    expect(evaluateInfix(solved.body.results.rth.infix, at)).toBeCloseTo(350, 12);
  });

  it("hands out jobs that go queued → solving → failed or done, and answers 503 when the queue is full", async () => {
    const first = await newNetwork("Mesh, first", completeMesh(meshNodes, "ga"));
    const second = await newNetwork("Mesh, second", completeMesh(meshNodes, "gb"));
    const third = await newNetwork("Mesh, third", completeMesh(4, "gc"));
    const a = await editor.client.post(`/api/networks/${first}/solve?wait=0`);
    expect(a.status).toBe(202);
    // The one thread takes a; b then waits in the queue, which holds one.
    while ((await editor.client.get(a.body.job.poll)).body.status === "queued") await new Promise((resolve) => setTimeout(resolve, 20));
    const b = await editor.client.post(`/api/networks/${second}/solve?wait=0`);
    expect(b.status).toBe(202);
    expect(a.headers.get("location")).toBe(a.body.job.poll);
    expect(a.body.job).toMatchObject({ networkId: first, status: expect.stringMatching(/^(queued|solving)$/), revision: null, error: null });
    // One thread busy with a, b waiting and a queue of one: a third solve cannot be taken now.
    const busy = await editor.client.post(`/api/networks/${third}/solve`);
    expect(busy.status).toBe(503);
    expect(busy.body.error.code).toBe("solver_busy");
    expect(busy.headers.get("retry-after")).toBe("5");

    const seen: Record<string, string[]> = { a: [], b: [] };
    const poll = async (name: "a" | "b", url: string) => {
      for (;;) {
        const job = await editor.client.get(url);
        expect(job.status).toBe(200);
        if (seen[name].at(-1) !== job.body.status) seen[name].push(job.body.status);
        if (job.body.status === "done" || job.body.status === "failed") return job.body;
        await new Promise((resolve) => setTimeout(resolve, 100));
      }
    };
    const [jobA, jobB] = await Promise.all([poll("a", a.body.job.poll), poll("b", b.body.job.poll)]);
    // b waited behind a on the one thread.
    expect(seen.b.slice(0, 2)).toEqual(["queued", "solving"]);
    expect(seen.a.at(-2)).toBe("solving");
    for (const job of [jobA, jobB]) {
      expect(job).toMatchObject({ status: "failed", revision: null, error: { status: 422, code: "solve_cap_exceeded", cap: { cap: "time" } } });
      expect(Date.parse(job.finishedAt)).toBeGreaterThanOrEqual(Date.parse(job.startedAt));
    }

    const sensor = await newNetwork("Sensor behind the meshes", sensorSource);
    const done = await editor.client.post(`/api/networks/${sensor}/solve?wait=0`);
    expect(done.status).toBe(202);
    const finished = await poll("a", done.body.job.poll);
    expect(finished).toMatchObject({ status: "done", cacheHit: expect.any(Boolean), error: null, revision: { number: 1, permalink: expect.stringMatching(/\/r\/1$/) } });
    expect((await editor.client.get(`/api/networks/${sensor}/revisions/1`)).status).toBe(200);
    const rows = await server.db.select().from(solveJobs).where(inArray(solveJobs.networkId, [first, second, third, sensor]));
    // The refused third solve left no job behind.
    expect(rows.map((row) => row.status).sort()).toEqual(["done", "failed", "failed"]);
  });

  it("stops a solve at the memory cap the same way: its thread is terminated and a fresh one serves", async () => {
    const small = await startTestServer({ solve: { memoryMb: 32, timeLimitMs: 60_000, maxElements: 46, maxSymbols: 46 } });
    try {
      const person = await signedInPerson(small, "memory");
      const team = (await person.client.post("/api/teams", { name: "Memory lab" })).body.id;
      const create = async (title: string, circuit: CircuitJson) => (await person.client.post(`/api/teams/${team}/networks`, { title, circuit })).body.id as string;
      const capped = await person.client.post(`/api/networks/${await create("Ten-node mesh, small heap", completeMesh(meshNodes, "gm"))}/solve`);
      expect(capped.status).toBe(422);
      expect(capped.body.error).toMatchObject({ code: "solve_cap_exceeded", cap: { cap: "memory", limit: 32, setting: "SOLVE_MEMORY_MB" } });
      expect(small.solver.stats().terminated).toBe(1);
      const after = await person.client.post(`/api/networks/${await create("Sensor after the heap ran out", { ...sensorSource, port: { plus: "emf", minus: "0" } })}/solve`);
      expect(after.status).toBe(201);
      // Read across the ideal source itself: Vth = Vs (common practice).
      expect(evaluateInfix(after.body.results.vth.infix, { Vs: 3.3, Rs: 10 })).toBeCloseTo(3.3, 12);
    } finally {
      await small.close();
    }
  });

  it("shows a job only to members of the network's team", async () => {
    const sensor = await newNetwork("Sensor for the outsider", sensorSource);
    const job = (await editor.client.post(`/api/networks/${sensor}/solve?wait=0`)).body.job;
    const outsider = await signedInPerson(server, "outsider");
    expect((await outsider.client.get(job.poll)).status).toBe(404);
    expect((await editor.client.get(`/api/networks/${sensor}/solve-jobs/${crypto.randomUUID()}`)).status).toBe(404);
    expect((await editor.client.get(`/api/networks/${sensor}/solve-jobs/not-a-job`)).status).toBe(404);
  });

  it("a closed solver starts no thread again: a solve asked of it while the process stops is refused at once", async () => {
    // Before, a job taken after close started a fresh pool and ran to the time cap, holding up the stop.
    const solver = createSolver({ ...defaultSettings().solve, threads: 1 });
    const owner = { userId: "closing", teamId: "closing-team" };
    const sensor = parseNetwork(sensorSource).network!;
    const before = await solver.solve(sensor, {}, "closing-1", owner);
    expect(before.kind).toBe("solved");
    await solver.close();
    await expect(solver.solve(sensor, {}, "closing-2", owner)).rejects.toBeInstanceOf(SolverStopped);
    expect(solver.stats().threads).toBe(0);
  });
});
