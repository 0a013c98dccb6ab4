// One account cannot take the solver from everyone: per-person and per-team limits on queued and
// running solves (429 with Retry-After and how many are running), and a free thread serves teams in turn.
import { randomBytes } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { teamMembers } from "../../server/db/schema.js";
import { signedInPerson, type Person } from "../support/fixtures.js";
import { completeMesh, sensorSource, type CircuitJson } from "../support/networks.js";
import { startTestServer, type TestServer } from "../support/server.js";

// Ten-node meshes run to the time cap (see solver-caps.test.ts); a unique tag per network and run keeps the cache out.
const caps = { threads: 1, timeLimitMs: 8_000, maxElements: 46, maxSymbols: 46, queueMax: 16, maxPerUser: 2, maxPerTeam: 3 };

describe("solve limits per person and per team, fair order between teams", () => {
  let server: TestServer;
  let flooder: Person;
  let teammate: Person;
  let neighbour: Person;
  let floodTeam: string;
  let otherTeam: string;
  const run = randomBytes(3).toString("hex");
  beforeAll(async () => {
    server = await startTestServer({ solve: caps });
    [flooder, teammate, neighbour] = await Promise.all([signedInPerson(server, "flooder"), signedInPerson(server, "teammate"), signedInPerson(server, "neighbour")]);
    floodTeam = (await flooder.client.post("/api/teams", { name: "Flood bench" })).body.id;
    await server.db.insert(teamMembers).values({ teamId: floodTeam, userId: teammate.user.id, role: "editor" });
    otherTeam = (await neighbour.client.post("/api/teams", { name: "Quiet bench" })).body.id;
  });
  afterAll(async () => {
    await server.close();
  });

  let count = 0;
  const network = async (who: Person, teamId: string, circuit: CircuitJson) => {
    const created = await who.client.post(`/api/teams/${teamId}/networks`, { title: `Net ${(count += 1)}`, circuit });
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    return created.body.id as string;
  };
  const heavy = (who: Person) => network(who, floodTeam, completeMesh(10, `m${run}n${count}x`));

  it("answers 429 past the per-person and per-team limits, and serves the other team next", async () => {
    // Every network first, so the solves below go in within a fraction of the time cap.
    const mine = await Promise.all([heavy(flooder), heavy(flooder), heavy(flooder)]);
    const theirs = await Promise.all([heavy(teammate), heavy(teammate)]);
    const quiet = await network(neighbour, otherTeam, sensorSource);
    const answers = [];
    for (const id of mine) answers.push(await flooder.client.post(`/api/networks/${id}/solve?wait=0`));
    expect(answers.map((a) => a.status)).toEqual([202, 202, 429]);
    const limited = answers[2];
    expect(limited.body.error).toMatchObject({ code: "solve_limit", limit: { scope: "user", running: 2, limit: 2, setting: "SOLVE_MAX_PER_USER" } });
    expect(limited.body.error.message).toContain("2 solves queued or running");
    expect(Number(limited.headers.get("retry-after"))).toBeGreaterThan(0);

    // The team limit (3) is reached by the teammate's second solve.
    const teamAnswers = [];
    for (const id of theirs) teamAnswers.push(await teammate.client.post(`/api/networks/${id}/solve?wait=0`));
    expect(teamAnswers.map((a) => a.status)).toEqual([202, 429]);
    expect(teamAnswers[1].body.error.limit).toMatchObject({ scope: "team", running: 3, setting: "SOLVE_MAX_PER_TEAM" });

    // Another team's trivial solve goes next, not behind the flood team's queue (first in, first out would put it last).
    const solved = await neighbour.client.post(`/api/networks/${quiet}/solve`);
    expect(solved.status).toBe(201);
    const jobs = [...answers.slice(0, 2), teamAnswers[0]].map((a) => a.body.job.poll as string);
    const statuses = await Promise.all(jobs.map(async (poll, i) => (await (i < 2 ? flooder : teammate).client.get(poll)).body.status));
    expect(statuses.filter((s) => s === "queued").length, statuses.join(", ")).toBeGreaterThanOrEqual(1);
  }, 60_000);
});
