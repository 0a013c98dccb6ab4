import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import { normaliseRevision } from "./normalise-revision";

// Each solve stores a new, immutable derivation revision with its steps.
export async function solveNetwork({ networkId }: { networkId: string }) {
  return normaliseRevision(await api<unknown>(`/networks/${encodeURIComponent(networkId)}/solve`, { method: "POST", json: {} }));
}

export function useSolveNetwork() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: solveNetwork,
    onSuccess: (revision, { networkId }) => {
      queryClient.setQueryData(["networks", networkId, "revisions", revision.k], revision);
      return queryClient.invalidateQueries({ queryKey: ["networks", networkId], exact: true });
    },
  });
}
