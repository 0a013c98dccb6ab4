import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { Circuit, Network, PatchNetworkRequest } from "@/lib/api-contract";

// The circuit sent is the engine's network; `expectedUpdatedAt` is the copy being edited: a later save by someone else answers 409 `stale`.
export type UpdateNetworkInput = Omit<PatchNetworkRequest, "circuit"> & { networkId: string; circuit?: Circuit };

function updateNetwork({ networkId, ...input }: UpdateNetworkInput) {
  return api<Network>(`/networks/${encodeURIComponent(networkId)}`, { method: "PATCH", json: input });
}

export function useUpdateNetwork() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateNetwork,
    onSuccess: (network) => queryClient.setQueryData(["networks", network.id], network),
  });
}
