import { queryOptions, useQuery } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { VerdictHistory } from "@/lib/api-contract";

// Every verdict on one revision, newest first, and the state the server derives from them.
export function getVerdicts(networkId: string, k: number) {
  return api<VerdictHistory>(`/networks/${encodeURIComponent(networkId)}/revisions/${k}/verdicts`);
}

export const verdictsQueryOptions = (networkId: string, k: number) =>
  queryOptions({ queryKey: ["networks", networkId, "revisions", k, "verdicts"], queryFn: () => getVerdicts(networkId, k) });

export function useVerdicts(networkId: string, k: number, enabled = true) {
  return useQuery({ ...verdictsQueryOptions(networkId, k), enabled: enabled && Boolean(networkId) && k > 0 });
}
