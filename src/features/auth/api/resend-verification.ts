import { useMutation } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { SentAnswer } from "@/lib/api-contract";

function resendVerification() {
  return api<SentAnswer>("/auth/verify-email/resend", { method: "POST" });
}

export function useResendVerification() {
  return useMutation({ mutationFn: resendVerification });
}
