import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";

export function revokeShareLink({ networkId, k, shareId }: { networkId: string; k: number; shareId: string }) {
  return api<null>(`/networks/${encodeURIComponent(networkId)}/revisions/${k}/share/${encodeURIComponent(shareId)}`, { method: "DELETE" });
}

export function useRevokeShareLink() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: revokeShareLink,
    onSuccess: (_data, { networkId, k }) => queryClient.invalidateQueries({ queryKey: ["networks", networkId, "revisions", k, "shares"] }),
  });
}
