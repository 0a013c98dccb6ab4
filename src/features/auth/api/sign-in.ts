import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { LoginRequest, UserAnswer } from "@/lib/api-contract";

function signIn(input: LoginRequest) {
  return api<UserAnswer>("/auth/login", { method: "POST", json: input });
}

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    onSuccess: () => queryClient.resetQueries(),
  });
}
