import { z } from "zod";
import { notFound } from "../domain/errors.js";
import { HttpError } from "./errors.js";

// zod at the edge: a body that does not fit is a 400 with one message per field.
export function parseBody<T extends z.ZodType>(schema: T, body: unknown): z.output<T> {
  const result = schema.safeParse(body ?? {});
  if (result.success) return result.data;
  const fields: Record<string, string> = {};
  for (const issue of result.error.issues) {
    const key = issue.path.length ? issue.path.join(".") : "body";
    fields[key] ??= issue.message;
  }
  throw new HttpError(400, "invalid_body", "Some fields are missing or invalid.", fields);
}

export function parseQuery<T extends z.ZodType>(schema: T, query: unknown): z.output<T> {
  const result = schema.safeParse(query ?? {});
  if (result.success) return result.data;
  const fields: Record<string, string> = {};
  for (const issue of result.error.issues) fields[issue.path.join(".") || "query"] ??= issue.message;
  throw new HttpError(400, "invalid_query", "Some query parameters are invalid.", fields);
}

const uuidPattern = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

// An id in a path that cannot exist is simply "not found", never a database error.
export function idParam(value: unknown, what = "That"): string {
  if (typeof value !== "string" || !uuidPattern.test(value)) throw notFound(what);
  return value.toLowerCase();
}

export function revisionNumberParam(value: unknown): number {
  if (typeof value !== "string" || !/^[1-9][0-9]{0,8}$/.test(value)) throw notFound("That revision");
  return Number(value);
}

// Tokens are 32 random bytes in base64url: exactly 43 characters.
export function tokenParam(value: unknown, what = "That link"): string {
  if (typeof value !== "string" || !/^[A-Za-z0-9_-]{43}$/.test(value)) throw notFound(what);
  return value;
}

export { withoutControls } from "../../shared/api/common.js";
