import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";

function revokeShareLink({ networkId, number, shareId }: { networkId: string; number: number; shareId: string }) {
  return api<null>(`/networks/${encodeURIComponent(networkId)}/revisions/${number}/share/${encodeURIComponent(shareId)}`, { method: "DELETE" });
}

export function useRevokeShareLink() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: revokeShareLink,
    onSuccess: (_data, { networkId, number }) => queryClient.invalidateQueries({ queryKey: ["networks", networkId, "revisions", number, "shares"] }),
  });
}
