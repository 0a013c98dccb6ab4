import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { PasswordResetConfirmRequest, UserAnswer } from "@/lib/api-contract";

function resetPassword(input: PasswordResetConfirmRequest) {
  return api<UserAnswer>("/auth/password-reset/confirm", { method: "POST", json: input });
}

// The server signs the account in with the new password, so everything cached is refetched.
export function useResetPassword() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: resetPassword, onSuccess: () => queryClient.resetQueries() });
}
