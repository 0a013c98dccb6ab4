import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { Circuit } from "@/types/api";

export interface UpdateNetworkInput {
  networkId: string;
  title?: string;
  description?: string;
  circuit?: Circuit;
}

export function updateNetwork({ networkId, ...input }: UpdateNetworkInput) {
  return api<unknown>(`/networks/${encodeURIComponent(networkId)}`, { method: "PATCH", json: input });
}

export function useUpdateNetwork() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateNetwork,
    onSuccess: (_data, { networkId }) => queryClient.invalidateQueries({ queryKey: ["networks", networkId] }),
  });
}
