import { createHash } from "node:crypto";
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { shareLinks, teamMembers } from "../../server/db/schema.js";
import { ApiClient } from "../support/api.js";
import { evaluateInfix } from "../support/expressions.js";
import { followerCircuit, signedInPerson, type Person } from "../support/fixtures.js";
import { waitForMail } from "../support/mail.js";
import { clientShellDir, startTestServer, type TestServer } from "../support/server.js";

describe("design review and share links", () => {
  let server: TestServer;
  let author: Person;
  let reviewer: Person;
  let network: { id: string; slug: string };
  let stepIds: string[];
  beforeAll(async () => {
    server = await startTestServer({ clientDir: clientShellDir() });
    [author, reviewer] = await Promise.all([signedInPerson(server, "author"), signedInPerson(server, "reviewer")]);
    const team = (await author.client.post("/api/teams", { name: "Review lab" })).body.id;
    await server.db.insert(teamMembers).values({ teamId: team, userId: reviewer.user.id, role: "reviewer" });
    network = (await author.client.post(`/api/teams/${team}/networks`, { title: `Buffer <b>"quoted"</b> & co`, circuit: followerCircuit })).body;
    stepIds = (await author.client.post(`/api/networks/${network.id}/solve`)).body.steps.map((s: { id: string }) => s.id);
  });
  afterAll(async () => {
    await server.close();
  });

  const revisionPath = () => `/api/networks/${network.id}/revisions/1`;

  it("anchors comments to steps with one level of replies, and mails the author", async () => {
    const since = new Date();
    const first = await reviewer.client.post(`${revisionPath()}/comments`, { stepId: stepIds[2], body: "Is the gain A open-loop here?" });
    expect(first.status).toBe(201);
    expect(first.body).toMatchObject({ stepId: stepIds[2], parentId: null, author: { id: reviewer.user.id }, body: "Is the gain A open-loop here?" });
    const mail = await waitForMail(server.db, author.user.email, { since, subject: /New comment/ });
    expect(mail.text).toContain("Is the gain A open-loop here?");
    expect(mail.text).toContain(`/n/${network.slug}/r/1`);

    const reply = await author.client.post(`${revisionPath()}/comments`, { stepId: stepIds[2], body: "Yes, open-loop.", parentId: first.body.id });
    expect(reply.status).toBe(201);
    const nested = await reviewer.client.post(`${revisionPath()}/comments`, { stepId: stepIds[2], body: "Thanks.", parentId: reply.body.id });
    expect(nested.body.parentId).toBe(first.body.id);
    const wrongStep = await reviewer.client.post(`${revisionPath()}/comments`, { stepId: stepIds[3], body: "x", parentId: first.body.id });
    expect(wrongStep.status).toBe(400);
    const noStep = await reviewer.client.post(`${revisionPath()}/comments`, { stepId: "no-such-step", body: "x" });
    expect(noStep.status).toBe(400);
    expect(noStep.body.error.fields.stepId).toBeDefined();

    const threads = await author.client.get(`${revisionPath()}/comments`);
    expect(threads.body.comments).toHaveLength(1);
    expect(threads.body.comments[0].replies.map((r: { body: string }) => r.body)).toEqual(["Yes, open-loop.", "Thanks."]);
  });

  it("lets people edit and delete their own comments only", async () => {
    const comment = (await reviewer.client.post(`${revisionPath()}/comments`, { stepId: stepIds[1], body: "Typo in the title" })).body;
    const foreignEdit = await author.client.patch(`${revisionPath()}/comments/${comment.id}`, { body: "rewritten" });
    expect(foreignEdit.status).toBe(403);
    const edit = await reviewer.client.patch(`${revisionPath()}/comments/${comment.id}`, { body: "Typo in the step title" });
    expect(edit.status).toBe(200);
    expect(edit.body.body).toBe("Typo in the step title");
    expect((await reviewer.client.delete(`${revisionPath()}/comments/${comment.id}`)).status).toBe(204);
    const after = (await reviewer.client.get(`${revisionPath()}/comments`)).body.comments.find((c: { id: string }) => c.id === comment.id);
    expect(after).toMatchObject({ deleted: true, body: "", author: null });
    expect((await reviewer.client.patch(`${revisionPath()}/comments/${comment.id}`, { body: "again" })).status).toBe(404);
  });

  it("records a verdict per revision through the original route and mails the author", async () => {
    const since = new Date();
    const verdict = await reviewer.client.put(`${revisionPath()}/verdict`, { verdict: "needs_changes", note: "State the reference node." });
    expect(verdict.status).toBe(200);
    expect(verdict.body).toMatchObject({ verdict: "needs_changes", by: { id: reviewer.user.id } });
    const mail = await waitForMail(server.db, author.user.email, { since, subject: /needs changes/ });
    expect(mail.subject).toContain("Revision 1");
    expect(mail.text).toContain("State the reference node.");
    expect((await author.client.get(revisionPath())).body.verdict.verdict).toBe("needs_changes");
    await reviewer.client.put(`${revisionPath()}/verdict`, { verdict: "approved" });
    expect((await author.client.get(revisionPath())).body.verdict.verdict).toBe("approved");
    // "open" withdraws the caller's own standing verdict.
    expect((await reviewer.client.put(`${revisionPath()}/verdict`, { verdict: "open" })).body.verdict).toBe("open");
    await reviewer.client.put(`${revisionPath()}/verdict`, { verdict: "approved" });
    expect((await reviewer.client.put(`${revisionPath()}/verdict`, { verdict: "maybe" })).status).toBe(400);
  });

  it("creates an unguessable share link, stores only its hash, and opens it without an account", async () => {
    const created = await author.client.post(`${revisionPath()}/share`, {});
    expect(created.status).toBe(201);
    const { token, url } = created.body;
    // 32 random bytes in base64url (RFC 4648 §5) are 43 characters: 256 bits, over the 128 asked for.
    expect(token).toMatch(/^[A-Za-z0-9_-]{43}$/);
    expect(Buffer.from(token, "base64url")).toHaveLength(32);
    expect(url).toBe(`${server.url}/s/${token}`);
    const [row] = await server.db.select().from(shareLinks).where(eq(shareLinks.id, created.body.id));
    expect(row.tokenHash).toBe(createHash("sha256").update(token).digest("hex"));
    expect(JSON.stringify(row)).not.toContain(token);

    const shared = await new ApiClient(server.url).get(`/api/share/${token}`);
    expect(shared.status).toBe(200);
    expect(shared.body.readOnly).toBe(true);
    // Rout = Ro/(1 + A) of the finite-gain follower (Sedra & Smith, Microelectronic Circuits; from memory).
    expect(evaluateInfix(shared.body.revision.results.rth.infix, { A: 9, Ro: 50 })).toBeCloseTo(5, 12);
    expect(shared.body.revision.steps.map((s: { id: string }) => s.id)).toEqual(stepIds);
    expect(JSON.stringify(shared.body)).not.toContain("open-loop");
    const listed = await author.client.get(`${revisionPath()}/share`);
    expect(listed.body.shares).toContainEqual(expect.objectContaining({ id: created.body.id, status: "active" }));
    expect(JSON.stringify(listed.body)).not.toContain(token);
  });

  it("serves the share page with link-preview meta tags, escaped, and a generic shell for a dead link", async () => {
    const { token } = (await author.client.post(`${revisionPath()}/share`, {})).body;
    const page = await fetch(`${server.url}/s/${token}`);
    expect(page.status).toBe(200);
    const html = await page.text();
    const escapedTitle = "Buffer &lt;b&gt;&quot;quoted&quot;&lt;/b&gt; &amp; co — revision 1 · Portfold";
    expect(html).toContain(`<title>${escapedTitle}</title>`);
    expect(html).toContain(`<meta property="og:title" content="${escapedTitle}" />`);
    const { results } = (await author.client.get(revisionPath())).body;
    const line = `Vth = ${results.vth.compact}, Rth = ${results.rth.compact}`;
    expect(html).toContain(`<meta property="og:description" content="${line}" />`);
    expect(html).toContain(`<meta name="description" content="${line}" />`);
    expect(html.match(/<meta name="description"/g)).toHaveLength(1);
    expect(html).not.toContain("<b>");
    expect(page.headers.get("cache-control")).toBe("no-store");

    expect((await author.client.delete(`/api/share/${token}`)).status).toBe(204);
    const dead = await fetch(`${server.url}/s/${token}`);
    expect(dead.status).toBe(404);
    const deadHtml = await dead.text();
    expect(deadHtml).toContain("<title>Shared derivation · Portfold</title>");
    expect(deadHtml).not.toContain("Vth =");
  });

  it("refuses revoked and expired share links", async () => {
    const revoked = (await author.client.post(`${revisionPath()}/share`, {})).body;
    expect((await new ApiClient(server.url).get(`/api/share/${revoked.token}`)).status).toBe(200);
    expect((await author.client.delete(`${revisionPath()}/share/${revoked.id}`)).status).toBe(204);
    const afterRevoke = await new ApiClient(server.url).get(`/api/share/${revoked.token}`);
    expect(afterRevoke.status).toBe(404);
    expect(afterRevoke.body.error.code).toBe("not_found");

    const soon = new Date(Date.now() + 60_000).toISOString();
    const expiring = (await author.client.post(`${revisionPath()}/share`, { expiresAt: soon })).body;
    expect(expiring.expiresAt).toBe(soon);
    expect((await new ApiClient(server.url).get(`/api/share/${expiring.token}`)).status).toBe(200);
    await server.db.update(shareLinks).set({ expiresAt: new Date(Date.now() - 1_000) }).where(eq(shareLinks.id, expiring.id));
    expect((await new ApiClient(server.url).get(`/api/share/${expiring.token}`)).status).toBe(404);
    const states = (await author.client.get(`${revisionPath()}/share`)).body.shares;
    expect(states.find((s: { id: string }) => s.id === revoked.id).status).toBe("revoked");
    expect(states.find((s: { id: string }) => s.id === expiring.id).status).toBe("expired");

    const past = await author.client.post(`${revisionPath()}/share`, { expiresAt: new Date(Date.now() - 60_000).toISOString() });
    expect(past.status).toBe(400);
    expect((await new ApiClient(server.url).get(`/api/share/${"x".repeat(43)}`)).status).toBe(404);
    expect((await new ApiClient(server.url).get("/api/share/short")).status).toBe(404);
  });
});
