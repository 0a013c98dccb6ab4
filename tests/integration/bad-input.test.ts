// Malformed requests are the client's fault: a 4xx in the one error shape, never a 500.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { ApiClient } from "../support/api.js";
import { followerCircuit, signedInPerson, type Person } from "../support/fixtures.js";
import { startTestServer, type TestServer } from "../support/server.js";

describe("bad input", () => {
  let server: TestServer;
  let editor: Person;
  let teamId: string;
  let networkId: string;
  beforeAll(async () => {
    server = await startTestServer();
    editor = await signedInPerson(server, "fuzzer");
    teamId = (await editor.client.post("/api/teams", { name: "Bad input lab" })).body.id;
    networkId = (await editor.client.post(`/api/teams/${teamId}/networks`, { title: "Target", circuit: followerCircuit })).body.id;
    await editor.client.post(`/api/networks/${networkId}/solve`);
  });
  afterAll(async () => {
    await server.close();
  });

  const raw = (method: string, path: string, body: string, type = "application/json") =>
    editor.client.request(method, path, body, { "Content-Type": type }).catch(() => ({ status: 0, body: null }));

  it("answers each malformed request with the 4xx it deserves", async () => {
    const cases: [string, Promise<{ status: number; body: any }>, number][] = [
      ["truncated JSON", raw("POST", "/api/teams", '{"name": "x'), 400],
      ["JSON array body", editor.client.post("/api/teams", ["x"]), 400],
      ["object where text belongs", editor.client.post("/api/teams", { name: { $gt: "" } }), 400],
      ["NUL in a title", editor.client.post(`/api/teams/${teamId}/networks`, { title: "a\u0000b", circuit: followerCircuit }), 400],
      ["NUL in a key of the circuit", editor.client.post(`/api/teams/${teamId}/networks`, { title: "ok", circuit: { ...followerCircuit, "x\u0000": 1 } }), 400],
      ["NUL in a search", editor.client.get(`/api/teams/${teamId}/networks?q=%00`), 400],
      ["repeated query parameter", editor.client.get(`/api/teams/${teamId}/networks?page=1&page=2`), 400],
      ["page zero", editor.client.get(`/api/teams/${teamId}/networks?page=0`), 400],
      ["broken percent-encoding in a path", editor.client.get("/api/networks/%E0%A4%A"), 400],
      ["huge revision number", editor.client.get(`/api/networks/${networkId}/revisions/99999999999`), 404],
      ["negative revision number", editor.client.get(`/api/networks/${networkId}/revisions/-1`), 404],
      ["body over the JSON limit", editor.client.post("/api/teams", { name: "x".repeat(300 * 1024) }), 413],
      ["text/plain body", raw("POST", "/api/teams", "name=x", "text/plain"), 400],
      ["expiry that is not a date", editor.client.post(`/api/networks/${networkId}/revisions/1/share`, { expiresAt: "tomorrow" }), 400],
      ["comment on a step id that is an object", editor.client.post(`/api/networks/${networkId}/revisions/1/comments`, { stepId: { id: 1 }, body: "x" }), 400],
      ["reply to a parent that is not a uuid", editor.client.post(`/api/networks/${networkId}/revisions/1/comments`, { stepId: "port", body: "x", parentId: "1" }), 400],
      ["multipart without a boundary", raw("POST", `/api/networks/${networkId}/attachments`, "--x--", "multipart/form-data"), 400],
      ["stale timestamp that is not a timestamp", editor.client.patch(`/api/networks/${networkId}`, { title: "x", expectedUpdatedAt: "yesterday" }), 400],
      ["invitation with an unknown role", editor.client.post(`/api/teams/${teamId}/invitations`, { email: "a@example.test", role: "admin" }), 400],
      ["login with a number for a password", new ApiClient(server.url).post("/api/auth/login", { email: "a@example.test", password: 12345678 }), 400],
    ];
    const results = await Promise.all(cases.map(async ([name, request, expected]) => ({ name, expected, response: await request })));
    for (const { name, expected, response } of results) {
      expect(response.status, name).toBe(expected);
      expect(response.body?.error, name).toEqual(expect.objectContaining({ code: expect.any(String), message: expect.any(String) }));
    }
  });
});
