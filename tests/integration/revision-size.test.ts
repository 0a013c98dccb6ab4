// A revision's stored size has a bound in bytes: past it, the largest optional parts are left out
// with a statement saying so; the share page's preview text stays a line or two.
import { randomBytes } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { streamAbove } from "../../server/lib/json-stream.js";
import { ApiClient } from "../support/api.js";
import { signedInPerson, type Person } from "../support/fixtures.js";
import { resistorChain } from "../support/networks.js";
import { clientShellDir, startTestServer, type TestServer } from "../support/server.js";

describe("revision size bound and share previews", () => {
  let server: TestServer;
  let editor: Person;
  let teamId: string;
  // A digit between letters: a name's TeX sets trailing digits as a subscript only when letters come
  // before them and nothing else does, so a bare hex suffix made the ledger's size (and what the
  // bound leaves out) depend on the draw. A 0, then letters: always the whole name in one piece, six characters as the hex was.
  const letters = () => randomBytes(3).toString("hex").replace(/[0-9]/g, (d) => "ghijklmnop"[Number(d)]).slice(0, 3);
  const run = `0${letters()}${letters()}`.slice(0, 6);
  beforeAll(async () => {
    server = await startTestServer({ clientDir: clientShellDir(), solve: { maxRevisionBytes: 60_000 } });
    editor = await signedInPerson(server, "sizer");
    teamId = (await editor.client.post("/api/teams", { name: "Size bench" })).body.id;
  });
  afterAll(async () => {
    await server.close();
  });

  it("leaves out the largest optional parts past REVISION_MAX_BYTES, and says so", async () => {
    // Sixteen links with two symbols each: the sensitivities to 33 symbols dwarf the equivalents.
    const circuit = resistorChain(16, (i) => `Ra${run}${i} + Rb${run}${i}`);
    const networkId = (await editor.client.post(`/api/teams/${teamId}/networks`, { title: "Wide chain", circuit })).body.id;
    const solved = await editor.client.post(`/api/networks/${networkId}/solve`);
    expect(solved.status, JSON.stringify(solved.body).slice(0, 300)).toBe(201);
    const { results, steps, circuit: stored, diagnostics } = solved.body;
    expect(Buffer.byteLength(JSON.stringify({ results, steps, stored, diagnostics }))).toBeLessThanOrEqual(60_000 + 2_000);
    expect(results.omitted.length).toBeGreaterThan(0);
    expect(results.omitted[0]).toMatchObject({ bytes: expect.any(Number), reason: expect.stringContaining("REVISION_MAX_BYTES") });
    for (const kept of ["vth", "rth", "isc"]) expect(results[kept]).toBeTruthy();

    // The share page's description is a preview, not the result.
    const share = await editor.client.post(`/api/networks/${networkId}/revisions/1/share`, {});
    const page = await new ApiClient(server.url).get(`/s/${share.body.token}`);
    expect(page.status).toBe(200);
    const description = /<meta name="description" content="([^"]*)"/.exec(page.body as string)![1];
    expect(description.length).toBeLessThanOrEqual(300 + 50);
    expect((page.body as string).length).toBeLessThan(20_000);

    // A ledger this size is written as a stream of chunks (no Content-Length; the event loop runs
    // between chunks), and reads back as the same revision the solve answered, signed in and shared.
    const ledgerChars = steps.reduce((sum: number, step: { tex: string; explanation: string }) => sum + step.tex.length + step.explanation.length, 0);
    expect(ledgerChars).toBeGreaterThan(streamAbove);
    for (const [path, client] of [[`/api/networks/${networkId}/revisions/1`, editor.client], [`/api/share/${share.body.token}`, new ApiClient(server.url)]] as const) {
      const read = await fetch(`${server.url}${path}`, { headers: client.cookie ? { Cookie: client.cookie } : {} });
      expect(read.status).toBe(200);
      expect(read.headers.get("content-type")).toMatch(/^application\/json/);
      expect(read.headers.get("content-length")).toBeNull();
      const body = await read.json();
      const revision = path.startsWith("/api/share") ? body.revision : body;
      expect(revision.steps).toEqual(steps);
      expect(revision.results).toEqual(results);
    }
  });
});
