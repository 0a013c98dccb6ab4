import { queryOptions, useQuery } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { RevisionList } from "@/lib/api-contract";

// Newest first, as the server lists them.
function getRevisions(networkId: string) {
  return api<RevisionList>(`/networks/${encodeURIComponent(networkId)}/revisions`).then((body) => body.revisions);
}

const revisionsQueryOptions = (networkId: string) =>
  queryOptions({ queryKey: ["networks", networkId, "revisions", "list"], queryFn: () => getRevisions(networkId) });

export function useRevisions(networkId: string) {
  return useQuery(revisionsQueryOptions(networkId));
}
