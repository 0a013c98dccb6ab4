import type { ErrorRequestHandler, RequestHandler } from "express";

const quotedMax = 40;
const messageMax = 300;

/**
 * An error message that quotes the input keeps only a short excerpt of it: a quoted stretch over 40
 * characters is cut with "…", the whole message at 300, so an answer never echoes a large body back.
 */
export function excerpt(message: string): string {
  const short = message.replace(/"([^"]{41,})"/g, (_all, quoted: string) => `"${quoted.slice(0, quotedMax)}…"`);
  return short.length > messageMax ? `${short.slice(0, messageMax - 1)}…` : short;
}

function shortDiagnostic(item: unknown): unknown {
  if (!item || typeof item !== "object") return item;
  const d = item as { message?: unknown; elements?: unknown; nodes?: unknown };
  const cut = (name: unknown) => (typeof name === "string" && name.length > quotedMax ? `${name.slice(0, quotedMax)}…` : name);
  const names = (list: unknown[]) => list.slice(0, 20).map(cut);
  return {
    ...d,
    ...(typeof d.message === "string" ? { message: excerpt(d.message) } : {}),
    ...(Array.isArray(d.elements) ? { elements: names(d.elements) } : {}),
    ...(Array.isArray(d.nodes) ? { nodes: names(d.nodes) } : {}),
  };
}

// The one error shape of the API: { error: { code, message, fields?, diagnostics? } }.
export class HttpError extends Error {
  readonly fields?: Record<string, string>;
  // Engine diagnostics (code, message, line, column, elements) where the engine refused the input.
  readonly diagnostics?: unknown[];

  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    fields?: Record<string, string>,
    diagnostics?: unknown[],
    // More members of the error object (e.g. the cap a solve went past) and headers (Retry-After).
    readonly extra: { details?: Record<string, unknown>; headers?: Record<string, string> } = {},
  ) {
    super(excerpt(message));
    this.fields = fields && Object.fromEntries(Object.entries(fields).slice(0, 50).map(([key, text]) => [excerpt(key), excerpt(text)]));
    this.diagnostics = diagnostics?.slice(0, 50).map(shortDiagnostic);
  }

  /** The `error` member of the answer, also what a solve job keeps when it fails. */
  body(): Record<string, unknown> {
    return {
      code: this.code,
      message: this.message,
      ...(this.fields ? { fields: this.fields } : {}),
      ...(this.diagnostics ? { diagnostics: this.diagnostics } : {}),
      ...this.extra.details,
    };
  }
}

export const notFound = (what = "That") => new HttpError(404, "not_found", `${what} was not found.`);
export const forbidden = (message = "Your role in this team does not allow this.") => new HttpError(403, "forbidden", message);

export const notFoundApi: RequestHandler = (req, _res, next) => {
  next(new HttpError(404, "not_found", `No API route ${req.method} ${req.path}`));
};

export const databaseUnavailableError = () =>
  new HttpError(503, "database_unavailable", "The database is not reachable right now, so this request was not carried out and nothing was saved; try again in a few seconds.", undefined, undefined, {
    headers: { "Retry-After": "5" },
  });

// PostgreSQL SQLSTATE classes and node errors that mean "the database is not reachable right now".
const unavailableCodes = new Set(["ECONNREFUSED", "ECONNRESET", "ETIMEDOUT", "57P01", "57P02", "57P03", "08000", "08001", "08003", "08006"]);

export function databaseUnavailable(error: unknown): boolean {
  const code = (error as { code?: unknown })?.code;
  const message = String((error as { message?: unknown })?.message ?? "");
  return (typeof code === "string" && unavailableCodes.has(code)) || message.includes("timeout exceeded when trying to connect")
    || message.includes("Connection terminated");
}

export const errorHandler: ErrorRequestHandler = (error, req, res, _next) => {
  if (res.headersSent) {
    res.end();
    return;
  }
  if (error instanceof HttpError) {
    res.set(error.extra.headers ?? {});
    res.status(error.status).json({ error: error.body() });
    return;
  }
  const status = typeof error?.status === "number" ? error.status : 500;
  if (error?.type === "entity.parse.failed") {
    res.status(400).json({ error: { code: "invalid_json", message: "The request body is not valid JSON." } });
    return;
  }
  if (error?.type === "entity.too.large") {
    res.status(413).json({ error: { code: "too_large", message: "The request body is too large." } });
    return;
  }
  if (status >= 400 && status < 500) {
    res.status(status).json({ error: { code: "bad_request", message: String(error?.message ?? "Bad request") } });
    return;
  }
  if (databaseUnavailable(error) || databaseUnavailable(error?.cause)) {
    const unavailable = databaseUnavailableError();
    res.set(unavailable.extra.headers ?? {});
    res.status(503).json({ error: unavailable.body() });
    return;
  }
  (req.log ?? console).error({ err: error }, "unhandled error");
  res.status(500).json({ error: { code: "internal", message: "Something went wrong on the server." } });
};
