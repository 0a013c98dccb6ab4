import { useMutation } from "@tanstack/react-query";
import { api } from "@/lib/api-client";

export function requestPasswordReset(input: { email: string }) {
  return api<unknown>("/auth/password-reset", { method: "POST", json: input });
}

export function useRequestPasswordReset() {
  return useMutation({ mutationFn: requestPasswordReset });
}
