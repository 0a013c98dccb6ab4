import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { DuplicateNetworkRequest, Network } from "@/lib/api-contract";

function duplicateNetwork({ networkId, title }: DuplicateNetworkRequest & { networkId: string; teamId: string }) {
  return api<Network>(`/networks/${encodeURIComponent(networkId)}/duplicate`, { method: "POST", json: title ? { title } : {} });
}

export function useDuplicateNetwork() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: duplicateNetwork,
    onSuccess: (_data, { teamId }) => queryClient.invalidateQueries({ queryKey: ["teams", teamId, "networks"] }),
  });
}
