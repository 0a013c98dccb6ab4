import type { ErrorRequestHandler, RequestHandler } from "express";
import { DomainError, Unauthenticated, type DomainErrorKind } from "../domain/errors.js";

const quotedMax = 40;
const messageMax = 300;

/**
 * An error message that quotes the input keeps only a short excerpt of it: a quoted stretch over 40
 * characters is cut with "…", the whole message at 300, so an answer never echoes a large body back.
 */
function excerpt(message: string): string {
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

const statusOfKind: Record<DomainErrorKind, number> = {
  invalid: 400,
  unauthenticated: 401,
  invalid_credentials: 401,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  unsupported_type: 415,
  unprocessable: 422,
  too_many: 429,
  unavailable: 503,
};

/** The HTTP answer to a domain refusal: its kind's status, its parts in the body, Retry-After and WWW-Authenticate. */
function httpErrorOf(error: DomainError): HttpError {
  const { fields, diagnostics, details, retryAfter } = error.parts;
  const headers: Record<string, string> = {};
  if (retryAfter !== undefined) headers["Retry-After"] = String(retryAfter);
  if (error instanceof Unauthenticated && error.bearer) headers["WWW-Authenticate"] = `Bearer error="${error.code}"`;
  return new HttpError(statusOfKind[error.kind], error.code, error.message, fields, diagnostics, { details, headers });
}

/** What a failed solve job keeps: the status and error the request would have had; null for a fault of the server. */
export function failureRecord(error: unknown): Record<string, unknown> | null {
  const http = error instanceof DomainError ? httpErrorOf(error) : error instanceof HttpError ? error : null;
  return http && { status: http.status, ...http.body() };
}

/** The answer a failed solve job's record stands for. */
export function recordedFailure(record: unknown): HttpError {
  const { status, code, message, fields, diagnostics, ...details } = (record ?? {}) as Record<string, unknown>;
  return new HttpError(
    typeof status === "number" ? status : 500,
    typeof code === "string" ? code : "internal",
    typeof message === "string" ? message : "The solve failed on the server.",
    fields as Record<string, string> | undefined,
    diagnostics as unknown[] | undefined,
    { details },
  );
}

export const notFoundApi: RequestHandler = (req, _res, next) => {
  next(new HttpError(404, "not_found", `No API route ${req.method} ${req.path}`));
};

const databaseUnavailableError = () =>
  new HttpError(503, "database_unavailable", "The database is not reachable right now, so this request was not carried out and nothing was saved; try again in a few seconds.", undefined, undefined, {
    headers: { "Retry-After": "5" },
  });

// PostgreSQL SQLSTATE classes and node errors that mean "the database is not reachable right now".
const unavailableCodes = new Set(["ECONNREFUSED", "ECONNRESET", "ETIMEDOUT", "57P01", "57P02", "57P03", "08000", "08001", "08003", "08006"]);

function databaseUnavailable(error: unknown): boolean {
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
  const answer = error instanceof DomainError ? httpErrorOf(error) : error;
  if (answer instanceof HttpError) {
    res.set(answer.extra.headers ?? {});
    res.status(answer.status).json({ error: answer.body() });
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
