import { queryOptions, useQuery } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { RevisionComparison } from "@/lib/api-contract";

// What changed between two revisions, as the server compares them (circuit by element name, results by printed form).
function getRevisionComparison(networkId: string, from: number, to: number) {
  return api<RevisionComparison>(`/networks/${encodeURIComponent(networkId)}/revisions/${from}/compare/${to}`);
}

const revisionComparisonQueryOptions = (networkId: string, from: number, to: number) =>
  queryOptions({ queryKey: ["networks", networkId, "revisions", from, "compare", to], queryFn: () => getRevisionComparison(networkId, from, to), staleTime: Infinity });

export function useRevisionComparison(networkId: string, from: number, to: number) {
  return useQuery(revisionComparisonQueryOptions(networkId, from, to));
}
