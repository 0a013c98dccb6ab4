// Solves go through one job queue in PostgreSQL (pg-boss), so any process may run them: a web process
// without a solve worker hands its solves to another process, a queued solve outlives the process that
// took the request, the per-person limit counts every process's solves, and a free worker takes the
// next solve of the team with the fewest in hand (fair queueing between teams: common practice).
import { randomBytes } from "node:crypto";
import { inArray } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { solveJobs, teamMembers } from "../../server/db/schema.js";
import { ApiClient } from "../support/api.js";
import { evaluateInfix } from "../support/expressions.js";
import { signedInPerson, type Person } from "../support/fixtures.js";
import type { CircuitJson } from "../support/networks.js";
import { startTestServer, type TestServer } from "../support/server.js";

const run = randomBytes(3).toString("hex");
// A source behind its own resistance, with symbols of this run so the solve cache stays out of it.
const divider = (tag: string): CircuitJson => ({
  ground: "0",
  port: { plus: "out", minus: "0" },
  elements: [
    { name: "Sensor", kind: "voltage", nodes: ["emf", "0"], value: `Vs_${tag}${run}` },
    { name: "Winding", kind: "resistor", nodes: ["emf", "out"], value: `Rs_${tag}${run}` },
  ],
});

const servers: TestServer[] = [];
const queues: string[] = [];
const start = async (options: Parameters<typeof startTestServer>[0]) => {
  const server = await startTestServer(options);
  servers.push(server);
  return server;
};
afterAll(async () => {
  const [last] = servers.slice(-1);
  // Queues shared by several servers are nobody's own: drop them, with what the limit test left queued.
  for (const queue of queues) await last?.pool.query("select pgboss.delete_queue($1)", [queue]).catch(() => undefined);
  for (const server of servers.reverse()) await server.close().catch(() => undefined);
});

const sameSession = (person: Person, server: TestServer) => new ApiClient(server.url, { cookie: person.client.cookie });
const sharedQueue = (letter: string) => {
  const queue = `solve-shared-${run}-${letter}`;
  queues.push(queue);
  return queue;
};

async function newNetwork(person: Person, teamId: string, title: string, circuit: CircuitJson): Promise<string> {
  const created = await person.client.post(`/api/teams/${teamId}/networks`, { title, circuit });
  expect(created.status, JSON.stringify(created.body)).toBe(201);
  return created.body.id as string;
}

async function until<T>(probe: () => Promise<T | null>, timeoutMs = 20_000): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const value = await probe();
    if (value !== null) return value;
    if (Date.now() > deadline) throw new Error("condition not reached in time");
    await new Promise((resolve) => setTimeout(resolve, 50));
  }
}

describe("solves on the job queue", () => {
  it("a web process without a solve worker has its solve run by another process, within the request's wait", async () => {
    const queue = sharedQueue("a");
    const web = await start({ solveQueue: queue, solveWorker: false });
    const worker = await start({ solveQueue: queue });
    const editor = await signedInPerson(web, "queue-web");
    const team = (await editor.client.post("/api/teams", { name: "Queue bench" })).body.id;
    const network = await newNetwork(editor, team, "Sensor through the queue", divider("a"));
    const solved = await editor.client.post(`/api/networks/${network}/solve`);
    expect(solved.status, JSON.stringify(solved.body)).toBe(201);
    // Vth = Vs, Rth = Rs for a source behind its resistance (common practice).
    expect(evaluateInfix(solved.body.results.rth.infix, { [`Vs_a${run}`]: 2, [`Rs_a${run}`]: 470 })).toBeCloseTo(470, 12);
    expect(web.solver.stats().started).toBe(0);
    expect(worker.solver.stats().started).toBe(1);
    // Asked for the job at once, the poll names the process that ran it.
    const later = await newNetwork(editor, team, "Sensor, second pass", divider("a2"));
    const asked = await editor.client.post(`/api/networks/${later}/solve?wait=0`);
    expect(asked.status).toBe(202);
    await until(async () => ((await editor.client.get(asked.body.job.poll)).body.status === "done" ? true : null));
    const [job] = await web.db.select().from(solveJobs).where(inArray(solveJobs.networkId, [later]));
    expect(job).toMatchObject({ status: "done", runner: `test-server-${new URL(worker.url).port}`, revisionNumber: 1 });
    expect(worker.solver.stats().started).toBe(2);
  });

  it("keeps a queued solve when the process that took the request stops, and a worker started later runs it", async () => {
    const queue = sharedQueue("b");
    const web = await start({ solveQueue: queue, solveWorker: false });
    const editor = await signedInPerson(web, "queue-restart");
    const team = (await editor.client.post("/api/teams", { name: "Restart bench" })).body.id;
    const network = await newNetwork(editor, team, "Sensor left in the queue", divider("b"));
    // A 503 carries Retry-After (the queue was briefly out of reach): ask again, as a client does.
    let asked = await editor.client.post(`/api/networks/${network}/solve?wait=0`);
    for (let attempt = 0; attempt < 5 && asked.status === 503; attempt++) {
      await new Promise((resolve) => setTimeout(resolve, 500));
      asked = await editor.client.post(`/api/networks/${network}/solve?wait=0`);
    }
    expect(asked.status, JSON.stringify(asked.body)).toBe(202);
    await new Promise((resolve) => setTimeout(resolve, 1_500));
    expect((await editor.client.get(asked.body.job.poll)).body.status).toBe("queued");
    await web.close();

    const worker = await start({ solveQueue: queue });
    const client = sameSession(editor, worker);
    const done = await until(async () => {
      const job = (await client.get(asked.body.job.poll)).body;
      return job.status === "done" || job.status === "failed" ? job : null;
    });
    expect(done).toMatchObject({ status: "done", revision: { number: 1 } });
    expect((await client.get(`/api/networks/${network}/revisions/1`)).status).toBe(200);
    await worker.close();
  });

  it("counts one person's solves on every process against the per-person limit", async () => {
    const queue = sharedQueue("c");
    const limits = { maxPerUser: 2 };
    const first = await start({ solveQueue: queue, solveWorker: false, solve: limits });
    const second = await start({ solveQueue: queue, solveWorker: false, solve: limits });
    const editor = await signedInPerson(first, "queue-limit");
    const team = (await editor.client.post("/api/teams", { name: "Limit bench" })).body.id;
    const ids = await Promise.all(["c1", "c2", "c3"].map((tag) => newNetwork(editor, team, `Sensor ${tag}`, divider(tag))));
    const onSecond = sameSession(editor, second);
    const answers = [
      await editor.client.post(`/api/networks/${ids[0]}/solve?wait=0`),
      await onSecond.post(`/api/networks/${ids[1]}/solve?wait=0`),
      await editor.client.post(`/api/networks/${ids[2]}/solve?wait=0`),
    ];
    expect(answers.map((answer) => answer.status)).toEqual([202, 202, 429]);
    expect(answers[2].body.error).toMatchObject({ code: "solve_limit", limit: { scope: "user", running: 2, limit: 2 } });
  });

  it("gives a free worker the next solve of the team with the fewest in hand", async () => {
    const queue = sharedQueue("d");
    const web = await start({ solveQueue: queue, solveWorker: false });
    const busy = await signedInPerson(web, "queue-busy");
    const quiet = await signedInPerson(web, "queue-quiet");
    const busyTeam = (await busy.client.post("/api/teams", { name: "Busy bench" })).body.id;
    const quietTeam = (await quiet.client.post("/api/teams", { name: "Quiet bench" })).body.id;
    const colleague = await signedInPerson(web, "queue-colleague");
    await web.db.insert(teamMembers).values({ teamId: busyTeam, userId: colleague.user.id, role: "editor" });
    const busyNets = await Promise.all(["d1", "d2", "d3"].map((tag) => newNetwork(busy, busyTeam, `Busy ${tag}`, divider(tag))));
    const quietNet = await newNetwork(quiet, quietTeam, "Quiet d4", divider("d4"));
    // Three of the busy team's solves are queued before the quiet team's one.
    for (const [who, id] of [[busy, busyNets[0]], [busy, busyNets[1]], [colleague, busyNets[2]]] as const) {
      expect((await who.client.post(`/api/networks/${id}/solve?wait=0`)).status).toBe(202);
    }
    expect((await quiet.client.post(`/api/networks/${quietNet}/solve?wait=0`)).status).toBe(202);
    // One thread: the worker runs them one at a time, in the order it takes them.
    await start({ solveQueue: queue, solve: { threads: 1 } });
    const order = [...busyNets, quietNet];
    const rows = await until(async () => {
      const found = await web.db.select().from(solveJobs).where(inArray(solveJobs.networkId, order));
      return found.length === 4 && found.every((row) => row.status === "done") ? found : null;
    });
    const started = rows.sort((a, b) => a.startedAt!.getTime() - b.startedAt!.getTime()).map((row) => order.indexOf(row.networkId));
    // First in, first out would give 0, 1, 2, 3: the quiet team's solve goes second instead.
    expect(started).toEqual([0, 3, 1, 2]);
  });
});
