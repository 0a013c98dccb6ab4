import { useMutation } from "@tanstack/react-query";
import { api } from "@/lib/api-client";

export function resetPassword(input: { token: string; password: string }) {
  return api<unknown>("/auth/password-reset/confirm", { method: "POST", json: input });
}

export function useResetPassword() {
  return useMutation({ mutationFn: resetPassword });
}
