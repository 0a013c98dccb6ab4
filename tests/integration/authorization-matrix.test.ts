// Every route × {anonymous, non-member, viewer, reviewer, editor, owner}, with the exact status, against the real database.
import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { z } from "zod";
import { createApp } from "../../server/app.js";
import { createLucia, createSessionToken, sessionCookieName } from "../../server/auth/lucia.js";
import { comments, invitations, teamMembers, teams, type Role } from "../../server/db/schema.js";
import { newToken } from "../../server/lib/tokens.js";
import { ApiClient } from "../support/api.js";
import { endpoints } from "../../shared/api/routes.js";
import { mountedRoutes } from "../support/routes.js";
import { actors, followerCircuit, signedInPerson, teamWithEveryRole, uniqueEmail, type Actor, type Person, type TeamFixture } from "../support/fixtures.js";
import { linkIn, waitForMail } from "../support/mail.js";
import { clientShellDir, startTestServer, type TestServer } from "../support/server.js";

type Statuses = Record<Actor, number>;
const statuses = (anonymous: number, nonMember: number, viewer: number, reviewer: number, editor: number, owner: number): Statuses => ({
  anonymous,
  nonMember,
  viewer,
  reviewer,
  editor,
  owner,
});
const everyone = (ok: number) => statuses(ok, ok, ok, ok, ok, ok);
const signedIn = (ok: number) => statuses(401, ok, ok, ok, ok, ok);
const members = (ok: number) => statuses(401, 404, ok, ok, ok, ok);
const reviewersUp = (ok: number) => statuses(401, 404, 403, ok, ok, ok);
const editorsUp = (ok: number) => statuses(401, 404, 403, 403, ok, ok);
const ownersOnly = (ok: number) => statuses(401, 404, 403, 403, 403, ok);

const png = Buffer.from("iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mNkYPhfDwAChwGA60e6kgAAAABJRU5ErkJggg==", "base64");

interface World {
  server: TestServer;
  team: TeamFixture;
  bystander: Person;
  networkId: string;
  slug: string;
  shareToken: string;
  commentId: string;
  stepId: string;
  attachmentId: string;
  inviteToken: string;
  solveJobId: string;
}

interface Case {
  method: "GET" | "POST" | "PATCH" | "PUT" | "DELETE";
  route: string;
  expect: Statuses;
  // Runs before each actor's request when the request uses something up (deletes, accepts, signs out).
  prepare?: (world: World, actor: Actor) => Promise<Record<string, string>>;
  path: (world: World, prepared: Record<string, string>) => string;
  body?: (world: World, prepared: Record<string, string>) => unknown;
  // A request that ends the session gets its own session, so later cases keep theirs.
  ownSession?: boolean;
}

function form(name: string, type: string, content: Buffer | string): FormData {
  const data = new FormData();
  data.append("file", new Blob([typeof content === "string" ? content : new Uint8Array(content)], { type }), name);
  return data;
}

async function freshTeam(world: World): Promise<string> {
  const [team] = await world.server.db.insert(teams).values({ name: `Matrix scratch ${randomUUID().slice(0, 6)}` }).returning();
  const { people } = world.team;
  await world.server.db.insert(teamMembers).values([
    { teamId: team.id, userId: people.owner.user.id, role: "owner" },
    { teamId: team.id, userId: people.editor.user.id, role: "editor" },
    { teamId: team.id, userId: people.reviewer.user.id, role: "reviewer" },
    { teamId: team.id, userId: people.viewer.user.id, role: "viewer" },
    { teamId: team.id, userId: world.bystander.user.id, role: "viewer" },
  ]);
  return team.id;
}

async function invite(world: World, teamId = world.team.teamId, email = uniqueEmail("matrix-invitee")): Promise<{ id: string; token: string }> {
  const since = new Date();
  const created = await world.team.clients.owner.post(`/api/teams/${teamId}/invitations`, { email, role: "viewer" });
  const token = linkIn(await waitForMail(world.server.db, email, { since }), "/invitations/accept?token=").searchParams.get("token")!;
  return { id: created.body.id, token };
}

// Inviting a member is refused up front, so their invitation (made before they joined, say) is written directly.
async function memberInvitation(world: World, actor: Role): Promise<{ token: string }> {
  const { token, hash } = newToken();
  await world.server.db.insert(invitations).values({ teamId: await freshTeam(world), email: world.team.people[actor].user.email, role: "viewer", tokenHash: hash, expiresAt: new Date(Date.now() + 3_600_000) });
  return { token };
}

async function reviewerComment(world: World, resolved = false): Promise<string> {
  const [row] = await world.server.db
    .insert(comments)
    .values({
      revisionId: (await world.team.clients.owner.get(`/api/networks/${world.networkId}/revisions/1`)).body.id,
      stepKey: world.stepId,
      authorId: world.team.people.reviewer.user.id,
      body: "scratch",
      ...(resolved ? { resolvedAt: new Date(), resolvedBy: world.team.people.reviewer.user.id } : {}),
    })
    .returning();
  return row.id;
}

async function share(world: World): Promise<{ id: string; token: string }> {
  const created = await world.team.clients.owner.post(`/api/networks/${world.networkId}/revisions/1/share`, {});
  return { id: created.body.id, token: created.body.token };
}

// A resistive divider as a two-terminal cell: enough for the access checks.
const matrixCell = (id: string) => ({ id, title: "Divider", terminals: ["a", "b"], symbols: ["R"], elements: [{ name: "R", kind: "resistor", nodes: ["a", "b"], value: "R" }] });

const net = (w: World) => `/api/networks/${w.networkId}`;
const rev = (w: World) => `${net(w)}/revisions/1`;

const cases: Case[] = [
  // ---- accounts ----
  { method: "POST", route: "/api/auth/signup", expect: everyone(201), path: () => "/api/auth/signup", body: () => ({ email: uniqueEmail("matrix-signup"), password: "matrix secret", name: "Matrix" }), ownSession: true },
  { method: "POST", route: "/api/auth/login", expect: everyone(401), path: () => "/api/auth/login", body: () => ({ email: uniqueEmail("nobody"), password: "not it at all" }), ownSession: true },
  { method: "POST", route: "/api/auth/logout", expect: everyone(204), path: () => "/api/auth/logout", ownSession: true },
  { method: "POST", route: "/api/auth/verify-email", expect: everyone(400), path: () => "/api/auth/verify-email", body: () => ({ token: "A".repeat(43) }) },
  { method: "POST", route: "/api/auth/verify-email/resend", expect: signedIn(202), path: () => "/api/auth/verify-email/resend" },
  { method: "POST", route: "/api/auth/password-reset", expect: everyone(202), path: () => "/api/auth/password-reset", body: () => ({ email: uniqueEmail("nobody") }) },
  { method: "POST", route: "/api/auth/password-reset/confirm", expect: everyone(400), path: () => "/api/auth/password-reset/confirm", body: () => ({ token: "A".repeat(43), password: "whatever secret" }) },
  { method: "GET", route: "/api/me", expect: signedIn(200), path: () => "/api/me" },
  { method: "PATCH", route: "/api/me/settings", expect: signedIn(200), path: () => "/api/me/settings", body: () => ({ reviewMail: true }) },
  // ---- API tokens (a browser session's; tokens themselves are held to their own table in api-tokens.test.ts) ----
  { method: "GET", route: "/api/account/tokens", expect: signedIn(200), path: () => "/api/account/tokens" },
  { method: "POST", route: "/api/account/tokens", expect: signedIn(201), path: () => "/api/account/tokens", body: () => ({ name: "Matrix script", scope: "read", teamId: null, expiresInDays: 30 }) },
  {
    method: "DELETE",
    route: "/api/account/tokens/:tokenId",
    expect: signedIn(204),
    // Each person revokes a token of their own; the anonymous request names the owner's.
    prepare: async (w, actor) => ({ id: (await w.team.clients[actor === "anonymous" ? "owner" : actor].post("/api/account/tokens", { name: "Doomed", scope: "read", teamId: null, expiresInDays: 1 })).body.token.id }),
    path: (_w, p) => `/api/account/tokens/${p.id}`,
  },
  // Only a request with a token has a current token.
  { method: "GET", route: "/api/account/tokens/current", expect: statuses(401, 400, 400, 400, 400, 400), path: () => "/api/account/tokens/current" },
  // ---- teams ----
  { method: "POST", route: "/api/teams", expect: signedIn(201), path: () => "/api/teams", body: () => ({ name: "Matrix team" }) },
  { method: "GET", route: "/api/teams/:teamId", expect: members(200), path: (w) => `/api/teams/${w.team.teamId}` },
  { method: "PATCH", route: "/api/teams/:teamId", expect: ownersOnly(200), path: (w) => `/api/teams/${w.team.teamId}`, body: () => ({ name: "Matrix lab" }) },
  { method: "DELETE", route: "/api/teams/:teamId", expect: ownersOnly(204), prepare: async (w) => ({ team: await freshTeam(w) }), path: (_w, p) => `/api/teams/${p.team}` },
  { method: "GET", route: "/api/teams/:teamId/members", expect: members(200), path: (w) => `/api/teams/${w.team.teamId}/members` },
  { method: "PATCH", route: "/api/teams/:teamId/members/:userId", expect: ownersOnly(200), path: (w) => `/api/teams/${w.team.teamId}/members/${w.team.people.viewer.user.id}`, body: () => ({ role: "viewer" }) },
  { method: "DELETE", route: "/api/teams/:teamId/members/:userId", expect: ownersOnly(204), prepare: async (w) => ({ team: await freshTeam(w) }), path: (w, p) => `/api/teams/${p.team}/members/${w.bystander.user.id}` },
  { method: "POST", route: "/api/teams/:teamId/invitations", expect: ownersOnly(201), path: (w) => `/api/teams/${w.team.teamId}/invitations`, body: () => ({ email: uniqueEmail("matrix-invite"), role: "viewer" }) },
  { method: "GET", route: "/api/teams/:teamId/invitations", expect: ownersOnly(200), path: (w) => `/api/teams/${w.team.teamId}/invitations` },
  { method: "DELETE", route: "/api/teams/:teamId/invitations/:invitationId", expect: ownersOnly(204), prepare: async (w) => await invite(w), path: (w, p) => `/api/teams/${w.team.teamId}/invitations/${p.id}` },
  { method: "GET", route: "/api/invitations/:token", expect: everyone(200), path: (w) => `/api/invitations/${w.inviteToken}` },
  // Each actor is invited at its own address. Members are members already (409); the outsider joins (200) — a scratch
  // team, so the outsider stays outside the fixture team.
  {
    method: "POST",
    route: "/api/invitations/:token/accept",
    expect: statuses(401, 200, 409, 409, 409, 409),
    prepare: async (w, actor) => (actor === "anonymous" || actor === "nonMember" ? await invite(w, await freshTeam(w), actor === "nonMember" ? w.team.people.nonMember.user.email : undefined) : await memberInvitation(w, actor)),
    path: (_w, p) => `/api/invitations/${p.token}/accept`,
  },
  // ---- team cells ----
  { method: "GET", route: "/api/teams/:teamId/cells", expect: members(200), path: (w) => `/api/teams/${w.team.teamId}/cells` },
  // Every actor saves a cell of its own id, so the editor's and the owner's are both 201 (not 409).
  { method: "POST", route: "/api/teams/:teamId/cells", expect: editorsUp(201), path: (w) => `/api/teams/${w.team.teamId}/cells`, body: () => ({ definition: matrixCell(`matrix-${randomUUID().slice(0, 8)}`) }) },
  {
    method: "DELETE",
    route: "/api/teams/:teamId/cells/:cellId",
    expect: editorsUp(204),
    prepare: async (w) => ({ id: (await w.team.clients.owner.post(`/api/teams/${w.team.teamId}/cells`, { definition: matrixCell(`doomed-${randomUUID().slice(0, 8)}`) })).body.id }),
    path: (w, p) => `/api/teams/${w.team.teamId}/cells/${p.id}`,
  },
  // ---- networks ----
  { method: "GET", route: "/api/teams/:teamId/networks", expect: members(200), path: (w) => `/api/teams/${w.team.teamId}/networks` },
  { method: "POST", route: "/api/teams/:teamId/networks", expect: editorsUp(201), path: (w) => `/api/teams/${w.team.teamId}/networks`, body: () => ({ title: "Matrix network", circuit: followerCircuit }) },
  { method: "POST", route: "/api/teams/:teamId/networks/import", expect: editorsUp(201), path: (w) => `/api/teams/${w.team.teamId}/networks/import`, body: () => form("follower.json", "application/json", JSON.stringify(followerCircuit)) },
  { method: "GET", route: "/api/networks/by-slug/:slug", expect: members(200), path: (w) => `/api/networks/by-slug/${w.slug}` },
  { method: "GET", route: "/api/networks/:networkId", expect: members(200), path: net },
  { method: "PATCH", route: "/api/networks/:networkId", expect: editorsUp(200), path: net, body: () => ({ description: "edited in the matrix" }) },
  {
    method: "DELETE",
    route: "/api/networks/:networkId",
    expect: editorsUp(204),
    prepare: async (w) => ({ id: (await w.team.clients.owner.post(`/api/teams/${w.team.teamId}/networks`, { title: "Doomed", circuit: followerCircuit })).body.id }),
    path: (_w, p) => `/api/networks/${p.id}`,
  },
  { method: "POST", route: "/api/networks/:networkId/duplicate", expect: editorsUp(201), path: (w) => `${net(w)}/duplicate` },
  // ---- derivations ----
  { method: "POST", route: "/api/networks/:networkId/solve", expect: editorsUp(201), path: (w) => `${net(w)}/solve` },
  { method: "GET", route: "/api/networks/:networkId/revisions", expect: members(200), path: (w) => `${net(w)}/revisions` },
  { method: "GET", route: "/api/networks/:networkId/revisions/:number", expect: members(200), path: rev },
  { method: "GET", route: "/api/networks/:networkId/revisions/:from/compare/:to", expect: members(200), path: (w) => `${rev(w)}/compare/1` },
  { method: "GET", route: "/api/networks/:networkId/solve-jobs/:jobId", expect: members(200), path: (w) => `${net(w)}/solve-jobs/${w.solveJobId}` },
  // ---- share links ----
  { method: "POST", route: "/api/networks/:networkId/revisions/:number/share", expect: editorsUp(201), path: (w) => `${rev(w)}/share`, body: () => ({}) },
  { method: "GET", route: "/api/networks/:networkId/revisions/:number/share", expect: members(200), path: (w) => `${rev(w)}/share` },
  { method: "DELETE", route: "/api/networks/:networkId/revisions/:number/share/:shareId", expect: editorsUp(204), prepare: async (w) => await share(w), path: (w, p) => `${rev(w)}/share/${p.id}` },
  { method: "GET", route: "/api/share/:token", expect: everyone(200), path: (w) => `/api/share/${w.shareToken}` },
  { method: "DELETE", route: "/api/share/:token", expect: editorsUp(204), prepare: async (w) => await share(w), path: (_w, p) => `/api/share/${p.token}` },
  { method: "GET", route: "/s/:token", expect: everyone(200), path: (w) => `/s/${w.shareToken}` },
  // ---- review ----
  { method: "GET", route: "/api/networks/:networkId/revisions/:number/comments", expect: members(200), path: (w) => `${rev(w)}/comments` },
  { method: "POST", route: "/api/networks/:networkId/revisions/:number/comments", expect: reviewersUp(201), path: (w) => `${rev(w)}/comments`, body: (w) => ({ stepId: w.stepId, body: "From the matrix" }) },
  // The comment is the reviewer's own: only its author edits it.
  { method: "PATCH", route: "/api/networks/:networkId/revisions/:number/comments/:commentId", expect: statuses(401, 404, 403, 200, 403, 403), path: (w) => `${rev(w)}/comments/${w.commentId}`, body: () => ({ body: "Edited" }) },
  // Its author deletes it, and so may a team owner.
  { method: "DELETE", route: "/api/networks/:networkId/revisions/:number/comments/:commentId", expect: statuses(401, 404, 403, 204, 403, 204), prepare: async (w) => ({ id: await reviewerComment(w) }), path: (w, p) => `${rev(w)}/comments/${p.id}` },
  // The owner solved the revision, so the owner may not approve it.
  { method: "PUT", route: "/api/networks/:networkId/revisions/:number/verdict", expect: statuses(401, 404, 403, 200, 200, 403), path: (w) => `${rev(w)}/verdict`, body: () => ({ verdict: "approved" }) },
  { method: "GET", route: "/api/networks/:networkId/revisions/:number/verdicts", expect: members(200), path: (w) => `${rev(w)}/verdicts` },
  { method: "POST", route: "/api/networks/:networkId/revisions/:number/verdicts", expect: reviewersUp(201), path: (w) => `${rev(w)}/verdicts`, body: () => ({ verdict: "needs_changes", note: "From the matrix" }) },
  // The reviewer's own verdict: only its giver withdraws it.
  {
    method: "POST",
    route: "/api/networks/:networkId/revisions/:number/verdicts/:verdictId/withdraw",
    expect: statuses(401, 404, 403, 201, 403, 403),
    prepare: async (w) => ({ id: (await w.team.clients.reviewer.post(`${rev(w)}/verdicts`, { verdict: "approved" })).body.verdict.id }),
    path: (w, p) => `${rev(w)}/verdicts/${p.id}/withdraw`,
  },
  // The thread's author (the reviewer), the revision's author and an owner (both the owner here) resolve and reopen.
  { method: "POST", route: "/api/networks/:networkId/revisions/:number/comments/:commentId/resolve", expect: statuses(401, 404, 403, 200, 403, 200), prepare: async (w) => ({ id: await reviewerComment(w) }), path: (w, p) => `${rev(w)}/comments/${p.id}/resolve` },
  {
    method: "POST",
    route: "/api/networks/:networkId/revisions/:number/comments/:commentId/reopen",
    expect: statuses(401, 404, 403, 200, 403, 200),
    prepare: async (w) => ({ id: await reviewerComment(w, true) }),
    path: (w, p) => `${rev(w)}/comments/${p.id}/reopen`,
  },
  { method: "GET", route: "/api/reviews/awaiting", expect: signedIn(200), path: () => "/api/reviews/awaiting" },
  { method: "GET", route: "/api/reviews/mine", expect: signedIn(200), path: () => "/api/reviews/mine?page=1&pageSize=5" },
  // ---- attachments ----
  { method: "POST", route: "/api/networks/:networkId/attachments", expect: editorsUp(201), path: (w) => `${net(w)}/attachments`, body: () => form("scope.png", "image/png", png) },
  { method: "GET", route: "/api/networks/:networkId/attachments", expect: members(200), path: (w) => `${net(w)}/attachments` },
  { method: "GET", route: "/api/networks/:networkId/attachments/:attachmentId", expect: members(200), path: (w) => `${net(w)}/attachments/${w.attachmentId}` },
  {
    method: "DELETE",
    route: "/api/networks/:networkId/attachments/:attachmentId",
    expect: editorsUp(204),
    prepare: async (w) => ({ id: (await w.team.clients.owner.upload(`${net(w)}/attachments`, { name: "doomed.png", type: "image/png", content: png })).body.id }),
    path: (w, p) => `${net(w)}/attachments/${p.id}`,
  },
  // ---- value sets ----
  { method: "POST", route: "/api/networks/:networkId/value-sets", expect: editorsUp(201), path: (w) => `${net(w)}/value-sets`, body: () => ({ name: "nominal", values: { Rs: "4.7k" } }) },
  { method: "GET", route: "/api/networks/:networkId/value-sets", expect: members(200), path: (w) => `${net(w)}/value-sets` },
  {
    method: "DELETE",
    route: "/api/networks/:networkId/value-sets/:setId",
    expect: editorsUp(204),
    prepare: async (w) => ({ id: (await w.team.clients.owner.post(`${net(w)}/value-sets`, { name: `doomed-${Math.random()}`, values: { A: "1e5" } })).body.id }),
    path: (w, p) => `${net(w)}/value-sets/${p.id}`,
  },
  // ---- development and health ----
  { method: "GET", route: "/api/dev/mail", expect: everyone(200), path: () => "/api/dev/mail?limit=1" },
  { method: "GET", route: "/dev/mailbox", expect: everyone(200), path: () => "/dev/mailbox?limit=1" },
  { method: "GET", route: "/api/dev/mail-queue", expect: everyone(200), path: () => "/api/dev/mail-queue" },
  { method: "GET", route: "/dev/mailbox.css", expect: everyone(200), path: () => "/dev/mailbox.css" },
  { method: "GET", route: "/api/health", expect: everyone(200), path: () => "/api/health" },
  { method: "GET", route: "/api/openapi.json", expect: everyone(200), path: () => "/api/openapi.json" },
];

// The zod schema of a JSON answer in the contract's table (shared/api/routes.ts), if it names one.
function answerSchema(testCase: Case, status: number): z.ZodType | null {
  const endpoint = endpoints.find((e) => e.method === testCase.method && e.path === testCase.route);
  const answer = endpoint?.answers[status];
  return answer && !("contentType" in answer && typeof answer.contentType === "string") ? (answer as z.ZodType) : null;
}

describe("authorization matrix", () => {
  const world = {} as World;
  beforeAll(async () => {
    world.server = await startTestServer({ clientDir: clientShellDir() });
    [world.team, world.bystander] = await Promise.all([teamWithEveryRole(world.server), signedInPerson(world.server, "bystander")]);
    const owner = world.team.clients.owner;
    const network = (await owner.post(`/api/teams/${world.team.teamId}/networks`, { title: "Matrix follower", circuit: followerCircuit })).body;
    world.networkId = network.id;
    world.slug = network.slug;
    const revision = (await owner.post(`/api/networks/${network.id}/solve`)).body;
    world.stepId = revision.steps[1].id;
    world.shareToken = (await share(world)).token;
    world.commentId = (await world.team.clients.reviewer.post(`/api/networks/${network.id}/revisions/1/comments`, { stepId: world.stepId, body: "Reviewer's own" })).body.id;
    world.attachmentId = (await owner.upload(`/api/networks/${network.id}/attachments`, { name: "scope.png", type: "image/png", content: png })).body.id;
    world.inviteToken = (await invite(world)).token;
    world.solveJobId = (await owner.post(`/api/networks/${network.id}/solve?wait=0`)).body.job.id;
    // Two solves (one on a freshly started thread), an upload and mails: room on a loaded machine.
  }, 120_000);
  afterAll(async () => {
    await world.server.close();
  });

  const auth = () => createLucia(world.server.db, { secureCookie: false });
  async function clientFor(actor: Actor, ownSession: boolean): Promise<ApiClient> {
    if (!ownSession || actor === "anonymous") return actor === "anonymous" ? new ApiClient(world.server.url) : world.team.clients[actor];
    const person = world.team.people[actor];
    const token = await createSessionToken(auth(), person.user.id);
    return new ApiClient(world.server.url, { cookie: `${sessionCookieName}=${token}` });
  }

  it("covers every route the server mounts, each once", () => {
    const app = createApp({ pool: world.server.pool, db: world.server.db, clientDir: clientShellDir(), settings: { logLevel: "silent" } });
    const covered = cases.map((c) => `${c.method} ${c.route}`);
    expect(new Set(covered).size).toBe(covered.length);
    expect(covered.sort()).toEqual(mountedRoutes(app).sort());
  });

  for (const testCase of cases) {
    it(`${testCase.method} ${testCase.route}`, async () => {
      const actual = {} as Statuses;
      for (const actor of actors) {
        const prepared = testCase.prepare ? await testCase.prepare(world, actor) : {};
        const client = await clientFor(actor, testCase.ownSession ?? false);
        const response = await client.request(testCase.method, testCase.path(world, prepared), testCase.body?.(world, prepared) ?? (testCase.method === "GET" || testCase.method === "DELETE" ? undefined : {}));
        actual[actor] = response.status;
        // A success is the answer the contract names: every field it lists, of its type, and none it does not.
        const answer = answerSchema(testCase, response.status);
        if (answer) {
          const parsed = answer.safeParse(response.body);
          expect(parsed.error?.issues ?? [], `${actor}: answer ${response.status} fits the contract`).toEqual([]);
          expect(parsed.data, `${actor}: answer ${response.status} has no field the contract leaves out`).toEqual(response.body);
        }
        if (response.status >= 400 && (response.headers.get("content-type") ?? "").includes("json")) {
          expect(response.body.error, `${actor}: error shape`).toEqual(expect.objectContaining({ code: expect.any(String), message: expect.any(String) }));
        }
      }
      expect(actual).toEqual(testCase.expect);
    });
  }

  it("answers a non-member exactly as it answers for something that does not exist", async () => {
    const outsider = world.team.clients.nonMember;
    for (const [real, missing] of [
      [`/api/networks/${world.networkId}`, `/api/networks/${randomUUID()}`],
      [`/api/teams/${world.team.teamId}/networks`, `/api/teams/${randomUUID()}/networks`],
      [`/api/networks/${world.networkId}/revisions/1`, `/api/networks/${randomUUID()}/revisions/1`],
    ]) {
      const a = await outsider.get(real);
      const b = await outsider.get(missing);
      expect(a.status).toBe(404);
      expect(b.status).toBe(404);
      expect(a.body.error.code).toBe(b.body.error.code);
      expect(a.body.error.message).toBe(b.body.error.message);
    }
  });
});
