import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { CreatedShare, ShareRequest } from "@/lib/api-contract";

type CreateShareLinkInput = ShareRequest & { networkId: string; number: number };

function createShareLink({ networkId, number, expiresAt }: CreateShareLinkInput) {
  return api<CreatedShare>(`/networks/${encodeURIComponent(networkId)}/revisions/${number}/share`, { method: "POST", json: expiresAt ? { expiresAt } : {} });
}

export function useCreateShareLink() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createShareLink,
    onSuccess: (_data, { networkId, number }) => queryClient.invalidateQueries({ queryKey: ["networks", networkId, "revisions", number, "shares"] }),
  });
}
