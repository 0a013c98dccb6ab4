import { queryOptions, useQuery } from "@tanstack/react-query";

// The parts of an OpenAPI 3.1 document the reference page reads.
export interface JsonSchema {
  $ref?: string;
  type?: string | string[];
  properties?: Record<string, JsonSchema>;
  required?: string[];
  items?: JsonSchema;
  enum?: unknown[];
  anyOf?: JsonSchema[];
  oneOf?: JsonSchema[];
  allOf?: JsonSchema[];
  format?: string;
  minimum?: number;
  maximum?: number;
  minLength?: number;
  maxLength?: number;
  default?: unknown;
  description?: string;
  additionalProperties?: boolean | JsonSchema;
}

interface Content {
  [mediaType: string]: { schema?: JsonSchema };
}

export interface Operation {
  tags?: string[];
  summary?: string;
  description?: string;
  parameters?: { name: string; in: string; required?: boolean; schema?: JsonSchema }[];
  requestBody?: { content: Content };
  responses: Record<string, { description: string; content?: Content }>;
  "x-token-scope"?: "read" | "solve";
}

export interface OpenApiDocument {
  openapi: string;
  info: { title: string; version: string; description?: string };
  paths: Record<string, Record<string, Operation>>;
  components?: { schemas?: Record<string, JsonSchema> };
}

// The document is the server's own (GET /api/openapi.json), generated from the contract in shared/api.
async function getOpenApi(): Promise<OpenApiDocument> {
  const response = await fetch("/api/openapi.json", { headers: { Accept: "application/json" } });
  if (!response.ok) throw new Error(`The API description could not be loaded (${response.status}).`);
  return response.json();
}

const openApiQueryOptions = () => queryOptions({ queryKey: ["openapi"], queryFn: getOpenApi, staleTime: Infinity });

export function useOpenApi() {
  return useQuery(openApiQueryOptions());
}
