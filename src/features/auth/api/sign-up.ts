import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { SignupRequest, UserAnswer } from "@/lib/api-contract";

function signUp(input: SignupRequest) {
  return api<UserAnswer>("/auth/signup", { method: "POST", json: input });
}

export function useSignUp() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signUp,
    onSuccess: () => queryClient.resetQueries(),
  });
}
