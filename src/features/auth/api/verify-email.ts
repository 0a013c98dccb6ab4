import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { EmailLinkRequest, UserAnswer } from "@/lib/api-contract";

function verifyEmail(input: EmailLinkRequest) {
  return api<UserAnswer>("/auth/verify-email", { method: "POST", json: input });
}

export function useVerifyEmail() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: verifyEmail, onSuccess: () => queryClient.invalidateQueries({ queryKey: ["me"] }) });
}
