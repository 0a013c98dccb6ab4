import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { invitations } from "../../server/db/schema.js";
import { ApiClient } from "../support/api.js";
import { signedInPerson, uniqueEmail } from "../support/fixtures.js";
import { linkIn, mailCount, waitForMail, waitForMailQueue } from "../support/mail.js";
import { clientShellDir, startTestServer, type TestServer } from "../support/server.js";

describe("e-mail through the SMTP capture server", () => {
  let server: TestServer;
  beforeAll(async () => {
    server = await startTestServer({ clientDir: clientShellDir() });
  });
  afterAll(async () => {
    await server.close();
  });

  it("sends a verification mail on sign-up whose link confirms the address once", async () => {
    const email = uniqueEmail("verify");
    const client = new ApiClient(server.url);
    const since = new Date();
    expect((await client.post("/api/auth/signup", { email, password: "verify me please", name: "Vic Verify" })).status).toBe(201);
    const mail = await waitForMail(server.db, email, { since, subject: /Confirm your e-mail address/ });
    expect(mail.envelopeTo).toEqual([email]);
    expect(mail.html).toContain("/verify-email?token=");
    const link = linkIn(mail, "/verify-email?token=");
    expect(link.origin).toBe(server.url);
    // The link opens a page of the client (served by this server), which posts the token.
    const page = await fetch(link);
    expect(page.status).toBe(200);
    expect(page.headers.get("content-type")).toContain("text/html");
    const token = link.searchParams.get("token")!;
    const verified = await client.post("/api/auth/verify-email", { token });
    expect(verified.status).toBe(200);
    expect(verified.body.user.emailVerified).toBe(true);
    expect((await client.get("/api/me")).body.user.emailVerified).toBe(true);
    const again = await client.post("/api/auth/verify-email", { token });
    expect(again.status).toBe(400);
    expect(again.body.error.code).toBe("invalid_token");
  });

  it("sends a fresh verification link on request, and none once verified", async () => {
    const person = await signedInPerson(server, "resend", { verified: false });
    const since = new Date();
    const resend = await person.client.post("/api/auth/verify-email/resend");
    expect(resend.status).toBe(202);
    expect(resend.body.sent).toBe(true);
    const token = linkIn(await waitForMail(server.db, person.user.email, { since }), "/verify-email?token=").searchParams.get("token")!;
    expect((await person.client.post("/api/auth/verify-email", { token })).status).toBe(200);
    expect((await person.client.post("/api/auth/verify-email/resend")).body.sent).toBe(false);
  });

  it("sends an invitation whose link shows the team and, accepted once, joins it with the role", async () => {
    const owner = await signedInPerson(server, "inviter");
    const team = await owner.client.post("/api/teams", { name: "Bridge calibration" });
    expect(team.status).toBe(201);
    const invitee = uniqueEmail("invitee");
    const since = new Date();
    const invited = await owner.client.post(`/api/teams/${team.body.id}/invitations`, { email: invitee, role: "reviewer" });
    expect(invited.status).toBe(201);
    expect(invited.body).toMatchObject({ email: invitee, role: "reviewer" });
    const mail = await waitForMail(server.db, invitee, { since, subject: /invited you/ });
    expect(mail.text).toContain("Bridge calibration");
    const link = linkIn(mail, "/invitations/accept?token=");
    expect((await fetch(link)).status).toBe(200);
    const token = link.searchParams.get("token")!;

    const preview = await new ApiClient(server.url).get(`/api/invitations/${token}`);
    expect(preview.status).toBe(200);
    expect(preview.body).toMatchObject({ team: { id: team.body.id, name: "Bridge calibration" }, role: "reviewer", email: invitee });

    const newcomer = new ApiClient(server.url);
    expect((await newcomer.post(`/api/invitations/${token}/accept`)).status).toBe(401);
    const signupAt = new Date();
    await newcomer.post("/api/auth/signup", { email: invitee, password: "joining the lab", name: "Ivy Invitee" });
    // The invited address, but not confirmed yet: refused, saying which address to use.
    const early = await newcomer.post(`/api/invitations/${token}/accept`);
    expect(early.status).toBe(403);
    expect(early.body.error).toMatchObject({ code: "invitation_address", message: expect.stringContaining(invitee) });
    const verification = linkIn(await waitForMail(server.db, invitee, { since: signupAt, subject: /confirm/i }), "/verify-email?token=").searchParams.get("token")!;
    expect((await newcomer.post("/api/auth/verify-email", { token: verification })).status).toBe(200);
    const accepted = await newcomer.post(`/api/invitations/${token}/accept`);
    expect(accepted.status).toBe(200);
    expect(accepted.body.team).toMatchObject({ id: team.body.id, role: "reviewer" });
    const me = await newcomer.get("/api/me");
    expect(me.body.teams).toContainEqual(expect.objectContaining({ id: team.body.id, role: "reviewer", personal: false }));
    expect((await newcomer.post(`/api/invitations/${token}/accept`)).status).toBe(404);
    expect((await new ApiClient(server.url).get(`/api/invitations/${token}`)).status).toBe(404);

    const twice = await owner.client.post(`/api/teams/${team.body.id}/invitations`, { email: invitee, role: "viewer" });
    expect(twice.status).toBe(409);
    expect(twice.body.error.code).toBe("already_member");
  });

  it("refuses an expired invitation and invitations from an unconfirmed address", async () => {
    const owner = await signedInPerson(server, "expirer");
    const team = await owner.client.post("/api/teams", { name: "Line driver bench" });
    const invitee = uniqueEmail("late-invitee");
    const since = new Date();
    const invited = await owner.client.post(`/api/teams/${team.body.id}/invitations`, { email: invitee, role: "viewer" });
    const token = linkIn(await waitForMail(server.db, invitee, { since }), "/invitations/accept?token=").searchParams.get("token")!;
    await server.db.update(invitations).set({ expiresAt: new Date(Date.now() - 1_000) }).where(eq(invitations.id, invited.body.id));
    const joiner = await signedInPerson(server, "joiner");
    expect((await joiner.client.post(`/api/invitations/${token}/accept`)).status).toBe(404);

    const unconfirmed = await signedInPerson(server, "unconfirmed", { verified: false });
    const ownTeam = await unconfirmed.client.post("/api/teams", { name: "Unconfirmed lab" });
    const target = uniqueEmail("spam-target");
    const refused = await unconfirmed.client.post(`/api/teams/${ownTeam.body.id}/invitations`, { email: target, role: "viewer" });
    expect(refused.status).toBe(403);
    expect(refused.body.error.code).toBe("email_unverified");
    await waitForMailQueue(server);
    expect(await mailCount(server.db, target)).toBe(0);
  });

  it("lists captured mail as JSON and on a mailbox page that escapes what users typed", async () => {
    const email = uniqueEmail("markup");
    const since = new Date();
    await new ApiClient(server.url).post("/api/auth/signup", { email, password: "markup secret", name: `<img src=x onerror="alert(1)">` });
    const mail = await waitForMail(server.db, email, { since });
    expect(mail.html).not.toContain("<img src=x");
    expect(mail.html).toContain("&lt;img src=x");
    const json = await new ApiClient(server.url).get(`/api/dev/mail?to=${encodeURIComponent(email)}`);
    expect(json.status).toBe(200);
    expect(json.body.messages).toEqual([expect.objectContaining({ to: [email], subject: mail.subject })]);
    const page = await fetch(`${server.url}/dev/mailbox?to=${encodeURIComponent(email)}`);
    expect(page.headers.get("content-type")).toContain("text/html");
    const html = await page.text();
    expect(html).toContain("Confirm your e-mail address");
    expect(html).toContain("&lt;img src=x onerror=&quot;alert(1)&quot;&gt;");
    expect(html).not.toContain("<img src=x");
    expect(html).toMatch(/<a href="http:\/\/127\.0\.0\.1:\d+\/verify-email\?token=[A-Za-z0-9_-]{43}">/);
    // Styled by a stylesheet of our own origin, which the Content-Security-Policy allows, not inline.
    expect(html).not.toContain("<style");
    const css = await fetch(`${server.url}/dev/mailbox.css`);
    expect(css.headers.get("content-type")).toContain("text/css");
  });
});
