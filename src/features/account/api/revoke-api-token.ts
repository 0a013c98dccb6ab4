import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";

function revokeApiToken(tokenId: string) {
  return api<null>(`/account/tokens/${tokenId}`, { method: "DELETE" });
}

export function useRevokeApiToken() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: revokeApiToken, onSuccess: () => queryClient.invalidateQueries({ queryKey: ["api-tokens"] }) });
}
