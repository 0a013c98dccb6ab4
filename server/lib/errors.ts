import type { ErrorRequestHandler, RequestHandler } from "express";

// The one error shape of the API: { error: { code, message, fields? } }.
export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: Record<string, string>,
  ) {
    super(message);
  }
}

export const notFoundApi: RequestHandler = (req, _res, next) => {
  next(new HttpError(404, "not_found", `No API route ${req.method} ${req.path}`));
};

export const errorHandler: ErrorRequestHandler = (error, _req, res, _next) => {
  if (error instanceof HttpError) {
    res.status(error.status).json({ error: { code: error.code, message: error.message, ...(error.fields ? { fields: error.fields } : {}) } });
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
  console.error(error);
  res.status(500).json({ error: { code: "internal", message: "Something went wrong on the server." } });
};
