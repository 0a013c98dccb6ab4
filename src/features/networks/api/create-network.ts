import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { Circuit } from "@/types/api";

export interface CreateNetworkInput {
  teamId: string;
  title: string;
  description?: string;
  circuit: Circuit;
  /** The text as typed, when the network was written as a netlist. */
  netlist?: string | null;
}

export function createNetwork({ teamId, ...input }: CreateNetworkInput) {
  return api<{ id: string; slug?: string }>(`/teams/${encodeURIComponent(teamId)}/networks`, { method: "POST", json: input });
}

export function useCreateNetwork() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createNetwork,
    onSuccess: (_data, { teamId }) => queryClient.invalidateQueries({ queryKey: ["teams", teamId, "networks"] }),
  });
}
