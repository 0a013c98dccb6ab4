import type { RequestHandler } from "express";
import { rateLimit } from "express-rate-limit";
import type { AppSettings } from "../config.js";
import { HttpError } from "../lib/errors.js";

const minutes = (n: number) => n * 60_000;

function limiter(windowMs: number, limit: number, options: { failuresOnly?: boolean } = {}): RequestHandler {
  return rateLimit({
    windowMs,
    limit,
    skipSuccessfulRequests: options.failuresOnly ?? false,
    standardHeaders: "draft-8",
    legacyHeaders: false,
    handler: (_req, _res, next) => next(new HttpError(429, "rate_limited", "Too many attempts; wait a few minutes and try again.")),
  });
}

// Per client address (the memory store is per process; see README on running several servers).
export function createRateLimits(limits: AppSettings["limits"]) {
  return {
    // Only failed sign-ins count, so a team behind one address is not locked out by its own use.
    login: limiter(minutes(15), limits.loginFailuresPer15Min, { failuresOnly: true }),
    // Asking for a mail (reset link, new verification link) and using a reset link count apart.
    mailRequest: limiter(minutes(15), limits.passwordResetsPer15Min),
    passwordReset: limiter(minutes(15), limits.passwordResetsPer15Min),
    signup: limiter(minutes(60), limits.signupsPerHour),
  };
}

export type RateLimits = ReturnType<typeof createRateLimits>;
