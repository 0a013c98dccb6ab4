// What the domain refuses, in its own words: each refusal is a kind (not found, forbidden, conflict…)
// with a stable code and a message for people. server/lib/errors.ts turns each kind into its HTTP answer.

import { SolverStopped } from "../solver/pool.js";

export interface DomainErrorParts {
  // Which input is wrong and why, keyed by the input's name.
  fields?: Record<string, string>;
  // Engine diagnostics (code, message, line, column, elements) where the engine refused the input.
  diagnostics?: unknown[];
  // More members of the error object, e.g. the cap a solve went past.
  details?: Record<string, unknown>;
  // Seconds after which asking again may succeed.
  retryAfter?: number;
}

export type DomainErrorKind =
  | "invalid"
  | "unauthenticated"
  | "invalid_credentials"
  | "forbidden"
  | "not_found"
  | "conflict"
  | "unsupported_type"
  | "unprocessable"
  | "too_many"
  | "unavailable";

export abstract class DomainError extends Error {
  abstract readonly kind: DomainErrorKind;

  constructor(
    readonly code: string,
    message: string,
    readonly parts: DomainErrorParts = {},
  ) {
    super(message);
  }
}

// The base of each kind: a domain error whose kind is fixed.
function ofKind<K extends DomainErrorKind>(kind: K) {
  return class extends DomainError {
    readonly kind: K = kind;
  };
}

/** The input is not acceptable as it stands. */
export class Invalid extends ofKind("invalid") {}

/** Nobody is signed in, or the credential that was sent is unknown. */
export class Unauthenticated extends ofKind("unauthenticated") {
  // `bearer`: a bearer credential was refused, so the answer names the bearer scheme.
  constructor(code: string, message: string, readonly bearer = false) {
    super(code, message);
  }
}

/** An e-mail address and password that do not match an account. */
export class InvalidCredentials extends ofKind("invalid_credentials") {
  constructor() {
    super("invalid_credentials", "That e-mail address and password do not match an account.");
  }
}

/** The acting person may not do this. */
export class Forbidden extends ofKind("forbidden") {}

/** The thing does not exist, or the acting person may not know that it does. */
export class NotFound extends ofKind("not_found") {}

/** The request clashes with the state things are in. */
export class Conflict extends ofKind("conflict") {}

/** A file whose type Portfold does not take here. */
export class UnsupportedType extends ofKind("unsupported_type") {}

/** Well-formed input that Portfold cannot carry out: it goes past a cap or cannot be solved. */
export class Unprocessable extends ofKind("unprocessable") {}

/** The acting person or team is at a limit for now. */
export class TooMany extends ofKind("too_many") {}

/** A part of the service this needs is not available right now. */
export class Unavailable extends ofKind("unavailable") {}

export const notFound = (what = "That") => new NotFound("not_found", `${what} was not found.`);
export const forbidden = (message = "Your role in this team does not allow this.") => new Forbidden("forbidden", message);
export const signInRequired = () => new Unauthenticated("unauthenticated", "Sign in to continue.");

/** For a solver call's catch: a stopping solver's refusal as the domain's 503, anything else as it was. */
export function rethrowSolverStopped(error: unknown): never {
  throw error instanceof SolverStopped ? new Unavailable("solver_stopped", "The server is stopping; solve again in a moment.", { retryAfter: 5 }) : error;
}
