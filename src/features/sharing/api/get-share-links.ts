import { queryOptions, useQuery } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { ShareLink } from "@/types/api";

type Loose = Record<string, unknown>;

export function normaliseShareLink(raw: Loose, k: number): ShareLink {
  const createdBy = raw.createdBy as { name?: string } | null;
  return {
    id: String(raw.id),
    token: typeof raw.token === "string" ? raw.token : null,
    url: typeof raw.url === "string" ? raw.url : null,
    k: Number(raw.revision ?? k),
    status: String(raw.status ?? "active"),
    createdBy: createdBy?.name ?? null,
    createdAt: String(raw.createdAt ?? ""),
    expiresAt: (raw.expiresAt ?? null) as string | null,
    revokedAt: (raw.revokedAt ?? null) as string | null,
  };
}

export async function getShareLinks(networkId: string, k: number): Promise<ShareLink[]> {
  const body = await api<{ shares: Loose[] }>(`/networks/${encodeURIComponent(networkId)}/revisions/${k}/share`);
  return (body.shares ?? []).map((raw) => normaliseShareLink(raw, k));
}

export const shareLinksQueryOptions = (networkId: string, k: number) =>
  queryOptions({ queryKey: ["networks", networkId, "revisions", k, "shares"], queryFn: () => getShareLinks(networkId, k) });

export function useShareLinks(networkId: string, k: number, enabled: boolean) {
  return useQuery({ ...shareLinksQueryOptions(networkId, k), enabled });
}
