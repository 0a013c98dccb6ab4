import { queryOptions, useQuery } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { SharedRevision } from "@/lib/api-contract";

// Read-only, no account needed: the token is the whole permission. The network's saved value sets come with the
// link, so the reviewer reads the designer's numbers.
function getSharedRevision(token: string) {
  return api<SharedRevision>(`/share/${encodeURIComponent(token)}`);
}

const sharedRevisionQueryOptions = (token: string) =>
  queryOptions({ queryKey: ["share", token], queryFn: () => getSharedRevision(token), retry: false });

export function useSharedRevision(token: string) {
  return useQuery(sharedRevisionQueryOptions(token));
}
