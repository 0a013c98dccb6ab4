import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";

function deleteNetwork({ networkId }: { networkId: string; teamId: string }) {
  return api<null>(`/networks/${encodeURIComponent(networkId)}`, { method: "DELETE" });
}

export function useDeleteNetwork() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteNetwork,
    onSuccess: (_data, { teamId, networkId }) => {
      queryClient.removeQueries({ queryKey: ["networks", networkId] });
      return queryClient.invalidateQueries({ queryKey: ["teams", teamId, "networks"] });
    },
  });
}
