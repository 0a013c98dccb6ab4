import type { RequestHandler, Response } from "express";
import { verifyRequestOrigin, type Session, type User } from "lucia";
import { signInRequired } from "../domain/errors.js";
import { HttpError } from "../lib/errors.js";
import { sessionIdOf, type Auth } from "./lucia.js";

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Locals {
      user: User | null;
      session: Session | null;
    }
  }
}

// Reads the session cookie on every API request; renews it when lucia extends the session.
export function loadSession(auth: Auth): RequestHandler {
  return async (req, res, next) => {
    res.locals.user = null;
    res.locals.session = null;
    const token = auth.readSessionCookie(req.headers.cookie ?? "");
    if (!token) return next();
    const { session, user } = await auth.validateSession(sessionIdOf(token));
    if (!session) {
      res.appendHeader("Set-Cookie", auth.createBlankSessionCookie().serialize());
      return next();
    }
    // The cookie keeps the token; session.id is only its hash.
    if (session.fresh) res.appendHeader("Set-Cookie", auth.createSessionCookie(token).serialize());
    res.locals.user = user;
    res.locals.session = session;
    next();
  };
}

// Cross-site request forgery guard: a state-changing request must come from our own origin.
export function checkOrigin(publicUrl: string): RequestHandler {
  const safe = new Set(["GET", "HEAD", "OPTIONS"]);
  return (req, _res, next) => {
    if (safe.has(req.method)) return next();
    const origin = req.headers.origin ?? req.headers.referer ?? "";
    const allowed = [publicUrl, req.headers.host ?? ""].filter((entry) => entry !== "");
    if (!verifyRequestOrigin(origin, allowed)) {
      return next(new HttpError(403, "origin_mismatch", "This request did not come from Portfold's own pages."));
    }
    next();
  };
}

export function signedInUser(res: Response): User {
  const user = res.locals.user;
  if (!user) throw signInRequired();
  return user;
}

export function setSessionCookie(res: Response, auth: Auth, token: string): void {
  res.appendHeader("Set-Cookie", auth.createSessionCookie(token).serialize());
}

export function clearSessionCookie(res: Response, auth: Auth): void {
  res.appendHeader("Set-Cookie", auth.createBlankSessionCookie().serialize());
}
