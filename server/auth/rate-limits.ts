import type { RequestHandler } from "express";
import { rateLimit } from "express-rate-limit";
import type { AppSettings } from "../config.js";
import { HttpError } from "../lib/errors.js";

const minutes = (n: number) => n * 60_000;

// The one answer that means "wrong e-mail address or password" (domain/accounts.ts signIn).
const wrongCredentials = 401;

function limiter(windowMs: number, limit: number, options: { failuresOnly?: boolean } = {}): RequestHandler {
  return rateLimit({
    windowMs,
    limit,
    skipSuccessfulRequests: options.failuresOnly ?? false,
    // Only wrong credentials count as failures: a 503 while the database is away, or a malformed body, does not.
    requestWasSuccessful: (_req, res) => res.statusCode !== wrongCredentials,
    standardHeaders: "draft-8",
    legacyHeaders: false,
    // X-Forwarded-For is ignored on purpose unless TRUST_PROXY is set (README, Scaling); no warning for it.
    validate: { xForwardedForHeader: false },
    handler: (_req, _res, next) => next(new HttpError(429, "rate_limited", "Too many attempts; wait a few minutes and try again.")),
  });
}

// Per client address (the memory store is per process; see README on running several servers).
export function createRateLimits(limits: AppSettings["limits"]) {
  return {
    // Only wrong credentials count, so a team behind one address is not locked out by its own use.
    login: limiter(minutes(15), limits.loginFailuresPer15Min, { failuresOnly: true }),
    // Asking for a mail (reset link, new verification link) and using a reset link count apart.
    mailRequest: limiter(minutes(15), limits.passwordResetsPer15Min),
    passwordReset: limiter(minutes(15), limits.passwordResetsPer15Min),
    signup: limiter(minutes(60), limits.signupsPerHour),
  };
}

export type RateLimits = ReturnType<typeof createRateLimits>;
