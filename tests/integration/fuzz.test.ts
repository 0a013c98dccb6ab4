// Fuzzing the API with fast-check (bounded runs and time): random and mutated netlists, text and
// JSON, and random bodies and path ids on every route. Never a 5xx, never a hang, and a refused
// request leaves the database exactly as it was.
import { readdirSync, readFileSync } from "node:fs";
import { join } from "node:path";
import fc from "fast-check";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { ELEMENT_KINDS } from "../../shared/engine/index.js";
import { createApp } from "../../server/app.js";
import { ApiClient, type ApiResponse } from "../support/api.js";
import { mountedRoutes } from "../support/routes.js";
import { followerCircuit, teamWithEveryRole, type TeamFixture } from "../support/fixtures.js";
import { clientShellDir, startTestServer, type TestServer } from "../support/server.js";

// Every route gets at least this many random requests of its own.
const casesPerRoute = 15;

// Every request must be answered within this; a hang fails the run.
const answerWithinMs = 20_000;
const budget = <T>(runs: number, examples: T[] = []) => ({ numRuns: runs, interruptAfterTimeLimit: 15_000, markInterruptAsFailure: false, examples });

interface World {
  server: TestServer;
  team: TeamFixture;
  networkId: string;
  slug: string;
  stepId: string;
  shareToken: string;
  commentId: string;
  attachmentId: string;
  jobId: string;
  cellId: string;
}

// A digest per table of every row the fuzzing people can reach, so a refused request that wrote anything shows, and where.
async function snapshot(world: World): Promise<Record<string, string>> {
  const users = Object.values(world.team.people).map((person) => person.user.id);
  const { rows } = await world.server.pool.query<Record<string, string>>(
    `with fuzz_teams as (select team_id from team_members where user_id = any($1)),
          fuzz_networks as (select id from networks where team_id in (select team_id from fuzz_teams)),
          fuzz_revisions as (select id from revisions where network_id in (select id from fuzz_networks))
     select
       md5(coalesce((select string_agg(t::text, ',' order by t.id) from teams t where t.id in (select team_id from fuzz_teams))::text, '')) as teams,
       md5(coalesce((select string_agg(m::text, ',' order by m.team_id, m.user_id) from team_members m where m.team_id in (select team_id from fuzz_teams))::text, '')) as team_members,
       md5(coalesce((select string_agg(u.id || u.email || u.name || coalesce(u.password_hash, '') || coalesce(u.email_verified_at::text, ''), ',' order by u.id) from users u where u.id = any($1))::text, '')) as users,
       md5(coalesce((select count(*) from sessions s where s.user_id = any($1))::text, '')) as sessions,
       md5(coalesce((select count(*) from email_tokens e where e.user_id = any($1))::text, '')) as email_tokens,
       md5(coalesce((select string_agg(n::text, ',' order by n.id) from networks n where n.id in (select id from fuzz_networks))::text, '')) as networks,
       md5(coalesce((select string_agg(r.id || ':' || r.number, ',' order by r.id) from revisions r where r.id in (select id from fuzz_revisions))::text, '')) as revisions,
       md5(coalesce((select count(*) from revision_steps s where s.revision_id in (select id from fuzz_revisions))::text, '')) as revision_steps,
       md5(coalesce((select string_agg(c::text, ',' order by c.id) from comments c where c.revision_id in (select id from fuzz_revisions))::text, '')) as comments,
       md5(coalesce((select string_agg(v::text, ',' order by v.id) from revision_verdicts v where v.revision_id in (select id from fuzz_revisions))::text, '')) as revision_verdicts,
       md5(coalesce((select string_agg(l::text, ',' order by l.id) from share_links l where l.revision_id in (select id from fuzz_revisions))::text, '')) as share_links,
       md5(coalesce((select string_agg(a.id || a.filename || a.size, ',' order by a.id) from attachments a where a.network_id in (select id from fuzz_networks))::text, '')) as attachments,
       md5(coalesce((select string_agg(i::text, ',' order by i.id) from invitations i where i.team_id in (select team_id from fuzz_teams))::text, '')) as invitations,
       md5(coalesce((select string_agg(j::text, ',' order by j.id) from solve_jobs j where j.network_id in (select id from fuzz_networks))::text, '')) as solve_jobs,
       md5(coalesce((select string_agg(c::text, ',' order by c.id) from cells c where c.team_id in (select team_id from fuzz_teams))::text, '')) as cells`,
    [users],
  );
  return rows[0];
}

function withinTime<T>(request: Promise<T>, what: string): Promise<T> {
  let timer: NodeJS.Timeout | undefined;
  const hang = new Promise<never>((_, reject) => {
    timer = setTimeout(() => reject(new Error(`no answer within ${answerWithinMs} ms: ${what}`)), answerWithinMs);
  });
  return Promise.race([request, hang]).finally(() => clearTimeout(timer));
}

// ---- arbitraries ----

const anyJson = fc.jsonValue({ maxDepth: 3 });
const words = ["arm", "leg", "tap", "sense", "drive", "load", "bias", "gain", "feed", "trim", "Ω", "x y", ""];
const wordy = fc.tuple(fc.constantFrom(...words), fc.integer({ min: 0, max: 9 })).map(([word, n]) => `${word}${n}`);
const nodeName = fc.oneof(fc.constantFrom("0", "a", "b", "out", "in", "mid"), wordy, fc.string({ maxLength: 4 }));
const symbol = fc.oneof(fc.constantFrom("Rs", "Rl", "mu", "gm", "beta", "s", "Vs", "Is"), wordy);
const value = fc.oneof(
  symbol,
  fc.constantFrom("4.7k", "1e3", "2.2M", "100n", "0", "-1", "1/0", "()", "Rs +", "*", "Rs^2", "(Rs + Rl)/2", "2*Rs*s"),
  fc.tuple(symbol, fc.constantFrom("+", "-", "*", "/", "^"), symbol).map(([a, op, b]) => `${a} ${op} ${b}`),
  fc.string({ maxLength: 8 }),
);
const kind = fc.oneof(fc.constantFrom(...ELEMENT_KINDS), fc.constantFrom("widget", "", "Resistor"));

const netlistLine = fc.oneof(
  fc.tuple(wordy, kind, nodeName, nodeName, value).map(([n, k, a, b, v]) => `${n} ${k} ${a} ${b} = ${v}`),
  fc.tuple(wordy, fc.constantFrom("voltage", "current"), nodeName, nodeName, symbol, nodeName, nodeName).map(([n, k, a, b, g, c, d]) => `${n} ${k} ${a} ${b} = ${g} * across(${c}, ${d})`),
  fc.tuple(wordy, fc.constantFrom("voltage", "current"), nodeName, nodeName, symbol, wordy).map(([n, k, a, b, g, e]) => `${n} ${k} ${a} ${b} = ${g} * through(${e})`),
  fc.tuple(wordy, nodeName, nodeName, nodeName).map(([n, p, m, o]) => `${n} opamp ${p} ${m} -> ${o}`),
  fc.tuple(nodeName, nodeName).map(([a, b]) => `port ${a} ${b}`),
  nodeName.map((n) => `ground ${n}`),
  fc.tuple(symbol, fc.constantFrom("dimensionless", "resistance", "voltage", "loudness")).map(([q, u]) => `quantity ${q} ${u}`),
  fc.string({ maxLength: 20 }).map((text) => `# ${text}`),
  fc.string({ maxLength: 30 }),
);
const randomNetlist = fc.array(netlistLine, { minLength: 1, maxLength: 8 }).map((lines) => lines.join("\n"));

const fixtureTexts = readdirSync("fixtures").filter((file) => /\.(pfn|json)$/.test(file)).map((file) => ({ file, text: readFileSync(join("fixtures", file), "utf8") }));

// Small edits to a valid file: characters dropped, inserted or replaced, lines duplicated or dropped.
const edit = fc.oneof(
  fc.record({ op: fc.constant("delete" as const), at: fc.nat(), length: fc.integer({ min: 1, max: 6 }) }),
  fc.record({ op: fc.constant("insert" as const), at: fc.nat(), text: fc.oneof(fc.string({ maxLength: 4 }), fc.constantFrom("\n", "=", " ", "{", "}", '"', ",", "(", "->", "\u00e9", "\ud83d\ude00")) }),
  fc.record({ op: fc.constant("duplicateLine" as const), at: fc.nat() }),
  fc.record({ op: fc.constant("dropLine" as const), at: fc.nat() }),
);
type Edit = typeof edit extends fc.Arbitrary<infer E> ? E : never;

function applyEdits(text: string, edits: Edit[]): string {
  return edits.reduce((out, change) => {
    const at = out.length === 0 ? 0 : change.at % out.length;
    if (change.op === "delete") return out.slice(0, at) + out.slice(at + change.length);
    if (change.op === "insert") return out.slice(0, at) + change.text + out.slice(at);
    const lines = out.split("\n");
    const line = change.at % lines.length;
    if (change.op === "duplicateLine") lines.splice(line, 0, lines[line]);
    else lines.splice(line, 1);
    return lines.join("\n");
  }, text);
}
const mutatedFixture = fc.tuple(fc.constantFrom(...fixtureTexts), fc.array(edit, { minLength: 1, maxLength: 4 })).map(([fixture, edits]) => ({ file: fixture.file, text: applyEdits(fixture.text, edits) }));

// JSON circuits: the follower with one part replaced by something random, or a random value altogether.
const pathInto = (value: unknown, path: (string | number)[], replacement: unknown): unknown => {
  if (path.length === 0) return replacement;
  if (Array.isArray(value)) {
    const index = Number(path[0]) % Math.max(1, value.length);
    return value.map((item, i) => (i === index ? pathInto(item, path.slice(1), replacement) : item));
  }
  if (value && typeof value === "object") return { ...value, [path[0]]: pathInto((value as Record<string, unknown>)[path[0]], path.slice(1), replacement) };
  return replacement;
};
const circuitPath: fc.Arbitrary<(string | number)[]> = fc.oneof(
  fc.constant<(string | number)[]>(["port", "plus"]),
  fc.constant<(string | number)[]>(["ground"]),
  fc.tuple(fc.nat(), fc.constantFrom("name", "kind", "nodes", "value", "control", "extra")).map(([i, key]): (string | number)[] => ["elements", i, key]),
  fc.tuple(fc.nat(), fc.nat({ max: 2 })).map(([i, j]): (string | number)[] => ["elements", i, "nodes", j]),
  fc.constant<(string | number)[]>(["elements"]),
  fc.constant<(string | number)[]>(["quantities"]),
);
const mutatedCircuit = fc.oneof(
  { weight: 4, arbitrary: fc.tuple(circuitPath, fc.oneof(anyJson, nodeName, value, kind)).map(([path, replacement]) => pathInto(followerCircuit, path, replacement)) },
  { weight: 1, arbitrary: anyJson },
);

// A body shaped like what the route wants, each field either sensible or random.
const fieldValue = (sensible: fc.Arbitrary<unknown>) => fc.oneof({ weight: 3, arbitrary: sensible }, { weight: 1, arbitrary: anyJson }, { weight: 1, arbitrary: fc.constant(undefined) });
const shaped = (fields: Record<string, fc.Arbitrary<unknown>>) =>
  fc.oneof({ weight: 4, arbitrary: fc.record(Object.fromEntries(Object.entries(fields).map(([key, arb]) => [key, fieldValue(arb)]))) }, { weight: 1, arbitrary: anyJson });

interface Route {
  method: "GET" | "POST" | "PATCH" | "PUT" | "DELETE";
  path: string;
  body?: fc.Arbitrary<unknown>;
  // Destructive routes only ever get ids that do not exist, so the fixture survives the run.
  destructive?: boolean;
  anonymous?: boolean;
}

const text = fc.oneof(fc.string({ maxLength: 40 }), fc.string({ unit: "binary", maxLength: 20 }), fc.constantFrom("", " ", "Sensor lab", "a".repeat(300), "<b>bold</b>", "$&", "a\u0000b"));
const email = fc.oneof(fc.emailAddress(), fc.constantFrom("", "not-an-email", "a@b", "UPPER@EXAMPLE.TEST"));
const routesFor = (world: World): Route[] => [
  { method: "POST", path: "/api/auth/signup", anonymous: true, body: shaped({ email, password: text, name: text }) },
  { method: "POST", path: "/api/auth/login", anonymous: true, body: shaped({ email, password: text }) },
  { method: "POST", path: "/api/auth/verify-email", anonymous: true, body: shaped({ token: text }) },
  { method: "POST", path: "/api/auth/verify-email/resend" },
  { method: "POST", path: "/api/auth/password-reset", anonymous: true, body: shaped({ email }) },
  { method: "POST", path: "/api/auth/password-reset/confirm", anonymous: true, body: shaped({ token: text, password: text }) },
  // Anonymous: signing the fixture owner out would turn every later case into a 401.
  { method: "POST", path: "/api/auth/logout", anonymous: true },
  { method: "GET", path: "/api/me" },
  { method: "GET", path: "/api/account/tokens" },
  { method: "POST", path: "/api/account/tokens", body: shaped({ name: text, scope: fc.constantFrom("read", "solve", "admin"), teamId: fc.oneof(fc.constant(null), fc.constant(world.team.teamId), fc.uuid(), text), expiresInDays: fc.oneof(fc.integer({ min: -5, max: 400 }), fc.double()) }) },
  { method: "DELETE", path: "/api/account/tokens/:tokenId", destructive: true },
  { method: "GET", path: "/api/account/tokens/current" },
  { method: "POST", path: "/api/teams", body: shaped({ name: text }) },
  { method: "GET", path: "/api/teams/:teamId" },
  { method: "PATCH", path: "/api/teams/:teamId", body: shaped({ name: text }) },
  { method: "DELETE", path: "/api/teams/:teamId", destructive: true },
  { method: "GET", path: "/api/teams/:teamId/members" },
  { method: "PATCH", path: "/api/teams/:teamId/members/:userId", body: shaped({ role: fc.constantFrom("owner", "editor", "reviewer", "viewer", "admin") }) },
  { method: "DELETE", path: "/api/teams/:teamId/members/:userId", destructive: true },
  { method: "POST", path: "/api/teams/:teamId/invitations", body: shaped({ email, role: fc.constantFrom("editor", "viewer", "root") }) },
  { method: "GET", path: "/api/teams/:teamId/invitations" },
  { method: "DELETE", path: "/api/teams/:teamId/invitations/:invitationId", destructive: true },
  { method: "GET", path: "/api/invitations/:token", anonymous: true },
  { method: "POST", path: "/api/invitations/:token/accept" },
  { method: "GET", path: "/api/teams/:teamId/networks?q=:q&sort=:sort&page=:page" },
  { method: "POST", path: "/api/teams/:teamId/networks", body: shaped({ title: text, description: text, circuit: mutatedCircuit }) },
  { method: "GET", path: "/api/networks/by-slug/:slug" },
  // Multipart routes: random JSON bodies here; random files in the upload test above.
  { method: "POST", path: "/api/teams/:teamId/networks/import", body: anyJson },
  { method: "POST", path: "/api/networks/:networkId/attachments", body: anyJson },
  { method: "GET", path: "/api/teams/:teamId/cells" },
  { method: "POST", path: "/api/teams/:teamId/cells", body: shaped({ definition: fc.oneof(anyJson, fc.constant(cellDefinition("fuzzcell2")), shaped({ id: text, title: text, terminals: fc.array(nodeName, { maxLength: 3 }), symbols: fc.array(symbol, { maxLength: 3 }), elements: fc.array(anyJson, { maxLength: 2 }) })) }) },
  { method: "DELETE", path: "/api/teams/:teamId/cells/:cellId", destructive: true },
  { method: "GET", path: "/api/networks/:networkId" },
  { method: "PATCH", path: "/api/networks/:networkId", body: shaped({ title: text, description: text, circuit: mutatedCircuit, expectedUpdatedAt: fc.oneof(fc.date().map((d) => (Number.isNaN(d.getTime()) ? "x" : d.toISOString())), text) }) },
  { method: "DELETE", path: "/api/networks/:networkId", destructive: true },
  { method: "POST", path: "/api/networks/:networkId/duplicate", body: shaped({ title: text }) },
  { method: "POST", path: "/api/networks/:networkId/solve?wait=:wait", body: anyJson },
  { method: "GET", path: "/api/networks/:networkId/solve-jobs/:jobId" },
  { method: "GET", path: "/api/networks/:networkId/revisions" },
  { method: "GET", path: "/api/networks/:networkId/revisions/:number" },
  { method: "GET", path: "/api/networks/:networkId/revisions/:number/compare/:number" },
  { method: "POST", path: "/api/networks/:networkId/revisions/:number/share", body: shaped({ expiresAt: fc.oneof(fc.constant(new Date(Date.now() + 86_400_000).toISOString()), fc.constant("2001-01-01T00:00:00Z"), text) }) },
  { method: "GET", path: "/api/networks/:networkId/revisions/:number/share" },
  { method: "DELETE", path: "/api/networks/:networkId/revisions/:number/share/:shareId", destructive: true },
  { method: "GET", path: "/api/share/:token", anonymous: true },
  { method: "DELETE", path: "/api/share/:token", destructive: true },
  { method: "GET", path: "/api/networks/:networkId/revisions/:number/comments" },
  { method: "POST", path: "/api/networks/:networkId/revisions/:number/comments", body: shaped({ stepId: fc.oneof(text, fc.constant(world.stepId)), body: text, parentId: fc.oneof(fc.uuid(), fc.constant(world.commentId), text), anchor: fc.oneof(text, fc.record({ part: fc.constantFrom("explanation", "formula", "x"), text, start: fc.integer() })) }) },
  { method: "PATCH", path: "/api/networks/:networkId/revisions/:number/comments/:commentId", body: shaped({ body: text }) },
  { method: "DELETE", path: "/api/networks/:networkId/revisions/:number/comments/:commentId", destructive: true },
  { method: "PUT", path: "/api/networks/:networkId/revisions/:number/verdict", body: shaped({ verdict: fc.constantFrom("open", "approved", "needs_changes", "rejected"), note: text }) },
  { method: "GET", path: "/api/networks/:networkId/revisions/:number/verdicts" },
  { method: "POST", path: "/api/networks/:networkId/revisions/:number/verdicts", body: shaped({ verdict: fc.constantFrom("approved", "needs_changes", "open"), note: text }) },
  { method: "POST", path: "/api/networks/:networkId/revisions/:number/verdicts/:verdictId/withdraw" },
  { method: "POST", path: "/api/networks/:networkId/revisions/:number/comments/:commentId/resolve" },
  { method: "POST", path: "/api/networks/:networkId/revisions/:number/comments/:commentId/reopen" },
  { method: "GET", path: "/api/reviews/awaiting?page=:page&pageSize=:page" },
  { method: "GET", path: "/api/reviews/mine?page=:page" },
  { method: "PATCH", path: "/api/me/settings", body: shaped({ reviewMail: fc.oneof(fc.boolean(), text) }) },
  { method: "GET", path: "/api/networks/:networkId/attachments" },
  { method: "GET", path: "/api/networks/:networkId/attachments/:attachmentId" },
  { method: "DELETE", path: "/api/networks/:networkId/attachments/:attachmentId", destructive: true },
  { method: "GET", path: "/api/networks/:networkId/value-sets" },
  { method: "POST", path: "/api/networks/:networkId/value-sets", body: shaped({ name: text, values: fc.oneof(fc.dictionary(text, text), fc.constant({ Rs: "4.7k" }), text) }) },
  { method: "DELETE", path: "/api/networks/:networkId/value-sets/:setId", destructive: true },
  { method: "GET", path: "/api/dev/mail?limit=:page", anonymous: true },
  { method: "GET", path: "/dev/mailbox?limit=:page", anonymous: true },
  { method: "GET", path: "/api/dev/mail-queue", anonymous: true },
  { method: "GET", path: "/dev/mailbox.css", anonymous: true },
  { method: "GET", path: "/s/:token", anonymous: true },
  { method: "GET", path: "/api/health", anonymous: true },
  { method: "GET", path: "/api/openapi.json", anonymous: true },
];

// A team cell in the engine's own words: a resistor between its two terminals.
function cellDefinition(id: string) {
  return { id, title: "Fuzz cell", terminals: ["a", "b"], symbols: ["Rc"], elements: [{ name: "Rcell", kind: "resistor", nodes: ["a", "b"], value: "Rc" }] };
}

// What goes into a path slot: the fixture's real id (not for destructive routes), or something made up.
const slot = (name: string, real: string, destructive: boolean) =>
  // A wait the server would honour with a 202 would leave a solve running into the next request's snapshot.
  name === "wait" ? fc.constantFrom("60000", "-1", "abc", "1e99", "2.5") : fc.oneof(
    ...(destructive ? [] : [{ weight: 3, arbitrary: fc.constant(real) }]),
    { weight: 1, arbitrary: fc.uuid() },
    { weight: 1, arbitrary: fc.string({ maxLength: 12 }) },
    { weight: 1, arbitrary: fc.constantFrom("0", "-1", "99999999999", "..", "%00", "A".repeat(43), "%E0%A4%A") },
  );

function fillPath(template: string, values: Record<string, string>): string {
  return template.replace(/:([a-zA-Z]+)/g, (_, name: string) => {
    const given = values[name];
    // Real values are used as they are; made-up ones are sent percent-encoded (except deliberate broken escapes).
    return given.startsWith("%") ? given : encodeURIComponent(given);
  });
}

describe("fuzzing", () => {
  const world = {} as World;
  beforeAll(async () => {
    world.server = await startTestServer({ clientDir: clientShellDir(), solve: { timeLimitMs: 5_000 } });
    world.team = await teamWithEveryRole(world.server);
    const owner = world.team.clients.owner;
    const network = (await owner.post(`/api/teams/${world.team.teamId}/networks`, { title: "Fuzz target", circuit: followerCircuit })).body;
    world.networkId = network.id;
    world.slug = network.slug;
    const revision = (await owner.post(`/api/networks/${network.id}/solve`)).body;
    world.stepId = revision.steps[1].id;
    world.shareToken = (await owner.post(`/api/networks/${network.id}/revisions/1/share`, {})).body.token;
    world.commentId = (await owner.post(`/api/networks/${network.id}/revisions/1/comments`, { stepId: world.stepId, body: "Fuzz anchor" })).body.id;
    world.attachmentId = (await owner.upload(`/api/networks/${network.id}/attachments`, { name: "scope.pdf", type: "application/pdf", content: "%PDF-1.4\n%%EOF\n" })).body.id;
    const job = (await owner.post(`/api/networks/${network.id}/solve?wait=0`)).body.job;
    world.jobId = job.id;
    world.cellId = (await owner.post(`/api/teams/${world.team.teamId}/cells`, { definition: cellDefinition("fuzzcell") })).body.id;
    while ((await owner.get(job.poll)).body.status !== "done") await new Promise((resolve) => setTimeout(resolve, 50));
    // Two solves on a freshly started thread: room on a loaded machine.
  }, 120_000);
  afterAll(async () => {
    await world.server.close();
  });

  // Judges one answer: no 5xx, the one error shape, and for a refusal an untouched database. The
  // snapshot is taken just before the request, so only what this request wrote can differ.
  async function judge(what: string, request: () => Promise<ApiResponse>): Promise<ApiResponse> {
    const before = await snapshot(world);
    const response = await withinTime(request(), what);
    expect(response.status, `${what} → ${JSON.stringify(response.body).slice(0, 300)}`).toBeLessThan(500);
    // A solve past the server's wait (a loaded machine) answers 202 and writes its revision later.
    if (response.status === 202 && typeof response.body?.job?.poll === "string") await jobEnded(response.body.job.poll, what);
    if (response.status >= 400) {
      if ((response.headers.get("content-type") ?? "").includes("json")) {
        expect(response.body?.error, what).toEqual(expect.objectContaining({ code: expect.any(String), message: expect.any(String) }));
      }
      const now = await snapshot(world);
      const changed = Object.keys(before).filter((table) => before[table] !== now[table]);
      expect(changed, `${what} was refused with ${response.status} but changed these tables`).toEqual([]);
    }
    return response;
  }

  async function jobEnded(poll: string, what: string): Promise<void> {
    const deadline = Date.now() + answerWithinMs;
    while (Date.now() < deadline) {
      const status = (await world.team.clients.owner.get(poll)).body?.status;
      if (status === "done" || status === "failed") return;
      await new Promise((resolve) => setTimeout(resolve, 50));
    }
    throw new Error(`the job of ${what} did not end within ${answerWithinMs} ms`);
  }

  const importFile = (file: string, content: string) =>
    world.team.clients.editor.upload(`/api/teams/${world.team.teamId}/networks/import`, { name: file, type: file.endsWith(".json") ? "application/json" : "text/plain", content });

  it("reads random Portfold netlists and solves what it accepts, answering each with a 2xx or a 4xx", async () => {
    await fc.assert(
      fc.asyncProperty(randomNetlist, async (netlist) => {
        const imported = await judge(`import of ${JSON.stringify(netlist)}`, () => importFile("fuzzed.pfn", netlist));
        if (imported.status === 400) expect(imported.body.error.code).toBe("invalid_network_file");
        if (imported.status === 201) await judge(`solve of ${JSON.stringify(netlist)}`, () => world.team.clients.editor.post(`/api/networks/${imported.body.id}/solve`));
      }),
      // Found by this test: a line of only "=" once made the netlist reader throw (a 500).
      budget(120, [["="], [" = x"]]),
    );
  });

  it("reads mutated fixture files, text and JSON, without a server fault", async () => {
    await fc.assert(
      fc.asyncProperty(mutatedFixture, async ({ file, text }) => {
        const imported = await judge(`import of mutated ${file}: ${JSON.stringify(text).slice(0, 200)}`, () => importFile(file, text));
        if (imported.status === 400) expect(imported.body.error.diagnostics?.length ?? 0).toBeGreaterThan(0);
        if (imported.status === 201) await judge(`solve of mutated ${file}`, () => world.team.clients.editor.post(`/api/networks/${imported.body.id}/solve`));
      }),
      budget(100),
    );
  });

  it("takes mutated JSON circuits on create and solve", async () => {
    await fc.assert(
      fc.asyncProperty(mutatedCircuit, fc.boolean(), async (circuit, solveIt) => {
        const created = await judge(`create with ${JSON.stringify(circuit).slice(0, 200)}`, () => world.team.clients.editor.post(`/api/teams/${world.team.teamId}/networks`, { title: "Fuzzed circuit", circuit }));
        if (created.status === 201 && solveIt) await judge(`solve of ${JSON.stringify(circuit).slice(0, 200)}`, () => world.team.clients.editor.post(`/api/networks/${created.body.id}/solve`));
      }),
      budget(80),
    );
  });

  it("takes random files as attachments and as network imports: stored, or refused with a 4xx", async () => {
    const png = Buffer.from("iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mNkYPhfDwAChwGA60e6kgAAAABJRU5ErkJggg==", "base64");
    const content = fc.oneof(
      fc.uint8Array({ maxLength: 2_048 }).map((bytes) => Buffer.from(bytes)),
      fc.tuple(fc.constantFrom(png, Buffer.from("%PDF-1.4\n"), Buffer.from([0xff, 0xd8, 0xff, 0xe0])), fc.uint8Array({ maxLength: 64 })).map(([head, tail]) => Buffer.concat([head, Buffer.from(tail)])),
    );
    const name = fc.oneof(fc.constantFrom("scope.png", "datasheet.pdf", "photo.jpg", "net.pfn", "net.json", "noext", ".png", "a\u0000b.pdf"), fc.string({ maxLength: 12 }));
    const type = fc.constantFrom("image/png", "application/pdf", "image/jpeg", "text/plain", "application/json", "application/octet-stream", "");
    await fc.assert(
      fc.asyncProperty(content, name, type, fc.boolean(), async (bytes, filename, mime, asImport) => {
        const path = asImport ? `/api/teams/${world.team.teamId}/networks/import` : `/api/networks/${world.networkId}/attachments`;
        await judge(`upload of ${filename} (${mime}, ${bytes.length} bytes) to ${path}`, () => world.team.clients.owner.upload(path, { name: filename, type: mime, content: bytes }));
      }),
      budget(60),
    );
  });

  it("has a case for every route the server mounts", () => {
    const app = createApp({ pool: world.server.pool, db: world.server.db, clientDir: clientShellDir(), settings: { logLevel: "silent" } });
    // Parameter names aside (the fuzz fills slots by its own names), the two lists are the same.
    const shape = (route: string) => route.replace(/:[a-zA-Z]+/g, ":id");
    const fuzzed = new Set(routesFor(world).map((route) => shape(`${route.method} ${route.path.split("?")[0]}`)));
    expect([...fuzzed].sort()).toEqual([...new Set(mountedRoutes(app).map(shape))].sort());
  });

  it("answers random bodies and path ids on every route with a 2xx or a 4xx", async () => {
    const requestOn = (route: Route) => {
      const real: Record<string, string> = {
        teamId: world.team.teamId,
        userId: world.team.people.editor.user.id,
        invitationId: world.commentId,
        token: world.shareToken,
        networkId: world.networkId,
        slug: world.slug,
        number: "1",
        shareId: world.commentId,
        commentId: world.commentId,
        verdictId: world.commentId,
        attachmentId: world.attachmentId,
        setId: world.commentId,
        jobId: world.jobId,
        cellId: world.cellId,
        tokenId: world.commentId,
        q: "Fuzz",
        sort: "title",
        page: "1",
        wait: "60000",
      };
      const names = [...route.path.matchAll(/:([a-zA-Z]+)/g)].map((match) => match[1]);
      return fc.record({
        values: fc.record(Object.fromEntries(names.map((name) => [name, slot(name, real[name], route.destructive ?? false)]))) as fc.Arbitrary<Record<string, string>>,
        body: route.body ?? fc.constant(undefined),
        // Now and then a body that is not the JSON it claims to be.
        raw: fc.oneof({ weight: 7, arbitrary: fc.constant(null) }, { weight: 1, arbitrary: fc.constantFrom('{"name": ', "[1,2", "\u0000", "null", '"text"', "{}".repeat(50)) }),
      });
    };
    // Route by route, so each gets its own minimum number of cases; plain data only in each case,
    // so a counterexample prints as the request it was.
    for (const route of routesFor(world)) {
      const requests = requestOn(route).map((parts) => ({ route: { method: route.method, path: route.path, anonymous: route.anonymous ?? false }, ...parts }));
      let ran = 0;
      await fc.assert(
        fc.asyncProperty(requests, async ({ route, values, body, raw }) => {
          ran += 1;
          const path = fillPath(route.path, values);
          const client = route.anonymous ? new ApiClient(world.server.url) : world.team.clients.owner;
          const sendsBody = route.method !== "GET" && route.method !== "DELETE";
          const what = `${route.method} ${path} ${raw ?? JSON.stringify(body)?.slice(0, 200)}`;
          // A refused sign-up must not leave an account behind (accounts outside the fixture are not in the snapshot).
          const signupEmail = route.path === "/api/auth/signup" && typeof (body as { email?: unknown })?.email === "string" ? String((body as { email: string }).email).trim().toLowerCase() : null;
          const accounts = async () => (signupEmail === null ? 0 : (await world.server.pool.query("select 1 from users where email = $1", [signupEmail])).rowCount);
          const before = await accounts();
          const response = await judge(what, () =>
            raw !== null && sendsBody ? client.raw(route.method, path, raw) : client.request(route.method, path, sendsBody ? (body ?? {}) : undefined),
          );
          if (response.status >= 400) expect(await accounts(), `${what} left an account`).toBe(before);
        }),
        { numRuns: casesPerRoute },
      );
      expect(ran, `${route.method} ${route.path}`).toBeGreaterThanOrEqual(casesPerRoute);
    }
    // The fixture is still whole: destructive routes only ever saw ids that do not exist.
    expect((await world.team.clients.owner.get(`/api/networks/${world.networkId}/revisions/1`)).status).toBe(200);
  }, 600_000);
});
