import { queryOptions, useQuery } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { Revision } from "@/lib/api-contract";

export function getRevision(networkId: string, number: number) {
  return api<Revision>(`/networks/${encodeURIComponent(networkId)}/revisions/${number}`);
}

const revisionQueryOptions = (networkId: string, number: number) =>
  queryOptions({ queryKey: ["networks", networkId, "revisions", number], queryFn: () => getRevision(networkId, number), staleTime: Infinity });

export function useRevision(networkId: string, number: number | null) {
  return useQuery({ ...revisionQueryOptions(networkId, number ?? 0), enabled: number !== null && number > 0 });
}
