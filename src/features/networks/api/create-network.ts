import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { Circuit, CreateNetworkRequest, Network } from "@/lib/api-contract";

// The circuit is the engine's network; the netlist the text as typed, when the network was written as one.
type CreateNetworkInput = Omit<CreateNetworkRequest, "circuit"> & { teamId: string; circuit: Circuit };

function createNetwork({ teamId, ...input }: CreateNetworkInput) {
  return api<Network>(`/teams/${encodeURIComponent(teamId)}/networks`, { method: "POST", json: input });
}

export function useCreateNetwork() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createNetwork,
    onSuccess: (_data, { teamId }) => queryClient.invalidateQueries({ queryKey: ["teams", teamId, "networks"] }),
  });
}
