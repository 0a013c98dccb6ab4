import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { ValueSet } from "@/types/api";

export function saveValueSet({ networkId, name, values }: { networkId: string; name: string; values: Record<string, string> }) {
  return api<ValueSet>(`/networks/${encodeURIComponent(networkId)}/value-sets`, { method: "POST", json: { name, values } });
}

export function useSaveValueSet() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: saveValueSet, onSuccess: (_d, { networkId }) => queryClient.invalidateQueries({ queryKey: ["networks", networkId, "value-sets"] }) });
}
