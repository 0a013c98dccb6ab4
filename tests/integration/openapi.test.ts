// The contract: the OpenAPI document generated from shared/api names exactly the routes the server mounts,
// validates against the OpenAPI 3.1 schema (an independent validator from npm), and is what the server serves.
import { Validator } from "@seriousme/openapi-schema-validator";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { roles as sharedRoles, verdicts as sharedVerdicts } from "../../shared/api/common.js";
import { createApp } from "../../server/app.js";
import { roles, verdicts } from "../../server/db/schema.js";
import { openApiDocument } from "../../server/lib/openapi.js";
import { ApiClient } from "../support/api.js";
import { mountedRoutes } from "../support/routes.js";
import { clientShellDir, startTestServer, type TestServer } from "../support/server.js";

interface Document {
  openapi: string;
  paths: Record<string, Record<string, unknown>>;
}

describe("the API contract", () => {
  let server: TestServer;
  beforeAll(async () => {
    server = await startTestServer({ clientDir: clientShellDir() });
  });
  afterAll(async () => {
    await server.close();
  });

  it("documents every route the server mounts under /api, and nothing else", () => {
    const app = createApp({ pool: server.pool, db: server.db, clientDir: clientShellDir(), settings: { logLevel: "silent" } });
    const mounted = mountedRoutes(app).filter((route) => route.split(" ")[1].startsWith("/api/"));
    const document = openApiDocument() as Document;
    const documented = Object.entries(document.paths).flatMap(([path, operations]) =>
      Object.keys(operations).map((method) => `${method.toUpperCase()} ${path.replace(/\{([a-zA-Z]+)\}/g, ":$1")}`),
    );
    expect(new Set(documented).size).toBe(documented.length);
    expect(documented.sort()).toEqual([...new Set(mounted)].sort());
  });

  it("is a valid OpenAPI 3.1 document", async () => {
    const document = openApiDocument() as Document;
    expect(document.openapi).toBe("3.1.0");
    const result = await new Validator().validate(structuredClone(document) as unknown as Record<string, unknown>);
    expect(result.errors ?? []).toEqual([]);
    expect(result.valid).toBe(true);
  });

  it("is served at GET /api/openapi.json to anyone", async () => {
    const served = await new ApiClient(server.url, { origin: null }).get("/api/openapi.json");
    expect(served.status).toBe(200);
    expect(served.body).toEqual(JSON.parse(JSON.stringify(openApiDocument())));
  });

  it("keeps the role and verdict lists of the contract and the database equal", () => {
    expect([...sharedRoles]).toEqual([...roles]);
    expect([...sharedVerdicts]).toEqual([...verdicts]);
  });
});
