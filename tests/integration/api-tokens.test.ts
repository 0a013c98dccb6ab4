// Personal API tokens against the real database: scope × every route, one team or all, revoked and expired,
// the hash at rest, no token making tokens, and no token from a browser form or another site.
import { createHash, randomUUID } from "node:crypto";
import { eq, sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createApp } from "../../server/app.js";
import { tokenRoutes } from "../../server/auth/api-tokens.js";
import { apiTokens } from "../../server/db/schema.js";
import { createTeam } from "../../server/domain/teams.js";
import { ApiClient } from "../support/api.js";
import { followerCircuit, teamWithEveryRole, type TeamFixture } from "../support/fixtures.js";
import { mountedRoutes } from "../support/routes.js";
import { clientShellDir, startTestServer, type TestServer } from "../support/server.js";

// A script: no cookie, no Origin, only the bearer header.
class TokenClient extends ApiClient {
  constructor(baseUrl: string, readonly secret: string) {
    super(baseUrl, { origin: null });
  }
  override request<T = any>(method: string, path: string, body?: unknown, headers: Record<string, string> = {}) {
    return super.request<T>(method, path, body, { Authorization: `Bearer ${this.secret}`, ...headers });
  }
}

interface World {
  server: TestServer;
  team: TeamFixture;
  otherTeamId: string;
  networkId: string;
  slug: string;
  jobId: string;
}

const world = {} as World;

async function tokenFor(client: ApiClient, scope: "read" | "solve", teamId: string | null, name = `script ${randomUUID().slice(0, 6)}`) {
  const created = await client.post("/api/account/tokens", { name, scope, teamId, expiresInDays: 30 });
  expect(created.status, JSON.stringify(created.body)).toBe(201);
  return { id: created.body.token.id as string, client: new TokenClient(world.server.url, created.body.secret as string), secret: created.body.secret as string };
}

// A concrete path and body for a mounted route; ids the fixture has where the route can use them.
function request(route: string): { path: string; body?: unknown } {
  const values: Record<string, string> = {
    teamId: world.team.teamId,
    networkId: world.networkId,
    slug: world.slug,
    number: "1",
    from: "1",
    to: "1",
    jobId: world.jobId,
    token: "A".repeat(43),
    userId: world.team.people.viewer.user.id,
  };
  const path = route.replace(/:([a-zA-Z]+)/g, (_, name: string) => values[name] ?? randomUUID());
  if (route === "/api/teams/:teamId/networks") return { path, body: { title: "Scripted", circuit: followerCircuit } };
  if (route === "/api/teams/:teamId/networks/import") {
    const form = new FormData();
    form.append("file", new Blob([JSON.stringify(followerCircuit)], { type: "application/json" }), "follower.json");
    return { path, body: form };
  }
  if (route === "/api/networks/:networkId") return { path, body: { description: "changed by a script" } };
  return { path, body: {} };
}

beforeAll(async () => {
  world.server = await startTestServer({ clientDir: clientShellDir() });
  world.team = await teamWithEveryRole(world.server);
  const owner = world.team.clients.owner;
  world.otherTeamId = (await createTeam(world.server.db, world.team.people.owner.user.id, "Second bench")).id;
  const network = (await owner.post(`/api/teams/${world.team.teamId}/networks`, { title: "Token follower", circuit: followerCircuit })).body;
  world.networkId = network.id;
  world.slug = network.slug;
  expect((await owner.post(`/api/networks/${network.id}/solve`)).status).toBe(201);
  world.jobId = (await owner.post(`/api/networks/${network.id}/solve?wait=0`)).body.job.id;
});
afterAll(async () => {
  await world.server.close();
});

describe("API tokens", () => {
  it("answers every API route by the token's scope: read reaches reads, solve adds storing and solving, nothing else", async () => {
    const read = await tokenFor(world.team.clients.owner, "read", null);
    const solve = await tokenFor(world.team.clients.owner, "solve", null);
    const app = createApp({ pool: world.server.pool, db: world.server.db, clientDir: clientShellDir(), settings: { logLevel: "silent" } });
    const routes = mountedRoutes(app).filter((entry) => entry.includes(" /api/") && !entry.includes("/api/health") && !entry.includes("/api/openapi.json") && !entry.includes("/api/dev/"));
    const allowed = new Map(tokenRoutes.map((entry) => [`${entry.method} /api${entry.route}`, entry.scope]));
    // The table names only routes that exist.
    for (const key of allowed.keys()) expect(routes, key).toContain(key);
    const rows: string[] = [];
    for (const entry of routes.sort()) {
      const [method, route] = entry.split(" ");
      const needed = allowed.get(entry);
      for (const [scope, token] of [["read", read], ["solve", solve]] as const) {
        const { path, body } = request(route);
        const response = await token.client.request(method, path, method === "GET" || method === "DELETE" ? undefined : body);
        const expected = needed === undefined ? "403 token_not_allowed" : needed === "solve" && scope === "read" ? "403 token_scope" : "2xx";
        const actual = response.status < 300 ? "2xx" : `${response.status} ${response.body?.error?.code}`;
        rows.push(`${scope} ${entry}: ${actual === expected ? "ok" : `${actual}, expected ${expected}`}`);
      }
    }
    expect(rows.filter((row) => !row.endsWith(": ok"))).toEqual([]);
  });

  it("keeps a one-team token to that team, and to the person's role there", async () => {
    const own = await tokenFor(world.team.clients.owner, "solve", world.team.teamId);
    expect((await own.client.get(`/api/teams/${world.team.teamId}/networks`)).status).toBe(200);
    expect((await own.client.get(`/api/networks/${world.networkId}/revisions/1`)).status).toBe(200);
    expect((await own.client.get(`/api/networks/by-slug/${world.slug}`)).status).toBe(200);
    // The person's other team reads as absent.
    const other = await own.client.get(`/api/teams/${world.otherTeamId}/networks`);
    expect([other.status, other.body.error.code]).toEqual([404, "not_found"]);
    const elsewhere = (await world.team.clients.owner.post(`/api/teams/${world.otherTeamId}/networks`, { title: "Elsewhere", circuit: followerCircuit })).body;
    expect((await own.client.get(`/api/networks/${elsewhere.id}`)).status).toBe(404);
    expect((await own.client.post(`/api/networks/${elsewhere.id}/solve`)).status).toBe(404);
    // What the token tells a script: only that team.
    const current = (await own.client.get("/api/account/tokens/current")).body;
    expect(current.teams.map((t: { id: string }) => t.id)).toEqual([world.team.teamId]);
    expect(current.token.team.id).toBe(world.team.teamId);
    // A viewer's solve-scope token still has a viewer's rights.
    const viewer = await tokenFor(world.team.clients.viewer, "solve", null);
    const refused = await viewer.client.post(`/api/teams/${world.team.teamId}/networks`, { title: "Not mine to add", circuit: followerCircuit });
    expect([refused.status, refused.body.error.code]).toEqual([403, "forbidden"]);
    // A token for a team the person is not in is never made.
    const outsider = await world.team.clients.nonMember.post("/api/account/tokens", { name: "intruder", scope: "read", teamId: world.team.teamId, expiresInDays: 1 });
    expect(outsider.status).toBe(404);
  });

  it("refuses revoked, expired and unknown tokens alike, and records when a token was last used", async () => {
    const token = await tokenFor(world.team.clients.editor, "read", null);
    expect((await token.client.get(`/api/networks/${world.networkId}`)).status).toBe(200);
    const listed = (await world.team.clients.editor.get("/api/account/tokens")).body.tokens.find((t: { id: string }) => t.id === token.id);
    expect(listed.lastUsedAt).not.toBeNull();
    expect(listed).not.toHaveProperty("secret");
    expect(listed.hint).toBe(token.secret.slice(-4));

    await world.server.db.update(apiTokens).set({ expiresAt: sql`now() - interval '1 second'` }).where(eq(apiTokens.id, token.id));
    const expired = await token.client.get(`/api/networks/${world.networkId}`);
    expect([expired.status, expired.body.error.code]).toEqual([401, "invalid_token"]);
    expect(expired.headers.get("www-authenticate")).toContain("Bearer");

    const revokable = await tokenFor(world.team.clients.editor, "read", null);
    expect((await world.team.clients.editor.delete(`/api/account/tokens/${revokable.id}`)).status).toBe(204);
    const revoked = await revokable.client.get(`/api/networks/${world.networkId}`);
    expect([revoked.status, revoked.body.error.code]).toEqual([401, "invalid_token"]);
    // Another person cannot revoke it (it is not theirs to see).
    const someone = await tokenFor(world.team.clients.viewer, "read", null);
    expect((await world.team.clients.editor.delete(`/api/account/tokens/${someone.id}`)).status).toBe(404);

    const unknown = new TokenClient(world.server.url, `pft_${"x".repeat(43)}`);
    expect((await unknown.get(`/api/networks/${world.networkId}`)).status).toBe(401);
    const malformed = await new ApiClient(world.server.url, { origin: null }).request("GET", `/api/networks/${world.networkId}`, undefined, { Authorization: "Bearer" });
    expect([malformed.status, malformed.body.error.code]).toEqual([401, "invalid_token"]);
  });

  it("stores only the SHA-256 of the secret", async () => {
    const token = await tokenFor(world.team.clients.owner, "read", null, "hash at rest");
    const rows = await world.server.db.select().from(apiTokens).where(eq(apiTokens.id, token.id));
    expect(rows).toHaveLength(1);
    expect(rows[0].tokenHash).toBe(createHash("sha256").update(token.secret).digest("hex"));
    // No column holds the secret or its random part.
    const dump = JSON.stringify((await world.server.pool.query("select * from api_tokens where id = $1", [token.id])).rows);
    expect(dump).not.toContain(token.secret.slice(4));
  });

  it("never lets a token make, list or revoke tokens", async () => {
    const token = await tokenFor(world.team.clients.owner, "solve", null);
    const [{ count: before }] = await world.server.db.select({ count: sql<number>`count(*)::int` }).from(apiTokens);
    const made = await token.client.post("/api/account/tokens", { name: "child", scope: "solve", teamId: null, expiresInDays: 366 });
    expect([made.status, made.body.error.code]).toEqual([403, "token_not_allowed"]);
    expect((await token.client.get("/api/account/tokens")).status).toBe(403);
    expect((await token.client.delete(`/api/account/tokens/${token.id}`)).status).toBe(403);
    const [{ count: after }] = await world.server.db.select({ count: sql<number>`count(*)::int` }).from(apiTokens);
    expect(after).toBe(before);
  });

  it("takes a token only from the Authorization header, never from a form post, a query or another site", async () => {
    const token = await tokenFor(world.team.clients.owner, "solve", null);
    const networks = async () => (await world.team.clients.owner.get(`/api/teams/${world.team.teamId}/networks?pageSize=100`)).body.total;
    const before = await networks();
    // A cookie-less form post from another site's page, the token in a field and in the query.
    const form = await fetch(`${world.server.url}/api/teams/${world.team.teamId}/networks?access_token=${token.secret}`, {
      method: "POST",
      headers: { Origin: "https://elsewhere.example", "Content-Type": "application/x-www-form-urlencoded" },
      body: new URLSearchParams({ access_token: token.secret, token: token.secret, title: "Forged" }).toString(),
    });
    expect(form.status).toBe(403);
    // The same without an Origin: still no session, so no one.
    const bare = await fetch(`${world.server.url}/api/teams/${world.team.teamId}/networks?access_token=${token.secret}`, {
      method: "POST",
      headers: { Referer: `${world.server.url}/`, "Content-Type": "application/x-www-form-urlencoded" },
      body: new URLSearchParams({ access_token: token.secret, title: "Forged" }).toString(),
    });
    expect(bare.status).toBe(401);
    // The header itself, sent from another site's page.
    const foreign = await fetch(`${world.server.url}/api/networks/${world.networkId}`, { headers: { Authorization: `Bearer ${token.secret}`, Origin: "https://elsewhere.example" } });
    expect(foreign.status).toBe(403);
    expect(await networks()).toBe(before);
  });

  it("uses the token, not a session cookie sent beside it", async () => {
    const read = await tokenFor(world.team.clients.owner, "read", null);
    const both = await read.client.request("POST", `/api/teams/${world.team.teamId}/networks`, { title: "Both", circuit: followerCircuit }, { Cookie: world.team.clients.owner.cookie! });
    expect([both.status, both.body.error.code]).toEqual([403, "token_scope"]);
  });

  it("refuses a token that does not fit: a team it cannot reach, a scope or an expiry out of range", async () => {
    const owner = world.team.clients.owner;
    const bad = await owner.post("/api/account/tokens", { name: "", scope: "admin", teamId: "nope", expiresInDays: 1000 });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(["expiresInDays", "name", "scope", "teamId"]);
  });
});
