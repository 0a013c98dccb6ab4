import { queryOptions, useQuery } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { ShareList } from "@/lib/api-contract";

function getShareLinks(networkId: string, number: number) {
  return api<ShareList>(`/networks/${encodeURIComponent(networkId)}/revisions/${number}/share`).then((body) => body.shares);
}

const shareLinksQueryOptions = (networkId: string, number: number) =>
  queryOptions({ queryKey: ["networks", networkId, "revisions", number, "shares"], queryFn: () => getShareLinks(networkId, number) });

export function useShareLinks(networkId: string, number: number, enabled: boolean) {
  return useQuery({ ...shareLinksQueryOptions(networkId, number), enabled });
}
