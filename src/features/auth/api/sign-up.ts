import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";

export interface SignUpInput {
  email: string;
  password: string;
  name: string;
}

export function signUp(input: SignUpInput) {
  return api<unknown>("/auth/signup", { method: "POST", json: input });
}

export function useSignUp() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signUp,
    onSuccess: () => queryClient.resetQueries(),
  });
}
