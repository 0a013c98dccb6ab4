// The OpenAPI 3.1 document of the API, generated from the contract's table (shared/api/routes.ts) and its zod schemas.
import { OpenAPIRegistry, OpenApiGeneratorV31 } from "@asteasolutions/zod-to-openapi";
import { z } from "zod";
import { errorBody } from "../../shared/api/common.js";
import { endpoints, type Endpoint } from "../../shared/api/routes.js";

const statusText: Record<number, string> = { 200: "OK", 201: "Created", 202: "Accepted: the solve goes on as a job", 204: "No content", 503: "The database cannot be reached" };

function parameters(path: string) {
  const names = [...path.matchAll(/:([a-zA-Z]+)/g)].map((m) => m[1]);
  return names.length ? z.object(Object.fromEntries(names.map((name) => [name, z.string()]))) : undefined;
}

function operation(endpoint: Endpoint) {
  const responses: Record<string, { description: string; content?: Record<string, { schema: z.ZodType | object }> }> = {};
  for (const [status, answer] of Object.entries(endpoint.answers)) {
    const description = statusText[Number(status)] ?? "Answer";
    if (answer === null) responses[status] = { description };
    else if ("contentType" in answer && typeof answer.contentType === "string") responses[status] = { description, content: { [answer.contentType]: { schema: {} } } };
    else responses[status] = { description, content: { "application/json": { schema: answer as z.ZodType } } };
  }
  responses.default = { description: "An error, in the one error shape", content: { "application/json": { schema: errorBody } } };
  const access = endpoint.access === "public" ? "Open to anyone." : endpoint.token ? `Session, or an API token with the ${endpoint.token === "solve" ? "read + solve" : "read"} scope.` : "Browser session only.";
  return {
    method: endpoint.method.toLowerCase() as "get" | "post" | "patch" | "put" | "delete",
    path: endpoint.path.replace(/:([a-zA-Z]+)/g, "{$1}"),
    tags: [endpoint.tag],
    summary: endpoint.summary,
    description: access,
    ...(endpoint.access === "signed-in" ? { security: (endpoint.token ? [{ session: [] }, { token: [] }] : [{ session: [] }]) as Record<string, string[]>[] } : {}),
    ...(endpoint.token ? { "x-token-scope": endpoint.token } : {}),
    request: {
      params: parameters(endpoint.path) as z.ZodObject | undefined,
      query: endpoint.query as z.ZodObject | undefined,
      body: endpoint.body
        ? { content: { "application/json": { schema: endpoint.body } }, required: true }
        : endpoint.upload
          ? { content: { "multipart/form-data": { schema: z.object({ file: z.string().meta({ format: "binary" }), title: z.string().optional() }) } }, required: true }
          : undefined,
    },
    responses,
  };
}

let built: object | null = null;

export function openApiDocument(): object {
  if (built) return built;
  const registry = new OpenAPIRegistry();
  registry.registerComponent("securitySchemes", "session", { type: "apiKey", in: "cookie", name: "portfold_session" });
  registry.registerComponent("securitySchemes", "token", { type: "http", scheme: "bearer", description: "A personal API token (pft_…), made on the account page." });
  for (const endpoint of endpoints) registry.registerPath(operation(endpoint));
  built = new OpenApiGeneratorV31(registry.definitions).generateDocument({
    openapi: "3.1.0",
    info: {
      title: "Portfold API",
      version: "1",
      description: "JSON over HTTP under /api. Errors have one shape: { error: { code, message, fields?, diagnostics? } }. Results are linear, small-signal idealisations.",
    },
    servers: [{ url: "/" }],
  });
  return built;
}
