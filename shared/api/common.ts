// What every resource of the API shares: roles, verdicts, the error shape, and the text fields that reach PostgreSQL.
import { z } from "zod";

export const roles = ["owner", "editor", "reviewer", "viewer"] as const;
export type Role = (typeof roles)[number];

const roleRank: Record<Role, number> = { viewer: 0, reviewer: 1, editor: 2, owner: 3 };

/** Whether a role may do what `minimum` may: owner > editor > reviewer > viewer. The server decides; the client mirrors it. */
export function roleAtLeast(role: Role, minimum: Role): boolean {
  return roleRank[role] >= roleRank[minimum];
}

export const verdicts = ["open", "approved", "needs_changes"] as const;
export type Verdict = (typeof verdicts)[number];

export const isoTime = z.iso.datetime({ offset: true });

// A JSON value whose shape the engine owns and judges (a circuit, a solve's results, diagnostics): checked here as the
// schema given, typed as the engine's own type for whoever reads it.
export const engineShaped = <T>(schema: z.ZodType) => schema as unknown as z.ZodType<T>;
export const person = z.object({ id: z.string(), name: z.string() }).meta({ id: "Person" });

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
// E-mailed link tokens are 32 random bytes in base64url: exactly 43 characters.
export const tokenField = z.string().regex(/^[A-Za-z0-9_-]{43}$/, { error: "This link is malformed." });

// The one error shape of the API.
export const errorBody = z
  .object({
    error: z
      .object({
        code: z.string(),
        message: z.string(),
        fields: z.record(z.string(), z.string()).optional(),
        diagnostics: z.array(z.unknown()).optional(),
      })
      .loose(),
  })
  .meta({ id: "Error" });

// A revision's review state, derived from its verdict history: who decided it and when (the latest change request,
// or the approval that completed the count), and how many of the team's required approvals stand.
export const revisionState = z
  .object({ verdict: z.enum(verdicts), by: person.nullable(), at: isoTime.nullable(), approvals: z.number().int(), requiredApprovals: z.number().int() })
  .meta({ id: "RevisionState" });
