// The rules of a review sign-off, against the real database: who may decide, what a decision needs,
// how the state follows from the kept history, and who hears about it. The rules are common practice
// for design review sign-off (an author does not approve their own work; a rejection says why).
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { invitations, teamMembers } from "../../server/db/schema.js";
import { followerCircuit, signedInPerson, teamWithEveryRole, uniqueEmail, type Person, type TeamFixture } from "../support/fixtures.js";
import { formulaTerms } from "../../src/features/review/lib/formula-terms.js";
import { linkIn, mailCount, waitForMail, waitForMailQueue } from "../support/mail.js";
import { startTestServer, type TestServer } from "../support/server.js";

describe("review sign-off", () => {
  let server: TestServer;
  let team: TeamFixture;
  let second: Person;
  let author: Person;
  let networkId: string;
  let steps: { id: string; explanation: string; tex: string }[];
  const rev = (k = 1) => `/api/networks/${networkId}/revisions/${k}`;

  beforeAll(async () => {
    server = await startTestServer();
    team = await teamWithEveryRole(server);
    second = await signedInPerson(server, "second");
    await server.db.insert(teamMembers).values({ teamId: team.teamId, userId: second.user.id, role: "reviewer" });
    author = team.people.editor;
    networkId = (await author.client.post(`/api/teams/${team.teamId}/networks`, { title: "Bridge buffer", circuit: followerCircuit })).body.id;
    steps = (await author.client.post(`/api/networks/${networkId}/solve`)).body.steps;
  });
  afterAll(async () => {
    await server.close();
  });

  it("refuses the revision's author an approval (403 self_approval) and records nothing", async () => {
    const refused = await author.client.post(`${rev()}/verdicts`, { verdict: "approved" });
    expect(refused.status).toBe(403);
    expect(refused.body.error.code).toBe("self_approval");
    expect((await author.client.put(`${rev()}/verdict`, { verdict: "approved" })).body.error.code).toBe("self_approval");
    expect((await author.client.get(`${rev()}/verdicts`)).body.verdicts).toEqual([]);
  });

  it("wants a note with a change request", async () => {
    for (const body of [{ verdict: "needs_changes" }, { verdict: "needs_changes", note: "   " }]) {
      const refused = await team.clients.reviewer.post(`${rev()}/verdicts`, body);
      expect(refused.status).toBe(400);
      expect(refused.body.error).toMatchObject({ code: "note_required", fields: { note: expect.any(String) } });
    }
    expect((await team.clients.reviewer.put(`${rev()}/verdict`, { verdict: "needs_changes" })).status).toBe(400);
    expect((await author.client.get(`${rev()}/verdicts`)).body.verdicts).toEqual([]);
  });

  it("keeps every verdict, newest first, and derives the state; only the giver withdraws", async () => {
    const since = new Date();
    const asked = await team.clients.reviewer.post(`${rev()}/verdicts`, { verdict: "needs_changes", note: "Name the reference node." });
    expect(asked.status).toBe(201);
    expect(asked.body.state).toMatchObject({ verdict: "needs_changes", by: { id: team.people.reviewer.user.id } });
    const mail = await waitForMail(server.db, author.user.email, { since, subject: /needs changes/ });
    expect(mail.text).toContain("Name the reference node.");

    const approved = await second.client.post(`${rev()}/verdicts`, { verdict: "approved", note: "Fine by me." });
    // A standing change request outweighs an approval.
    expect(approved.body.state.verdict).toBe("needs_changes");

    expect((await second.client.post(`${rev()}/verdicts/${asked.body.verdict.id}/withdraw`)).status).toBe(403);
    const withdrawn = await team.clients.reviewer.post(`${rev()}/verdicts/${asked.body.verdict.id}/withdraw`);
    expect(withdrawn.status).toBe(201);
    expect(withdrawn.body.state).toMatchObject({ verdict: "approved", by: { id: second.user.id }, approvals: 1, requiredApprovals: 1 });
    expect((await team.clients.reviewer.post(`${rev()}/verdicts/${asked.body.verdict.id}/withdraw`)).body.error.code).toBe("verdict_not_standing");

    const history = (await team.clients.viewer.get(`${rev()}/verdicts`)).body;
    expect(history.verdicts.map((v: { verdict: string }) => v.verdict)).toEqual(["open", "approved", "needs_changes"]);
    const times = history.verdicts.map((v: { at: string }) => Date.parse(v.at));
    expect([...times].sort((a, b) => b - a)).toEqual(times);
    expect(history.verdicts[2]).toMatchObject({ role: "reviewer", note: "Name the reference node.", withdrawnAt: history.verdicts[0].at, by: { id: team.people.reviewer.user.id } });
    expect(history.verdicts[0]).toMatchObject({ withdraws: asked.body.verdict.id, revision: 1 });
    expect((await author.client.get(rev())).body.verdict.verdict).toBe("approved");
  });

  it("counts the team's required approvals, set by an owner only", async () => {
    expect((await author.client.patch(`/api/teams/${team.teamId}`, { requiredApprovals: 2 })).status).toBe(403);
    expect((await team.clients.owner.patch(`/api/teams/${team.teamId}`, { requiredApprovals: 0 })).status).toBe(400);
    const set = await team.clients.owner.patch(`/api/teams/${team.teamId}`, { requiredApprovals: 2 });
    expect(set.body).toMatchObject({ requiredApprovals: 2 });
    // One approval of two: the same history now reads open.
    expect((await author.client.get(rev())).body.verdict).toMatchObject({ verdict: "open", approvals: 1, requiredApprovals: 2 });
    expect((await author.client.get(`/api/teams/${team.teamId}/networks`)).body.networks[0].verdict).toBe("open");
    const both = await team.clients.reviewer.post(`${rev()}/verdicts`, { verdict: "approved" });
    expect(both.body.state).toMatchObject({ verdict: "approved", approvals: 2, by: { id: team.people.reviewer.user.id } });
    expect((await author.client.get(`/api/teams/${team.teamId}/networks`)).body.networks[0].verdict).toBe("approved");
    expect((await author.client.get(`/api/networks/${networkId}/revisions`)).body.revisions[0].verdict.verdict).toBe("approved");
  });

  it("starts a newer revision open, naming the approved one", async () => {
    await author.client.patch(`/api/networks/${networkId}`, { description: "second pass" });
    const newer = await author.client.post(`/api/networks/${networkId}/solve`);
    expect(newer.body.number).toBe(2);
    const read = (await team.clients.reviewer.get(rev(2))).body;
    expect(read.verdict.verdict).toBe("open");
    expect(read.approvedBefore).toMatchObject({ number: 1, by: { id: team.people.reviewer.user.id } });
    expect((await team.clients.reviewer.get(rev(1))).body.approvedBefore).toBeNull();
  });

  it("anchors a note to a highlighted part of its step", async () => {
    const step = steps.find((s) => s.explanation.length > 12)!;
    const text = step.explanation.slice(2, 12);
    const made = await team.clients.reviewer.post(`${rev(2)}/comments`, { stepId: step.id, body: "This phrase?", anchor: { part: "explanation", text } });
    expect(made.status).toBe(201);
    expect(made.body.anchor).toEqual({ part: "explanation", text, start: step.explanation.indexOf(text) });
    const wrong = await team.clients.reviewer.post(`${rev(2)}/comments`, { stepId: step.id, body: "This term?", anchor: { part: "formula", text: "not in any formula" } });
    expect(wrong.body.error.code).toBe("unknown_anchor");
    // The terms the client offers for a step's formula are what the server accepts.
    const withTerms = steps.find((s) => formulaTerms(s.tex).length > 1)!;
    const term = formulaTerms(withTerms.tex)[1];
    const onTerm = await team.clients.reviewer.post(`${rev(2)}/comments`, { stepId: withTerms.id, body: "This term?", anchor: { part: "formula", text: term } });
    expect(onTerm.body.anchor).toEqual({ part: "formula", text: term, start: withTerms.tex.indexOf(term) });
  });

  it("resolves and reopens threads by their author, the revision's author or an owner, and counts open ones", async () => {
    const open = async () => (await author.client.get(rev(1))).body.openNotes as number;
    const before = await open();
    const thread = (await second.client.post(`${rev(1)}/comments`, { stepId: steps[0].id, body: "Is the port the right way round?" })).body;
    const reply = (await author.client.post(`${rev(1)}/comments`, { stepId: steps[0].id, body: "Yes.", parentId: thread.id })).body;
    expect(await open()).toBe(before + 1);

    expect((await team.clients.reviewer.post(`${rev(1)}/comments/${thread.id}/resolve`)).status).toBe(403);
    expect((await author.client.post(`${rev(1)}/comments/${reply.id}/resolve`)).body.error.code).toBe("not_a_thread");
    const resolved = await author.client.post(`${rev(1)}/comments/${thread.id}/resolve`);
    expect(resolved.body.resolved).toMatchObject({ by: { id: author.user.id } });
    expect(await open()).toBe(before);
    expect((await second.client.post(`${rev(1)}/comments/${thread.id}/resolve`)).body.error.code).toBe("already_resolved");

    const reopened = await second.client.post(`${rev(1)}/comments/${thread.id}/reopen`);
    expect(reopened.body).toMatchObject({ resolved: null, reopened: { by: { id: second.user.id } } });
    expect(await open()).toBe(before + 1);
    expect((await team.clients.owner.post(`${rev(1)}/comments/${thread.id}/resolve`)).status).toBe(200);
    const listed = (await team.clients.viewer.get(`${rev(1)}/comments`)).body.comments.find((c: { id: string }) => c.id === thread.id);
    expect(listed).toMatchObject({ resolved: { by: { id: team.people.owner.user.id } }, reopened: { by: { id: second.user.id } } });
  });

  it("mails a reply to everyone in the thread but the one replying, and not to those who turned review mail off", async () => {
    const thread = (await team.clients.reviewer.post(`${rev(1)}/comments`, { stepId: steps[1].id, body: "Where does Ro come from?" })).body;
    await second.client.post(`${rev(1)}/comments`, { stepId: steps[1].id, body: "The amplifier's data sheet.", parentId: thread.id });
    expect((await team.clients.owner.patch("/api/me/settings", { reviewMail: false })).body).toEqual({ settings: { reviewMail: false } });
    expect((await team.clients.owner.get("/api/me")).body.settings).toEqual({ reviewMail: false });
    await team.clients.owner.post(`${rev(1)}/comments`, { stepId: steps[1].id, body: "Owner was here.", parentId: thread.id });

    const counts = async () => Object.fromEntries(await Promise.all([team.people.reviewer, second, author, team.people.owner, team.people.viewer].map(async (p) => [p.user.id, await mailCount(server.db, p.user.email)])));
    // Mail is queued: the earlier replies' mails are delivered before counting.
    await waitForMailQueue(server);
    const before = await counts();
    const since = new Date();
    await author.client.post(`${rev(1)}/comments`, { stepId: steps[1].id, body: "Typical value, 75 ohm.", parentId: thread.id });
    for (const person of [team.people.reviewer, second]) {
      const mail = await waitForMail(server.db, person.user.email, { since, subject: /New reply/ });
      expect(mail.text).toContain("Typical value, 75 ohm.");
    }
    await waitForMailQueue(server);
    const after = await counts();
    expect(after[team.people.reviewer.user.id]).toBe(before[team.people.reviewer.user.id] + 1);
    expect(after[second.user.id]).toBe(before[second.user.id] + 1);
    // The replier, the owner who opted out and the viewer outside the thread hear nothing.
    expect(after[author.user.id]).toBe(before[author.user.id]);
    expect(after[team.people.owner.user.id]).toBe(before[team.people.owner.user.id]);
    expect(after[team.people.viewer.user.id]).toBe(before[team.people.viewer.user.id]);
  });

  it("lists what awaits my review and my revisions in review, with paging", async () => {
    const awaiting = (await team.clients.reviewer.get("/api/reviews/awaiting?pageSize=50")).body;
    const item = awaiting.items.find((i: { network: { id: string } }) => i.network.id === networkId);
    expect(item).toMatchObject({ revision: 2, author: { id: author.user.id }, state: { verdict: "open" }, openNotes: 2 });
    // The author and a viewer do not review it.
    expect((await author.client.get("/api/reviews/awaiting")).body.items.some((i: { network: { id: string } }) => i.network.id === networkId)).toBe(false);
    expect((await team.clients.viewer.get("/api/reviews/awaiting")).body.total).toBe(0);
    const mine = (await author.client.get("/api/reviews/mine?page=1&pageSize=1")).body;
    expect(mine).toMatchObject({ total: 1, page: 1, pageSize: 1, items: [{ revision: 2, network: { id: networkId } }] });
    expect((await author.client.get("/api/reviews/mine?page=2&pageSize=1")).body.items).toEqual([]);
    // Given a verdict, it no longer waits for me.
    await team.clients.reviewer.post(`${rev(2)}/verdicts`, { verdict: "approved" });
    expect((await team.clients.reviewer.get("/api/reviews/awaiting?pageSize=50")).body.items.some((i: { network: { id: string } }) => i.network.id === networkId)).toBe(false);
    expect((await team.clients.owner.get("/api/reviews/awaiting?pageSize=50")).body.items.some((i: { network: { id: string } }) => i.network.id === networkId)).toBe(true);
    expect((await author.client.get("/api/reviews/awaiting?pageSize=0")).status).toBe(400);
  });
});

describe("who may join", () => {
  let server: TestServer;
  beforeAll(async () => {
    server = await startTestServer();
  });
  afterAll(async () => {
    await server.close();
  });

  async function invite(owner: Person, teamId: string, email: string, role = "editor") {
    const since = new Date();
    const created = await owner.client.post(`/api/teams/${teamId}/invitations`, { email, role });
    const token = linkIn(await waitForMail(server.db, email, { since }), "/invitations/accept?token=").searchParams.get("token")!;
    return { created, token };
  }

  it("binds an invitation to the invited address, confirmed", async () => {
    const [owner, stranger] = await Promise.all([signedInPerson(server, "inviter"), signedInPerson(server, "stranger")]);
    const teamId = (await owner.client.post("/api/teams", { name: "Line driver lab" })).body.id;
    const invited = await signedInPerson(server, "invitee", { verified: false });
    const { token } = await invite(owner, teamId, invited.user.email);

    const wrong = await stranger.client.post(`/api/invitations/${token}/accept`);
    expect(wrong.status).toBe(403);
    expect(wrong.body.error.code).toBe("invitation_address");
    expect(wrong.body.error.message).toContain(invited.user.email);
    const unconfirmed = await invited.client.post(`/api/invitations/${token}/accept`);
    expect(unconfirmed.body.error.code).toBe("invitation_address");
    // Refused twice, still pending.
    const [row] = await server.db.select().from(invitations).where(eq(invitations.email, invited.user.email));
    expect(row.acceptedAt).toBeNull();

    const confirmed = await signedInPerson(server, "confirmed");
    const second = await invite(owner, teamId, confirmed.user.email);
    expect((await confirmed.client.post(`/api/invitations/${second.token}/accept`)).body.team).toMatchObject({ id: teamId, role: "editor" });
  });

  it("warns the inviter of an owner invitation", async () => {
    const owner = await signedInPerson(server, "warned");
    const teamId = (await owner.client.post("/api/teams", { name: "Audio driver lab" })).body.id;
    const asOwner = await owner.client.post(`/api/teams/${teamId}/invitations`, { email: uniqueEmail("co-owner"), role: "owner" });
    expect(asOwner.body.warning).toMatch(/owner can/i);
    expect((await owner.client.post(`/api/teams/${teamId}/invitations`, { email: uniqueEmail("editor"), role: "editor" })).body.warning).toBeUndefined();
  });

  it("keeps a personal team its holder's: not left, not given away, no other owner", async () => {
    const holder = await signedInPerson(server, "holder");
    const personal = (await holder.client.get("/api/me")).body.teams.find((t: { personal: boolean }) => t.personal).id;
    const guest = await signedInPerson(server, "guest");
    await server.db.insert(teamMembers).values({ teamId: personal, userId: guest.user.id, role: "editor" });

    const codes = async (request: Promise<{ status: number; body: { error?: { code: string } } }>) => {
      const response = await request;
      return [response.status, response.body.error?.code];
    };
    expect(await codes(holder.client.delete(`/api/teams/${personal}/members/${holder.user.id}`))).toEqual([409, "personal_team"]);
    expect(await codes(holder.client.patch(`/api/teams/${personal}/members/${holder.user.id}`, { role: "editor" }))).toEqual([409, "personal_team"]);
    expect(await codes(holder.client.patch(`/api/teams/${personal}/members/${guest.user.id}`, { role: "owner" }))).toEqual([409, "personal_team"]);
    expect(await codes(holder.client.post(`/api/teams/${personal}/invitations`, { email: uniqueEmail("heir"), role: "owner" }))).toEqual([409, "personal_team"]);
    const roles = (await holder.client.get(`/api/teams/${personal}/members`)).body.members.map((m: { role: string }) => m.role).sort();
    expect(roles).toEqual(["editor", "owner"]);
    // Other roles are fine, and a guest may leave.
    expect((await holder.client.patch(`/api/teams/${personal}/members/${guest.user.id}`, { role: "reviewer" })).status).toBe(200);
    expect((await guest.client.delete(`/api/teams/${personal}/members/${guest.user.id}`)).status).toBe(204);
  });
});
