import { queryOptions, useQuery } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import { normaliseRevision } from "./normalise-revision";

export async function getRevision(networkId: string, k: number) {
  return normaliseRevision(await api<unknown>(`/networks/${encodeURIComponent(networkId)}/revisions/${k}`));
}

export const revisionQueryOptions = (networkId: string, k: number) =>
  queryOptions({ queryKey: ["networks", networkId, "revisions", k], queryFn: () => getRevision(networkId, k), staleTime: Infinity });

export function useRevision(networkId: string, k: number | null) {
  return useQuery({ ...revisionQueryOptions(networkId, k ?? 0), enabled: k !== null && k > 0 });
}
