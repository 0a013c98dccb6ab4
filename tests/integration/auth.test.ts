import { createHash } from "node:crypto";
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { emailTokens, sessions, users } from "../../server/db/schema.js";
import { ApiClient } from "../support/api.js";
import { uniqueEmail } from "../support/fixtures.js";
import { linkIn, mailCount, waitForMail, waitForMailQueue } from "../support/mail.js";
import { startTestServer, type TestServer } from "../support/server.js";

describe("sign-up, sign-in, sign-out and password reset", () => {
  let server: TestServer;
  beforeAll(async () => {
    server = await startTestServer();
  });
  afterAll(async () => {
    await server.close();
  });

  it("signs up with a session cookie that is HttpOnly and SameSite=Lax, without Secure in development", async () => {
    const client = new ApiClient(server.url);
    const email = uniqueEmail("signup");
    const response = await client.post("/api/auth/signup", { email, password: "a long enough secret", name: "Sam Signup" });
    expect(response.status).toBe(201);
    expect(response.body.user).toMatchObject({ email, name: "Sam Signup", emailVerified: false });
    // Session cookie attributes: OWASP Session Management Cheat Sheet (HttpOnly, SameSite, Secure) — common practice.
    const cookie = response.headers.getSetCookie().find((c) => c.startsWith("portfold_session="))!;
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect(cookie).not.toMatch(/Secure/i);
    const me = await client.get("/api/me");
    expect(me.status).toBe(200);
    expect(me.body.user.email).toBe(email);
    expect(me.body.teams).toEqual([expect.objectContaining({ role: "owner", personal: true })]);
  });

  // OWASP Session Management Cheat Sheet: at least 64 bits of entropy (we keep 128+); stored hashed like any bearer token — common practice.
  it("keeps only the SHA-256 of the session token in the database; the cookie holds the token", async () => {
    const client = new ApiClient(server.url);
    const email = uniqueEmail("session");
    await client.post("/api/auth/signup", { email, password: "a session secret", name: "Sid Session" });
    const token = client.cookie!.split("=")[1];
    // 128 bits at least: 22 base64url characters carry 132.
    expect(token).toMatch(/^[A-Za-z0-9_-]{22,}$/);
    const [user] = await server.db.select().from(users).where(eq(users.email, email));
    const rows = await server.db.select({ id: sessions.id }).from(sessions).where(eq(sessions.userId, user.id));
    expect(rows).toEqual([{ id: createHash("sha256").update(token).digest("hex") }]);
    // The stored id itself is no key: a cookie holding it opens nothing.
    const stolen = new ApiClient(server.url, { cookie: `portfold_session=${rows[0].id}` });
    expect((await stolen.get("/api/me")).status).toBe(401);
    expect((await client.get("/api/me")).status).toBe(200);
    expect((await client.post("/api/auth/logout")).status).toBe(204);
    expect(await server.db.select().from(sessions).where(eq(sessions.userId, user.id))).toEqual([]);
  });

  it("stores the password as argon2id with OWASP's minimum parameters, never in clear", async () => {
    const email = uniqueEmail("hash");
    await new ApiClient(server.url).post("/api/auth/signup", { email, password: "another good secret", name: "Hana Hash" });
    const [row] = await server.db.select().from(users).where(eq(users.email, email));
    // OWASP Password Storage Cheat Sheet: Argon2id, m = 19 MiB (19456 KiB), t = 2, p = 1; PHC string format.
    expect(row.passwordHash).toMatch(/^\$argon2id\$v=19\$m=19456,t=2,p=1\$/);
    expect(row.passwordHash).not.toContain("another good secret");
  });

  it("refuses a second account with the same address (409) and bad bodies with per-field messages (400)", async () => {
    const client = new ApiClient(server.url);
    const email = uniqueEmail("twice");
    expect((await client.post("/api/auth/signup", { email, password: "first secret!", name: "Twice" })).status).toBe(201);
    const again = await new ApiClient(server.url).post("/api/auth/signup", { email: email.toUpperCase(), password: "second secret", name: "Twice" });
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe("email_taken");
    const bad = await new ApiClient(server.url).post("/api/auth/signup", { email: "not-an-address", password: "short", name: "" });
    expect(bad.status).toBe(400);
    expect(bad.body.error.code).toBe("invalid_body");
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(["email", "name", "password"]);
    const notJson = await new ApiClient(server.url).request("POST", "/api/auth/signup", undefined, { "Content-Type": "application/json" });
    expect(notJson.status).toBe(400);
  });

  it("signs in with the right password only, and signs out", async () => {
    const email = uniqueEmail("login");
    await new ApiClient(server.url).post("/api/auth/signup", { email, password: "the right secret", name: "Lee Login" });
    const client = new ApiClient(server.url);
    const wrong = await client.post("/api/auth/login", { email, password: "the wrong secret" });
    expect(wrong.status).toBe(401);
    expect(wrong.body.error.code).toBe("invalid_credentials");
    const unknown = await client.post("/api/auth/login", { email: uniqueEmail("nobody"), password: "the right secret" });
    expect(unknown.status).toBe(401);
    expect(unknown.body.error.code).toBe("invalid_credentials");
    const right = await client.post("/api/auth/login", { email: email.toUpperCase(), password: "the right secret" });
    expect(right.status).toBe(200);
    expect((await client.get("/api/me")).status).toBe(200);
    const cookie = client.cookie;
    expect((await client.post("/api/auth/logout")).status).toBe(204);
    expect(client.cookie).toBeNull();
    // The old cookie is dead on the server too, not only forgotten by the browser.
    expect((await new ApiClient(server.url, { cookie }).get("/api/me")).status).toBe(401);
  });

  it("answers 401 with the one error shape without a session", async () => {
    const response = await new ApiClient(server.url).get("/api/me");
    expect(response.status).toBe(401);
    expect(response.body).toEqual({ error: { code: "unauthenticated", message: expect.any(String) } });
  });

  it("refuses state-changing requests from another origin or without one (CSRF), but not reads", async () => {
    const body = { email: uniqueEmail("csrf"), password: "whatever secret", name: "Cross Site" };
    const foreign = await new ApiClient(server.url, { origin: "https://evil.example" }).post("/api/auth/signup", body);
    expect(foreign.status).toBe(403);
    expect(foreign.body.error.code).toBe("origin_mismatch");
    const none = await new ApiClient(server.url, { origin: null }).post("/api/auth/signup", body);
    expect(none.status).toBe(403);
    const referer = await new ApiClient(server.url, { origin: null }).post("/api/auth/signup", body, { Referer: `${server.url}/sign-up` });
    expect(referer.status).toBe(201);
    expect((await new ApiClient(server.url, { origin: null }).get("/api/me")).status).toBe(401);
  });

  it("resets a password by a single-use e-mail link, signing out every old session", async () => {
    const email = uniqueEmail("reset");
    const owner = new ApiClient(server.url);
    await owner.post("/api/auth/signup", { email, password: "forgotten secret", name: "Riley Reset" });
    const since = new Date();
    const request = await new ApiClient(server.url).post("/api/auth/password-reset", { email });
    expect(request.status).toBe(202);
    const mail = await waitForMail(server.db, email, { since, subject: /Reset your Portfold password/ });
    const link = linkIn(mail, "/reset-password?token=");
    expect(link.origin).toBe(server.url);
    const token = link.searchParams.get("token")!;
    const fresh = new ApiClient(server.url);
    const confirm = await fresh.post("/api/auth/password-reset/confirm", { token, password: "remembered secret" });
    expect(confirm.status).toBe(200);
    expect(confirm.body.user.emailVerified).toBe(true);
    expect((await fresh.get("/api/me")).status).toBe(200);
    expect((await owner.get("/api/me")).status).toBe(401);
    const reused = await new ApiClient(server.url).post("/api/auth/password-reset/confirm", { token, password: "third secret!" });
    expect(reused.status).toBe(400);
    expect(reused.body.error.code).toBe("invalid_token");
    expect((await new ApiClient(server.url).post("/api/auth/login", { email, password: "forgotten secret" })).status).toBe(401);
    expect((await new ApiClient(server.url).post("/api/auth/login", { email, password: "remembered secret" })).status).toBe(200);
  });

  it("answers a reset request for an unknown address the same way, and sends nothing", async () => {
    const email = uniqueEmail("ghost");
    const response = await new ApiClient(server.url).post("/api/auth/password-reset", { email });
    expect(response.status).toBe(202);
    // Mail is queued: once the queue is empty, anything sent would be in the mailbox.
    await waitForMailQueue(server);
    expect(await mailCount(server.db, email)).toBe(0);
  });

  it("refuses an expired reset link", async () => {
    const email = uniqueEmail("late");
    await new ApiClient(server.url).post("/api/auth/signup", { email, password: "slow secret!", name: "Lou Late" });
    const since = new Date();
    await new ApiClient(server.url).post("/api/auth/password-reset", { email });
    const token = linkIn(await waitForMail(server.db, email, { since, subject: /Reset/ }), "/reset-password?token=").searchParams.get("token")!;
    const [user] = await server.db.select().from(users).where(eq(users.email, email));
    await server.db.update(emailTokens).set({ expiresAt: new Date(Date.now() - 1_000) }).where(eq(emailTokens.userId, user.id));
    const confirm = await new ApiClient(server.url).post("/api/auth/password-reset/confirm", { token, password: "new secret!!" });
    expect(confirm.status).toBe(400);
    expect(confirm.body.error.code).toBe("invalid_token");
  });
});

describe("in production", () => {
  let server: TestServer;
  beforeAll(async () => {
    server = await startTestServer({ settings: { production: true } });
  });
  afterAll(async () => {
    await server.close();
  });

  it("marks the session cookie Secure and hides the development mailbox", async () => {
    const response = await new ApiClient(server.url).post("/api/auth/signup", { email: uniqueEmail("prod"), password: "production secret", name: "Pat Prod" });
    expect(response.status).toBe(201);
    expect(response.headers.getSetCookie().find((c) => c.startsWith("portfold_session="))).toMatch(/;\s*Secure/i);
    expect((await fetch(`${server.url}/api/dev/mail`)).status).toBe(404);
    expect((await fetch(`${server.url}/dev/mailbox`)).status).toBe(404);
    expect((await fetch(`${server.url}/api/dev/mail-queue`)).status).toBe(404);
  });
});
