// The one API client: JSON in and out, the server's error shape turned into ApiError.
import type { Diagnostic } from "@/lib/api-contract";

export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: Record<string, string>,
    // The engine's diagnostics when it refused a circuit or a file (line and column for text).
    readonly diagnostics?: Diagnostic[],
  ) {
    super(message);
  }
}

export async function api<T>(path: string, init: RequestInit & { json?: unknown } = {}): Promise<T> {
  const { json, headers, ...rest } = init;
  let response: Response;
  try {
    response = await fetch(`/api${path}`, {
      credentials: "same-origin",
      ...rest,
      headers: { Accept: "application/json", ...(json === undefined ? {} : { "Content-Type": "application/json" }), ...headers },
      body: json === undefined ? rest.body : JSON.stringify(json),
    });
  } catch {
    throw new ApiError(0, "network_error", "The server could not be reached. Check the connection and try again.");
  }
  const body = response.status === 204 ? null : await response.json().catch(() => null);
  if (!response.ok) {
    const error = body?.error;
    throw new ApiError(
      response.status,
      error?.code ?? "http_error",
      error?.message ?? `Request failed (${response.status})`,
      error?.fields,
      Array.isArray(error?.diagnostics) ? error.diagnostics : undefined,
    );
  }
  return body as T;
}
