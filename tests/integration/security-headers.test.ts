// Security headers and logs: a Content-Security-Policy the built client lives within (checked in
// chromium), the JSON body limit, request ids, and logs without cookies, tokens or passwords.
import { rmSync } from "node:fs";
import { Writable } from "node:stream";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { sessionCookieName } from "../../server/auth/lucia.js";
import { createLogger } from "../../server/lib/logging.js";
import { launchBrowser, type TestBrowser } from "../support/browser.js";
import { buildClient, type ClientBuild } from "../support/client-build.js";
import { followerCircuit, signedInPerson } from "../support/fixtures.js";
import { clientShellDir, startTestServer, type TestServer } from "../support/server.js";

function directives(header: string | null): Record<string, string> {
  return Object.fromEntries((header ?? "").split(";").filter(Boolean).map((part) => {
    const [name, ...values] = part.trim().split(/\s+/);
    return [name, values.join(" ")];
  }));
}

function logSink() {
  const lines: string[] = [];
  const sink = new Writable({
    write(chunk, _encoding, done) {
      lines.push(String(chunk));
      done();
    },
  });
  return { lines, logger: createLogger("info", sink) };
}

describe("security headers", () => {
  let server: TestServer;
  beforeAll(async () => {
    server = await startTestServer({ clientDir: clientShellDir(), settings: { jsonBodyBytes: 2_048 } });
  });
  afterAll(async () => {
    await server.close();
  });

  it("sends one policy on pages and API answers: own origin only, style attributes allowed for KaTeX", async () => {
    for (const path of ["/", "/api/health", "/api/no-such-route"]) {
      const response = await fetch(`${server.url}${path}`);
      const csp = directives(response.headers.get("content-security-policy"));
      expect(csp).toEqual({
        "default-src": "'self'",
        "base-uri": "'self'",
        "connect-src": "'self'",
        "font-src": "'self'",
        "form-action": "'self'",
        "frame-ancestors": "'none'",
        "img-src": "'self'",
        "manifest-src": "'self'",
        "object-src": "'none'",
        "script-src": "'self'",
        "script-src-attr": "'none'",
        "style-src": "'self' 'unsafe-inline'",
        "style-src-elem": "'self'",
        "style-src-attr": "'unsafe-inline'",
        "worker-src": "'self'",
      });
      expect(response.headers.get("x-content-type-options")).toBe("nosniff");
      expect(response.headers.get("x-frame-options")).toBe("DENY");
      expect(response.headers.get("referrer-policy")).toBe("no-referrer");
      // Plain http on loopback in development: no HSTS, no upgrade of requests.
      expect(response.headers.get("strict-transport-security")).toBeNull();
      expect(response.headers.get("x-powered-by")).toBeNull();
    }
  });

  it("adds HSTS and upgrade-insecure-requests in production", async () => {
    const production = await startTestServer({ clientDir: clientShellDir(), settings: { production: true } });
    try {
      const response = await fetch(`${production.url}/`);
      expect(response.headers.get("strict-transport-security")).toMatch(/max-age=\d+/);
      expect(directives(response.headers.get("content-security-policy"))).toHaveProperty("upgrade-insecure-requests", "");
    } finally {
      await production.close();
    }
  });

  it("refuses a JSON body over JSON_MAX_BYTES with 413 in the one error shape", async () => {
    const person = await signedInPerson(server, "bulky");
    const response = await person.client.post("/api/teams", { name: "x".repeat(4_096) });
    expect(response.status).toBe(413);
    expect(response.body.error).toEqual({ code: "too_large", message: expect.any(String) });
  });
});

describe("logs", () => {
  it("keep a request id (the caller's, when it sends a sane one) and answer with it", async () => {
    const { lines, logger } = logSink();
    const server = await startTestServer({ logger });
    try {
      const given = await fetch(`${server.url}/api/health`, { headers: { "X-Request-Id": "lb-7f3a-0001" } });
      expect(given.headers.get("x-request-id")).toBe("lb-7f3a-0001");
      const hostile = await fetch(`${server.url}/api/health`, { headers: { "X-Request-Id": "a b\"<script>" } });
      const made = hostile.headers.get("x-request-id")!;
      expect(made).toMatch(/^[0-9a-f-]{36}$/);
      const ids = lines.map((line) => JSON.parse(line)).filter((entry) => entry.req).map((entry) => entry.req.id);
      expect(ids).toEqual(expect.arrayContaining(["lb-7f3a-0001", made]));
    } finally {
      await server.close();
    }
  });

  it("never carry cookies, authorization headers, passwords, tokens, or a failed query's parameters", async () => {
    const { lines, logger } = logSink();
    const server = await startTestServer({ logger });
    const secretName = `Team name that must stay out of logs ${Date.now()}`;
    await server.pool.query(`
      create or replace function refuse_secret_team() returns trigger language plpgsql as $$
      begin
        if new.name like 'Team name that must stay out of logs%' then raise exception 'injected failure'; end if;
        return new;
      end $$;
      create trigger refuse_secret_team before insert on teams for each row execute function refuse_secret_team();`);
    try {
      const person = await signedInPerson(server, "logged");
      // A proxy's credentials pass beside the session; a Bearer header would be taken as an API token.
      const failed = await person.client.post("/api/teams", { name: secretName }, { Authorization: "Basic bearer-secret-value" });
      expect(failed.status).toBe(500);
      expect(JSON.stringify(failed.body)).not.toMatch(/injected|insert into|\bat\b.*\.ts/);
      logger.info({ req: { headers: { cookie: "portfold_session=cookie-secret", authorization: "Basic basic-secret" } }, body: { password: "password-secret", token: "token-secret" } }, "direct");
      const log = lines.join("");
      expect(log).toContain("insert into");
      expect(log).toContain("params: [redacted]");
      for (const secret of [secretName, "bearer-secret-value", person.client.cookie!.split("=")[1], "cookie-secret", "basic-secret", "password-secret", "token-secret"]) {
        expect(log).not.toContain(secret);
      }
    } finally {
      await server.pool.query("drop trigger refuse_secret_team on teams; drop function refuse_secret_team();");
      await server.close();
    }
  });
});

describe("the built client under its policy, in chromium", () => {
  let build: ClientBuild;
  let server: TestServer;
  let browser: TestBrowser;
  beforeAll(async () => {
    build = await buildClient();
    server = await startTestServer({ clientDir: build.dir });
    browser = await launchBrowser();
  }, 120_000);
  afterAll(async () => {
    await browser?.close();
    await server?.close();
    if (build) rmSync(build.dir, { recursive: true, force: true });
  });

  it("keeps first-load JS within 350 kB gzip, with KaTeX and uPlot in lazy chunks only", () => {
    const { report } = build;
    expect(report.firstLoadGzipBytes).toBeLessThanOrEqual(350_000);
    for (const name of ["KaTeX", "uPlot"]) {
      const library = report.libraries.find((entry) => entry.name === name)!;
      expect(library.chunks.length, `${name} is in the bundle`).toBeGreaterThan(0);
      expect(library.lazy, `${name} is loaded eagerly through ${library.eagerChain?.join(" → ")}`).toBe(true);
    }
  });

  it("renders pages with KaTeX, the shared view and the fonts without a single policy violation", async () => {
    const person = await signedInPerson(server, "csp");
    const teamId = (await person.client.post("/api/teams", { name: "Policy lab" })).body.id;
    const network = (await person.client.post(`/api/teams/${teamId}/networks`, { title: "Follower under the policy", circuit: followerCircuit })).body;
    await person.client.post(`/api/networks/${network.id}/solve`);
    const { token } = (await person.client.post(`/api/networks/${network.id}/revisions/1/share`, {})).body;
    await browser.context.addCookies([{ name: sessionCookieName, value: person.client.cookie!.split("=")[1], url: server.url }]);
    await browser.context.addInitScript(() => {
      document.addEventListener("securitypolicyviolation", (event) => {
        console.error(`policy violation: ${event.violatedDirective} blocked ${event.blockedURI} in ${event.sourceFile}`);
      });
    });

    const violations: string[] = [];
    const failedAssets: string[] = [];
    const page: Page = await browser.context.newPage();
    page.on("console", (message) => {
      if (/policy violation|Content Security Policy/i.test(message.text())) violations.push(`${page.url()}: ${message.text()}`);
    });
    page.on("response", (response) => {
      if (response.url().includes("/assets/") && response.status() !== 200) failedAssets.push(`${response.status()} ${response.url()}`);
    });
    const fonts: string[] = [];
    page.on("requestfinished", (request) => {
      if (request.resourceType() === "font") fonts.push(request.url());
    });

    await page.goto(`${server.url}/`, { waitUntil: "networkidle" });
    await page.goto(`${server.url}/teams/${teamId}`, { waitUntil: "networkidle" });
    for (const path of [`/networks/${network.id}`, `/n/${network.slug}/r/1`, `/s/${token}`]) {
      await page.goto(`${server.url}${path}`, { waitUntil: "networkidle" });
      await page.locator(".katex").first().waitFor({ timeout: 20_000 });
    }
    // The client sets zod jitless (src/main.tsx), so not even zod's eval probe is refused.
    expect(violations).toEqual([]);
    expect(failedAssets).toEqual([]);
    expect(fonts.some((url) => /KaTeX_/.test(url))).toBe(true);
    expect(fonts.every((url) => url.startsWith(`${server.url}/assets/`))).toBe(true);
  });
});
