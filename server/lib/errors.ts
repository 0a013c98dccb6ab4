import type { ErrorRequestHandler, RequestHandler } from "express";

// The one error shape of the API: { error: { code, message, fields?, diagnostics? } }.
export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: Record<string, string>,
    // Engine diagnostics (code, message, line, column, elements) where the engine refused the input.
    readonly diagnostics?: unknown[],
    // More members of the error object (e.g. the cap a solve went past) and headers (Retry-After).
    readonly extra: { details?: Record<string, unknown>; headers?: Record<string, string> } = {},
  ) {
    super(message);
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
