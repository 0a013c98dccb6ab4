import { keepPreviousData, queryOptions, useQuery } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { NetworkPage, NetworkSummary } from "@/types/api";

export type NetworkSort = "title" | "author" | "lastRevision" | "verdict" | "updatedAt";

export interface NetworkListQuery {
  teamId: string;
  search: string;
  sort: NetworkSort;
  direction: "asc" | "desc";
  page: number;
  pageSize: number;
}

type RawSummary = Partial<NetworkSummary> & { id: string; title: string; [key: string]: unknown };

function normaliseSummary(raw: RawSummary): NetworkSummary {
  const author = raw.author as unknown;
  return {
    id: raw.id,
    slug: String(raw.slug ?? raw.id),
    title: raw.title,
    author: typeof author === "string" ? author : ((author as { name?: string } | null)?.name ?? (raw.authorName as string) ?? null),
    lastRevision: (raw.latestRevision ?? raw.lastRevision ?? null) as number | null,
    verdict: (raw.verdict ?? null) as NetworkSummary["verdict"],
    updatedAt: String(raw.updatedAt ?? raw.createdAt ?? ""),
  };
}

// Sorting, search and paging happen on the server; the table only asks for one page.
export async function getNetworks(query: NetworkListQuery): Promise<NetworkPage> {
  const params = new URLSearchParams({
    q: query.search,
    sort: query.sort,
    order: query.direction,
    page: String(query.page),
    pageSize: String(query.pageSize),
  });
  const body = await api<RawSummary[] | { items?: RawSummary[]; networks?: RawSummary[]; total?: number; page?: number; pageSize?: number }>(
    `/teams/${encodeURIComponent(query.teamId)}/networks?${params}`,
  );
  const items = Array.isArray(body) ? body : (body.items ?? body.networks ?? []);
  return {
    items: items.map(normaliseSummary),
    total: Array.isArray(body) ? items.length : (body.total ?? items.length),
    page: Array.isArray(body) ? query.page : (body.page ?? query.page),
    pageSize: Array.isArray(body) ? query.pageSize : (body.pageSize ?? query.pageSize),
  };
}

export const networksQueryOptions = (query: NetworkListQuery) =>
  queryOptions({ queryKey: ["teams", query.teamId, "networks", query], queryFn: () => getNetworks(query), placeholderData: keepPreviousData });

export function useNetworks(query: NetworkListQuery) {
  return useQuery(networksQueryOptions(query));
}
