import { z } from "zod";
import { HttpError, notFound } from "./errors.js";

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

// C0/C1 controls and the bidirectional overrides and isolates, which can make a name read as something else.
const controlsAndBidi = /[\u0000-\u001f\u007f-\u009f\u061c\u200e\u200f\u202a-\u202e\u2066-\u2069]/g;

/** A one-line name as people see it: without control or bidi characters, trimmed. */
export function withoutControls(text: string): string {
  return text.replace(controlsAndBidi, "").trim();
}

/** A name or title field: control and bidi characters dropped, then required and bounded. */
export const nameText = (max: number, required: string) =>
  z.string().transform(withoutControls).pipe(z.string().min(1, { error: required }).max(max, { error: `Use at most ${max} characters.` }));

// Text that reaches PostgreSQL from a query string or form field: no U+0000, which it cannot store.
export const plainText = (max: number) => z.string().trim().max(max).refine((text) => !text.includes("\u0000"), { error: "Contains a NUL character." });

export const emailField = z.string().trim().toLowerCase().pipe(z.email({ error: "Enter a valid e-mail address." })).pipe(z.string().max(254));
export const tokenField = z.string().regex(/^[A-Za-z0-9_-]{43}$/, { error: "This link is malformed." });
