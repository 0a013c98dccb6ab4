import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";

export function duplicateNetwork({ networkId, title }: { networkId: string; teamId: string; title?: string }) {
  return api<{ id: string }>(`/networks/${encodeURIComponent(networkId)}/duplicate`, { method: "POST", json: title ? { title } : {} });
}

export function useDuplicateNetwork() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: duplicateNetwork,
    onSuccess: (_data, { teamId }) => queryClient.invalidateQueries({ queryKey: ["teams", teamId, "networks"] }),
  });
}
