import { keepPreviousData, queryOptions, useQuery } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { NetworkList, NetworkSort } from "@/lib/api-contract";

export interface NetworkListQuery {
  teamId: string;
  search: string;
  sort: NetworkSort;
  direction: "asc" | "desc";
  page: number;
  pageSize: number;
}

// Sorting, search and paging happen on the server; the table only asks for one page.
function getNetworks(query: NetworkListQuery) {
  const params = new URLSearchParams({
    q: query.search,
    sort: query.sort,
    order: query.direction,
    page: String(query.page),
    pageSize: String(query.pageSize),
  });
  return api<NetworkList>(`/teams/${encodeURIComponent(query.teamId)}/networks?${params}`);
}

const networksQueryOptions = (query: NetworkListQuery) =>
  queryOptions({ queryKey: ["teams", query.teamId, "networks", query], queryFn: () => getNetworks(query), placeholderData: keepPreviousData });

export function useNetworks(query: NetworkListQuery) {
  return useQuery(networksQueryOptions(query));
}
