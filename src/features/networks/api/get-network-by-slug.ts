import { queryOptions, useQuery } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { Network } from "@/lib/api-contract";

// The permanent, human-readable link /n/<slug>/r/<number> resolves through the slug.
function getNetworkBySlug(slug: string) {
  return api<Network>(`/networks/by-slug/${encodeURIComponent(slug)}`);
}

const networkBySlugQueryOptions = (slug: string) =>
  queryOptions({ queryKey: ["networks", "by-slug", slug], queryFn: () => getNetworkBySlug(slug), retry: false });

export function useNetworkBySlug(slug: string) {
  return useQuery(networkBySlugQueryOptions(slug));
}
