import { queryOptions, useQuery } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { ShareList } from "@/lib/api-contract";

export function getShareLinks(networkId: string, k: number) {
  return api<ShareList>(`/networks/${encodeURIComponent(networkId)}/revisions/${k}/share`).then((body) => body.shares);
}

export const shareLinksQueryOptions = (networkId: string, k: number) =>
  queryOptions({ queryKey: ["networks", networkId, "revisions", k, "shares"], queryFn: () => getShareLinks(networkId, k) });

export function useShareLinks(networkId: string, k: number, enabled: boolean) {
  return useQuery({ ...shareLinksQueryOptions(networkId, k), enabled });
}
