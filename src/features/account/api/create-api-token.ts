import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { CreateTokenRequest, CreatedToken } from "@/lib/api-contract";

function createApiToken(input: CreateTokenRequest) {
  return api<CreatedToken>("/account/tokens", { method: "POST", json: input });
}

export function useCreateApiToken() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: createApiToken, onSuccess: () => queryClient.invalidateQueries({ queryKey: ["api-tokens"] }) });
}
