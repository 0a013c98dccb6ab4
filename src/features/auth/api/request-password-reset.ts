import { useMutation } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { PasswordResetRequest, SentAnswer } from "@/lib/api-contract";

function requestPasswordReset(input: PasswordResetRequest) {
  return api<SentAnswer>("/auth/password-reset", { method: "POST", json: input });
}

export function useRequestPasswordReset() {
  return useMutation({ mutationFn: requestPasswordReset });
}
