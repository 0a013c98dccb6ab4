import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { SaveValueSetRequest, ValueSet } from "@/lib/api-contract";

function saveValueSet({ networkId, name, values }: SaveValueSetRequest & { networkId: string }) {
  return api<ValueSet>(`/networks/${encodeURIComponent(networkId)}/value-sets`, { method: "POST", json: { name, values } });
}

export function useSaveValueSet() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: saveValueSet, onSuccess: (_d, { networkId }) => queryClient.invalidateQueries({ queryKey: ["networks", networkId, "value-sets"] }) });
}
