import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { Circuit, Network } from "@/types/api";
import { normaliseNetwork } from "./get-network";

export interface UpdateNetworkInput {
  networkId: string;
  title?: string;
  description?: string;
  circuit?: Circuit;
  /** The netlist as typed (null: the circuit came from JSON). */
  netlist?: string | null;
  /** The `updatedAt` of the copy being edited: a later save by someone else answers 409 `stale`. */
  expectedUpdatedAt?: string;
}

export async function updateNetwork({ networkId, ...input }: UpdateNetworkInput): Promise<Network> {
  return normaliseNetwork(await api<Record<string, unknown>>(`/networks/${encodeURIComponent(networkId)}`, { method: "PATCH", json: input }));
}

export function useUpdateNetwork() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateNetwork,
    onSuccess: (network) => queryClient.setQueryData(["networks", network.id], network),
  });
}
