import { queryOptions, useQuery } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import { normaliseRevision } from "@/features/derivations/api/normalise-revision";

// Read-only, no account needed: the token is the whole permission.
export async function getSharedRevision(token: string) {
  return normaliseRevision(await api<unknown>(`/share/${encodeURIComponent(token)}`));
}

export const sharedRevisionQueryOptions = (token: string) =>
  queryOptions({ queryKey: ["share", token], queryFn: () => getSharedRevision(token), retry: false });

export function useSharedRevision(token: string) {
  return useQuery(sharedRevisionQueryOptions(token));
}
