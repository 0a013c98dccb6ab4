import { queryOptions, useQuery } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { VerdictHistory } from "@/lib/api-contract";

// Every verdict on one revision, newest first, and the state the server derives from them.
function getVerdicts(networkId: string, number: number) {
  return api<VerdictHistory>(`/networks/${encodeURIComponent(networkId)}/revisions/${number}/verdicts`);
}

const verdictsQueryOptions = (networkId: string, number: number) =>
  queryOptions({ queryKey: ["networks", networkId, "revisions", number, "verdicts"], queryFn: () => getVerdicts(networkId, number) });

export function useVerdicts(networkId: string, number: number, enabled = true) {
  return useQuery({ ...verdictsQueryOptions(networkId, number), enabled: enabled && Boolean(networkId) && number > 0 });
}
