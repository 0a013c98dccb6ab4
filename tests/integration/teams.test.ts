import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { and, count, eq } from "drizzle-orm";
import { teamMembers } from "../../server/db/schema.js";
import { signedInPerson, teamWithEveryRole, uniqueEmail } from "../support/fixtures.js";
import { startTestServer, type TestServer } from "../support/server.js";

describe("teams, members and roles", () => {
  let server: TestServer;
  beforeAll(async () => {
    server = await startTestServer();
  });
  afterAll(async () => {
    await server.close();
  });

  it("creates a team with its creator as owner, lists members, renames it", async () => {
    const founder = await signedInPerson(server, "founder");
    const created = await founder.client.post("/api/teams", { name: "  Audio line driver  " });
    expect(created.status).toBe(201);
    expect(created.body).toMatchObject({ name: "Audio line driver", role: "owner", personal: false });
    const members = await founder.client.get(`/api/teams/${created.body.id}/members`);
    expect(members.body.members).toEqual([{ userId: founder.user.id, name: founder.user.name, email: founder.user.email, role: "owner" }]);
    const renamed = await founder.client.patch(`/api/teams/${created.body.id}`, { name: "Line driver bench" });
    expect(renamed.body.name).toBe("Line driver bench");
    expect((await founder.client.post("/api/teams", { name: "" })).status).toBe(400);
  });

  it("changes roles, keeps at least one owner, lets members leave and owners remove them", async () => {
    const { teamId, people } = await teamWithEveryRole(server);
    const owner = people.owner.client;
    const promoted = await owner.patch(`/api/teams/${teamId}/members/${people.viewer.user.id}`, { role: "editor" });
    expect(promoted.status).toBe(200);
    expect(promoted.body.members.find((m: { userId: string }) => m.userId === people.viewer.user.id).role).toBe("editor");
    const demoteLast = await owner.patch(`/api/teams/${teamId}/members/${people.owner.user.id}`, { role: "editor" });
    expect(demoteLast.status).toBe(409);
    expect(demoteLast.body.error.code).toBe("last_owner");
    expect((await owner.delete(`/api/teams/${teamId}/members/${people.owner.user.id}`)).status).toBe(409);
    expect((await owner.patch(`/api/teams/${teamId}/members/${people.nonMember.user.id}`, { role: "viewer" })).status).toBe(404);
    expect((await owner.patch(`/api/teams/${teamId}/members/${people.viewer.user.id}`, { role: "admin" })).status).toBe(400);
    // Leaving is one's own decision; removing others is the owner's.
    expect((await people.reviewer.client.delete(`/api/teams/${teamId}/members/${people.editor.user.id}`)).status).toBe(403);
    expect((await people.reviewer.client.delete(`/api/teams/${teamId}/members/${people.reviewer.user.id}`)).status).toBe(204);
    expect((await people.reviewer.client.get(`/api/teams/${teamId}`)).status).toBe(404);
    expect((await owner.delete(`/api/teams/${teamId}/members/${people.editor.user.id}`)).status).toBe(204);
    const left = (await owner.get(`/api/teams/${teamId}/members`)).body.members.map((m: { userId: string }) => m.userId).sort();
    expect(left).toEqual([people.owner.user.id, people.viewer.user.id].sort());
  });

  it("lists and withdraws pending invitations", async () => {
    const owner = await signedInPerson(server, "host");
    const team = (await owner.client.post("/api/teams", { name: "Invite list" })).body.id;
    const email = uniqueEmail("pending");
    const invitation = (await owner.client.post(`/api/teams/${team}/invitations`, { email, role: "editor" })).body;
    expect((await owner.client.get(`/api/teams/${team}/invitations`)).body.invitations).toEqual([expect.objectContaining({ id: invitation.id, email, role: "editor" })]);
    expect((await owner.client.delete(`/api/teams/${team}/invitations/${invitation.id}`)).status).toBe(204);
    expect((await owner.client.get(`/api/teams/${team}/invitations`)).body.invitations).toEqual([]);
    expect((await owner.client.delete(`/api/teams/${team}/invitations/${invitation.id}`)).status).toBe(404);
  });

  it("deletes a team with its networks, but never a personal team", async () => {
    const owner = await signedInPerson(server, "closer");
    const personal = (await owner.client.get("/api/me")).body.teams.find((t: { personal: boolean }) => t.personal);
    const refused = await owner.client.delete(`/api/teams/${personal.id}`);
    expect(refused.status).toBe(409);
    expect(refused.body.error.code).toBe("personal_team");
    const team = (await owner.client.post("/api/teams", { name: "Short-lived" })).body.id;
    const network = (await owner.client.post(`/api/teams/${team}/networks`, { title: "Gone soon", circuit: { port: { plus: "a", minus: "0" }, elements: [] } })).body.id;
    expect((await owner.client.delete(`/api/teams/${team}`)).status).toBe(204);
    expect((await owner.client.get(`/api/networks/${network}`)).status).toBe(404);
    expect((await owner.client.get("/api/me")).body.teams.map((t: { id: string }) => t.id)).not.toContain(team);
  });

  // Two owners acting on each other at the same moment, 20 times over: a team must never end with no owner.
  it("keeps an owner when two owners demote each other or both leave at once", async () => {
    const [first, second] = await Promise.all([signedInPerson(server, "racer"), signedInPerson(server, "rival")]);
    const owners = async (teamId: string) =>
      (await server.db.select({ n: count() }).from(teamMembers).where(and(eq(teamMembers.teamId, teamId), eq(teamMembers.role, "owner"))))[0].n;
    const outcomes: number[][] = [];
    for (let trial = 0; trial < 20; trial += 1) {
      const teamId = (await first.client.post("/api/teams", { name: `Race ${trial}` })).body.id;
      await server.db.insert(teamMembers).values({ teamId, userId: second.user.id, role: "owner" });
      const race =
        trial % 2 === 0
          ? [first.client.patch(`/api/teams/${teamId}/members/${second.user.id}`, { role: "editor" }), second.client.patch(`/api/teams/${teamId}/members/${first.user.id}`, { role: "editor" })]
          : [first.client.delete(`/api/teams/${teamId}/members/${first.user.id}`), second.client.delete(`/api/teams/${teamId}/members/${second.user.id}`)];
      const statuses = (await Promise.all(race)).map((r) => r.status).sort();
      outcomes.push(statuses);
      expect(await owners(teamId), `trial ${trial}: ${statuses.join(", ")}`).toBe(1);
    }
    // One side wins, the other is told why: 403 (no longer an owner), 404 (no longer a member) or 409 (last owner).
    for (const [a, b] of outcomes) {
      expect([200, 204]).toContain(a);
      expect([403, 404, 409]).toContain(b);
    }
  });
});
