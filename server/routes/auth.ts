import { Router } from "express";
import { z } from "zod";
import type { RateLimits } from "../auth/rate-limits.js";
import { clearSessionCookie, setSessionCookie, signedInUser } from "../auth/session.js";
import {
  accountOverview,
  requestPasswordReset,
  resetPassword,
  sendVerification,
  signIn,
  signUp,
  startSession,
  updateAccountSettings,
  verifyEmail,
} from "../domain/accounts.js";
import type { Services } from "../domain/services.js";
import { emailField, parseBody, tokenField } from "../lib/validate.js";

// NIST SP 800-63B: at least 8 characters, allow at least 64; longer is cut off to bound hashing cost.
const password = z.string().min(8, { error: "Use at least 8 characters." }).max(256, { error: "Use at most 256 characters." });
const name = z.string().trim().min(1, { error: "Enter your name." }).max(100);

const signupBody = z.object({ email: emailField, password, name });
const loginBody = z.object({ email: emailField, password: z.string().min(1).max(256) });
const tokenBody = z.object({ token: tokenField });
const resetRequestBody = z.object({ email: emailField });
const resetBody = z.object({ token: tokenField, password });
const settingsBody = z.object({ reviewMail: z.boolean() });

export function authRouter(services: Services, limits: RateLimits): Router {
  const router = Router();
  const { auth, db } = services;

  router.post("/auth/signup", limits.signup, async (req, res) => {
    const input = parseBody(signupBody, req.body);
    const user = await signUp(services, input);
    setSessionCookie(res, auth, await startSession(services, user.id));
    res.status(201).json({ user });
  });

  router.post("/auth/login", limits.login, async (req, res) => {
    const { email, password } = parseBody(loginBody, req.body);
    const user = await signIn(db, email, password);
    setSessionCookie(res, auth, await startSession(services, user.id));
    res.json({ user });
  });

  router.post("/auth/logout", async (_req, res) => {
    if (res.locals.session) await auth.invalidateSession(res.locals.session.id);
    clearSessionCookie(res, auth);
    res.status(204).end();
  });

  router.post("/auth/verify-email", async (req, res) => {
    const { token } = parseBody(tokenBody, req.body);
    res.json({ user: await verifyEmail(db, token) });
  });

  router.post("/auth/verify-email/resend", limits.mailRequest, async (_req, res) => {
    const { user } = await accountOverview(db, signedInUser(res).id);
    if (!user.emailVerified) await sendVerification(services, user);
    res.status(202).json({ sent: !user.emailVerified });
  });

  router.post("/auth/password-reset", limits.mailRequest, async (req, res) => {
    const { email } = parseBody(resetRequestBody, req.body);
    requestPasswordReset(services, email);
    res.status(202).json({ sent: true });
  });

  router.post("/auth/password-reset/confirm", limits.passwordReset, async (req, res) => {
    const { token, password } = parseBody(resetBody, req.body);
    const user = await resetPassword(services, token, password);
    setSessionCookie(res, auth, await startSession(services, user.id));
    res.json({ user });
  });

  router.get("/me", async (_req, res) => {
    res.json(await accountOverview(db, signedInUser(res).id));
  });

  router.patch("/me/settings", async (req, res) => {
    const user = signedInUser(res);
    res.json({ settings: await updateAccountSettings(db, user.id, parseBody(settingsBody, req.body)) });
  });

  return router;
}
