import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";

function deleteValueSet({ networkId, setId }: { networkId: string; setId: string }) {
  return api<null>(`/networks/${encodeURIComponent(networkId)}/value-sets/${encodeURIComponent(setId)}`, { method: "DELETE" });
}

export function useDeleteValueSet() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: deleteValueSet, onSuccess: (_d, { networkId }) => queryClient.invalidateQueries({ queryKey: ["networks", networkId, "value-sets"] }) });
}
