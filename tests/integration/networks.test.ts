import { teamMembers } from "../../server/db/schema.js";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { followerCircuit, signedInPerson, type Person } from "../support/fixtures.js";
import { startTestServer, type TestServer } from "../support/server.js";

describe("networks of a team", () => {
  let server: TestServer;
  let editor: Person;
  let teamId: string;
  beforeAll(async () => {
    server = await startTestServer();
    editor = await signedInPerson(server, "networker");
    teamId = (await editor.client.post("/api/teams", { name: "Sensor bench" })).body.id;
  });
  afterAll(async () => {
    await server.close();
  });

  it("creates a network with a permanent slug and reads it back by id and by slug", async () => {
    const created = await editor.client.post(`/api/teams/${teamId}/networks`, { title: "Strain-gauge buffer", circuit: followerCircuit, description: "Follower behind the bridge" });
    expect(created.status).toBe(201);
    expect(created.body).toMatchObject({ teamId, title: "Strain-gauge buffer", port: { plus: "out", minus: "0" }, role: "owner", latestRevision: null });
    expect(created.body.slug).toMatch(/^strain-gauge-buffer-[0-9a-f]{6}$/);
    expect(created.body.author).toEqual({ id: editor.user.id, name: editor.user.name });
    const byId = await editor.client.get(`/api/networks/${created.body.id}`);
    expect(byId.body.circuit).toEqual(followerCircuit);
    const bySlug = await editor.client.get(`/api/networks/by-slug/${created.body.slug}`);
    expect(bySlug.status).toBe(200);
    expect(bySlug.body.id).toBe(created.body.id);
    // The slug is permanent: a new title does not move the link.
    const renamed = await editor.client.patch(`/api/networks/${created.body.id}`, { title: "Buffer, second look" });
    expect(renamed.body.slug).toBe(created.body.slug);
  });

  it("refuses a circuit that is not in the engine's format, naming what is wrong", async () => {
    const response = await editor.client.post(`/api/teams/${teamId}/networks`, {
      title: "Broken",
      circuit: { port: { plus: "out", minus: "0" }, elements: [{ name: "Gauge", kind: "resistr", nodes: ["out", "0"], value: "R" }] },
    });
    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe("invalid_circuit");
    expect(response.body.error.diagnostics[0]).toMatchObject({ code: "schema-invalid", path: ["elements", 0, "kind"] });
    const notObject = await editor.client.post(`/api/teams/${teamId}/networks`, { title: "Text", circuit: "Gauge resistor a b = Rg" });
    expect(notObject.status).toBe(400);
    expect(notObject.body.error.fields.circuit).toBeDefined();
  });

  it("refuses an edit made from a stale copy (409) and accepts one from the current copy", async () => {
    const created = await editor.client.post(`/api/teams/${teamId}/networks`, { title: "Line driver", circuit: followerCircuit });
    const first = await editor.client.patch(`/api/networks/${created.body.id}`, { description: "v2", expectedUpdatedAt: created.body.updatedAt });
    expect(first.status).toBe(200);
    const stale = await editor.client.patch(`/api/networks/${created.body.id}`, { description: "v3", expectedUpdatedAt: created.body.updatedAt });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe("stale");
    const current = await editor.client.patch(`/api/networks/${created.body.id}`, { description: "v3", expectedUpdatedAt: first.body.updatedAt });
    expect(current.status).toBe(200);
    expect((await editor.client.patch(`/api/networks/${created.body.id}`, {})).status).toBe(400);
  });

  it("lists a team's networks searched, sorted and paged on the server", async () => {
    const team = (await editor.client.post("/api/teams", { name: "Paging lab" })).body.id;
    for (const title of ["Charlie bridge", "alpha follower", "Bravo driver", "Delta bridge"]) {
      await editor.client.post(`/api/teams/${team}/networks`, { title, circuit: followerCircuit });
    }
    const byTitle = await editor.client.get(`/api/teams/${team}/networks?sort=title&order=asc&pageSize=3`);
    expect(byTitle.status).toBe(200);
    expect(byTitle.body.networks.map((n: { title: string }) => n.title)).toEqual(["alpha follower", "Bravo driver", "Charlie bridge"]);
    expect(byTitle.body).toMatchObject({ total: 4, page: 1, pageSize: 3 });
    const second = await editor.client.get(`/api/teams/${team}/networks?sort=title&order=asc&pageSize=3&page=2`);
    expect(second.body.networks.map((n: { title: string }) => n.title)).toEqual(["Delta bridge"]);
    const search = await editor.client.get(`/api/teams/${team}/networks?q=BRIDGE&sort=title&order=desc`);
    expect(search.body.networks.map((n: { title: string }) => n.title)).toEqual(["Delta bridge", "Charlie bridge"]);
    // A search for the LIKE wildcard itself matches only a literal percent sign.
    expect((await editor.client.get(`/api/teams/${team}/networks?q=%25`)).body.total).toBe(0);
    const solvedId = byTitle.body.networks[1].id;
    await editor.client.post(`/api/networks/${solvedId}/solve`);
    // Approved by a reviewer of the team: the one who solved it cannot approve it.
    const reviewer = await signedInPerson(server, "approver");
    await server.db.insert(teamMembers).values({ teamId: team, userId: reviewer.user.id, role: "reviewer" });
    expect((await reviewer.client.put(`/api/networks/${solvedId}/revisions/1/verdict`, { verdict: "approved" })).status).toBe(200);
    const byRevision = await editor.client.get(`/api/teams/${team}/networks?sort=lastRevision&order=desc`);
    expect(byRevision.body.networks[0]).toMatchObject({ id: solvedId, latestRevision: 1, verdict: "approved" });
    expect(byRevision.body.networks.slice(1).every((n: { latestRevision: null; verdict: null }) => n.latestRevision === null && n.verdict === null)).toBe(true);
    expect((await editor.client.get(`/api/teams/${team}/networks?sort=verdict&order=asc`)).body.networks[0].id).toBe(solvedId);
    expect((await editor.client.get(`/api/teams/${team}/networks?sort=author`)).body.total).toBe(4);
    expect((await editor.client.get(`/api/teams/${team}/networks?sort=colour`)).status).toBe(400);
    expect((await editor.client.get(`/api/teams/${team}/networks?pageSize=1000`)).status).toBe(400);
  });

  it("duplicates and deletes networks", async () => {
    const created = await editor.client.post(`/api/teams/${teamId}/networks`, { title: "Bridge", circuit: followerCircuit });
    const copy = await editor.client.post(`/api/networks/${created.body.id}/duplicate`);
    expect(copy.status).toBe(201);
    expect(copy.body.title).toBe("Bridge (copy)");
    expect(copy.body.slug).not.toBe(created.body.slug);
    expect(copy.body.circuit).toEqual(created.body.circuit);
    expect((await editor.client.delete(`/api/networks/${created.body.id}`)).status).toBe(204);
    expect((await editor.client.get(`/api/networks/${created.body.id}`)).status).toBe(404);
    expect((await editor.client.get(`/api/networks/${copy.body.id}`)).status).toBe(200);
  });

  it("answers ids that cannot exist with 404, not a database error", async () => {
    expect((await editor.client.get("/api/networks/not-a-uuid")).status).toBe(404);
    expect((await editor.client.get("/api/networks/00000000-0000-4000-8000-000000000000")).status).toBe(404);
    expect((await editor.client.get("/api/teams/12/networks")).status).toBe(404);
    expect((await editor.client.get("/api/networks/by-slug/NOT_A_SLUG")).status).toBe(404);
  });
});
