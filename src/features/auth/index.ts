export { useMe } from "./api/get-me";
export { useRequestPasswordReset } from "./api/request-password-reset";
export { useResetPassword } from "./api/reset-password";
export { useSignIn } from "./api/sign-in";
export { useSignOut } from "./api/sign-out";
export { useSignUp } from "./api/sign-up";
export { useVerifyEmail } from "./api/verify-email";
export { RequireAccount, safeNext } from "./components/require-account";
export { VerifyEmailBanner } from "./components/verify-email-banner";
