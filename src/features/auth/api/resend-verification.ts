import { useMutation } from "@tanstack/react-query";
import { api } from "@/lib/api-client";

export function resendVerification() {
  return api<{ sent: boolean }>("/auth/verify-email/resend", { method: "POST" });
}

export function useResendVerification() {
  return useMutation({ mutationFn: resendVerification });
}
