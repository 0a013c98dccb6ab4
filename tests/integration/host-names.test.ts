// DNS rebinding: an attacker's page on a name that resolves to 127.0.0.1 sends requests whose Host is
// that name. The server answers only to PUBLIC_URL's name and loopback names; the development mailbox
// (reset links!) only to loopback names. Host is a forbidden header for fetch, so node:http sends it.
import { request } from "node:http";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startTestServer, type TestServer } from "../support/server.js";

function get(url: string, path: string, host: string): Promise<{ status: number; body: string }> {
  const { hostname, port } = new URL(url);
  return new Promise((resolve, reject) => {
    const req = request({ hostname, port, path, method: "GET", headers: { Host: host } }, (res) => {
      let body = "";
      res.on("data", (chunk) => (body += chunk));
      res.on("end", () => resolve({ status: res.statusCode ?? 0, body }));
    });
    req.on("error", reject);
    req.end();
  });
}

describe("host names the server answers to", () => {
  let server: TestServer;
  let port: string;
  beforeAll(async () => {
    server = await startTestServer({ settings: { production: false } });
    port = new URL(server.url).port;
  });
  afterAll(async () => {
    await server.close();
  });

  it("refuses a rebound name on the API and the mailbox, and answers loopback names", async () => {
    const rebound = `rebind.example.test:${port}`;
    const api = await get(server.url, "/api/me", rebound);
    expect(api.status).toBe(421);
    expect(JSON.parse(api.body).error.code).toBe("host_not_allowed");
    expect((await get(server.url, "/api/dev/mail", rebound)).status).toBe(421);
    expect((await get(server.url, "/dev/mailbox", rebound)).status).toBe(421);
    for (const name of [`localhost:${port}`, `127.0.0.1:${port}`]) {
      expect((await get(server.url, "/api/dev/mail", name)).status).toBe(200);
      expect((await get(server.url, "/api/me", name)).status).toBe(401);
    }
    // Health answers any name: load balancers probe by address.
    expect((await get(server.url, "/api/health", rebound)).status).toBe(200);
  });

  it("keeps the mailbox to loopback names even when PUBLIC_URL names another host", async () => {
    const named = await startTestServer({ settings: { production: false, publicUrl: "http://portfold.example.test" } });
    try {
      const namedPort = new URL(named.url).port;
      expect((await get(named.url, "/api/me", `portfold.example.test:${namedPort}`)).status).toBe(401);
      expect((await get(named.url, "/api/dev/mail", `portfold.example.test:${namedPort}`)).status).toBe(404);
      expect((await get(named.url, "/api/dev/mail", `localhost:${namedPort}`)).status).toBe(200);
    } finally {
      await named.close();
    }
  });
});
