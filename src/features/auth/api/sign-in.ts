import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";

export interface SignInInput {
  email: string;
  password: string;
}

export function signIn(input: SignInInput) {
  return api<unknown>("/auth/login", { method: "POST", json: input });
}

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    onSuccess: () => queryClient.resetQueries(),
  });
}
