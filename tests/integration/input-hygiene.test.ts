// What a stored name or title may hold, what an error may echo, and what becomes of a solve job whose
// server stopped. Control and bidi characters: Unicode Technical Report #36 (Security Considerations),
// the bidi overrides U+202A–U+202E and isolates U+2066–U+2069 — common practice to drop from names.
import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { solveJobs } from "../../server/db/schema.js";
import { failInterruptedJobs } from "../../server/domain/solve-jobs.js";
import { followerCircuit, signedInPerson, type Person } from "../support/fixtures.js";
import { startTestServer, type TestServer } from "../support/server.js";

// PNG signature and a 1×1 image (ISO/IEC 15948).
const png = Buffer.from("iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mNkYPhfDwAChwGA60e6kgAAAABJRU5ErkJggg==", "base64");
const loadNetlist = "port out 0\nRload resistor out 0 = Rl\n";

describe("names, titles, excerpts and interrupted jobs", () => {
  let server: TestServer;
  let editor: Person;
  let teamId: string;
  let networkId: string;
  beforeAll(async () => {
    server = await startTestServer();
    editor = await signedInPerson(server, "hygienist");
    teamId = (await editor.client.post("/api/teams", { name: "Hygiene bench" })).body.id;
    networkId = (await editor.client.post(`/api/teams/${teamId}/networks`, { title: "Attachments", circuit: followerCircuit })).body.id;
  });
  afterAll(async () => {
    await server.close();
  });

  it("drops control and bidi characters from team names, and refuses a name of nothing else", async () => {
    const team = await editor.client.post("/api/teams", { name: "Bench\u0007 \u202eLab\u2066" });
    expect(team.status).toBe(201);
    expect(team.body.name).toBe("Bench Lab");
    const empty = await editor.client.post("/api/teams", { name: "\u202e\u0008 " });
    expect(empty.status).toBe(400);
    expect(empty.body.error.fields.name).toBeTruthy();
  });

  it("names an attachment with the extension of its sniffed type, without bidi tricks", async () => {
    // "scope\u202Egnp.html" shows as "scopelmth.png" in a bidi-aware list.
    const posted = await editor.client.upload(`/api/networks/${networkId}/attachments`, { name: "scope\u202egnp.html", type: "image/png", content: png });
    expect(posted.status).toBe(201);
    expect(posted.body.filename).toBe("scopegnp.png");
    const kept = await editor.client.upload(`/api/networks/${networkId}/attachments`, { name: "bode plot.PNG", type: "image/png", content: png });
    expect(kept.status, JSON.stringify(kept.body)).toBe(201);
    expect(kept.body.filename).toBe("bode plot.png");
  });

  it("holds imported titles to the 200-character limit of every title", async () => {
    const longName = `${"load-".repeat(70)}.pfn`;
    const fromName = await editor.client.upload(`/api/teams/${teamId}/networks/import`, { name: longName, type: "text/plain", content: loadNetlist });
    expect(fromName.status).toBe(201);
    expect(fromName.body.title.length).toBeLessThanOrEqual(200);
    const given = await editor.client.upload(`/api/teams/${teamId}/networks/import`, { name: "load.pfn", type: "text/plain", content: loadNetlist }, { title: "t".repeat(201) });
    expect(given.status).toBe(400);
    expect(given.body.error.fields.title).toBeTruthy();
  });

  it("accepts the same quantity names in JSON as the netlist's quantity line", async () => {
    const circuit = (quantities: Record<string, string>) => ({ port: { plus: "out", minus: "0" }, elements: [{ name: "Rload", kind: "resistor", nodes: ["out", "0"], value: "Rl" }], quantities });
    expect((await editor.client.post(`/api/teams/${teamId}/networks`, { title: "Named", circuit: circuit({ Rl: "resistance" }) })).status).toBe(201);
    // "R l" cannot be written on a quantity line, so JSON refuses it too.
    const spaced = await editor.client.post(`/api/teams/${teamId}/networks`, { title: "Spaced", circuit: circuit({ "R l": "resistance" }) });
    expect(spaced.status).toBe(400);
    const text = await editor.client.upload(`/api/teams/${teamId}/networks/import`, { name: "q.pfn", type: "text/plain", content: `${loadNetlist}quantity Rl resistance\n` });
    expect(text.status).toBe(201);
  });

  it("echoes no more than a short excerpt of a large bad input", async () => {
    const huge = "n".repeat(20_000);
    const netlist = `port out 0\nRload resistor out ${huge}- = Rl\n`;
    const answer = await editor.client.upload(`/api/teams/${teamId}/networks/import`, { name: "bad.pfn", type: "text/plain", content: netlist });
    expect(answer.status).toBe(400);
    expect(answer.body.error.diagnostics.length).toBeGreaterThan(0);
    expect(JSON.stringify(answer.body).length).toBeLessThan(2_000);
    const json = await editor.client.post(`/api/teams/${teamId}/networks`, { title: "Bad", circuit: { port: { plus: "out", minus: "0" }, elements: [{ name: `${huge}!`, kind: "resistor", nodes: ["out", "0"], value: "1" }] } });
    expect(json.status).toBe(400);
    expect(JSON.stringify(json.body).length).toBeLessThan(2_000);
  });

  it("fails a job its server left unfinished as soon as that server starts again", async () => {
    const runner = `crashed-${Date.now()}`;
    const [mine] = await server.db.insert(solveJobs).values({ networkId, requestedBy: editor.user.id, status: "solving", startedAt: new Date(), runner }).returning();
    const [other] = await server.db.insert(solveJobs).values({ networkId, requestedBy: editor.user.id, status: "queued", runner: `${runner}-elsewhere` }).returning();
    expect(await failInterruptedJobs(server.db, runner)).toBe(1);
    const polled = await editor.client.get(`/api/networks/${networkId}/solve-jobs/${mine.id}`);
    expect(polled.body).toMatchObject({ status: "failed", error: { code: "solve_interrupted" } });
    const [untouched] = await server.db.select().from(solveJobs).where(and(eq(solveJobs.id, other.id)));
    expect(untouched.status).toBe("queued");
  });
});
