import { queryOptions, useQuery } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { Network } from "@/lib/api-contract";

function getNetwork(networkId: string) {
  return api<Network>(`/networks/${encodeURIComponent(networkId)}`);
}

export const networkQueryOptions = (networkId: string) =>
  queryOptions({ queryKey: ["networks", networkId], queryFn: () => getNetwork(networkId) });

export function useNetwork(networkId: string) {
  return useQuery({ ...networkQueryOptions(networkId), enabled: Boolean(networkId) });
}
