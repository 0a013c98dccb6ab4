import { queryOptions, useQuery } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { Revision } from "@/lib/api-contract";

export function getRevision(networkId: string, k: number) {
  return api<Revision>(`/networks/${encodeURIComponent(networkId)}/revisions/${k}`);
}

export const revisionQueryOptions = (networkId: string, k: number) =>
  queryOptions({ queryKey: ["networks", networkId, "revisions", k], queryFn: () => getRevision(networkId, k), staleTime: Infinity });

export function useRevision(networkId: string, k: number | null) {
  return useQuery({ ...revisionQueryOptions(networkId, k ?? 0), enabled: k !== null && k > 0 });
}
