import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";

export function verifyEmail(input: { token: string }) {
  return api<unknown>("/auth/verify-email", { method: "POST", json: input });
}

export function useVerifyEmail() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: verifyEmail, onSuccess: () => queryClient.invalidateQueries({ queryKey: ["me"] }) });
}
