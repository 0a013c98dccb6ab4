import { Router } from "express";
import {
  emailLinkRequest as tokenBody,
  loginRequest as loginBody,
  passwordResetConfirmRequest as resetBody,
  passwordResetRequest as resetRequestBody,
  settingsRequest as settingsBody,
  signupRequest as signupBody,
} from "../../shared/api/accounts.js";
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
import { parseBody } from "../lib/validate.js";

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
