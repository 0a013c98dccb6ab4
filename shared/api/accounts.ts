// Accounts: sign-up, sign-in, e-mail verification, password reset, and who is signed in.
import { z } from "zod";
import { emailField, roles, tokenField } from "./common.js";

// NIST SP 800-63B: at least 8 characters, allow at least 64; longer is cut off to bound hashing cost.
const password = z.string().min(8, { error: "Use at least 8 characters." }).max(256, { error: "Use at most 256 characters." });
const name = z.string().trim().min(1, { error: "Enter your name." }).max(100);

export const signupRequest = z.object({ email: emailField, password, name }).meta({ id: "SignupRequest" });
export const loginRequest = z.object({ email: emailField, password: z.string().min(1).max(256) }).meta({ id: "LoginRequest" });
export const emailLinkRequest = z.object({ token: tokenField }).meta({ id: "EmailLinkRequest" });
export const passwordResetRequest = z.object({ email: emailField }).meta({ id: "PasswordResetRequest" });
export const passwordResetConfirmRequest = z.object({ token: tokenField, password }).meta({ id: "PasswordResetConfirmRequest" });

export const settingsRequest = z.object({ reviewMail: z.boolean() }).meta({ id: "SettingsRequest" });

const user = z.object({ id: z.string(), email: z.string(), name: z.string(), emailVerified: z.boolean() }).meta({ id: "User" });
export const userAnswer = z.object({ user }).meta({ id: "UserAnswer" });
const teamMembership = z.object({ id: z.uuid(), name: z.string(), role: z.enum(roles), personal: z.boolean() }).meta({ id: "TeamMembership" });
const accountSettings = z.object({ reviewMail: z.boolean() }).meta({ id: "AccountSettings" });
export const settingsAnswer = z.object({ settings: accountSettings }).meta({ id: "SettingsAnswer" });
export const me = z.object({ user, teams: z.array(teamMembership), settings: accountSettings }).meta({ id: "Me" });
export const sentAnswer = z.object({ sent: z.boolean() }).meta({ id: "SentAnswer" });
