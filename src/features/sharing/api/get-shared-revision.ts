import { queryOptions, useQuery } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import { normaliseRevision } from "@/features/derivations/api/normalise-revision";
import type { Revision, ValueSet } from "@/types/api";

// Read-only, no account needed: the token is the whole permission.
export async function getSharedRevision(token: string): Promise<Revision & { valueSets: ValueSet[] }> {
  const raw = await api<{ valueSets?: ValueSet[] }>(`/share/${encodeURIComponent(token)}`);
  // The network's saved value sets come with the link, so the reviewer reads the designer's numbers.
  return { ...normaliseRevision(raw), valueSets: Array.isArray(raw?.valueSets) ? raw.valueSets : [] };
}

export const sharedRevisionQueryOptions = (token: string) =>
  queryOptions({ queryKey: ["share", token], queryFn: () => getSharedRevision(token), retry: false });

export function useSharedRevision(token: string) {
  return useQuery(sharedRevisionQueryOptions(token));
}
