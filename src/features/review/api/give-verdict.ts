import { useMutation, useQueryClient, type QueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { VerdictGiven, VerdictRequest } from "@/lib/api-contract";

export type GiveVerdictInput = VerdictRequest & { networkId: string; k: number };

export function giveVerdict({ networkId, k, verdict, note }: GiveVerdictInput) {
  return api<VerdictGiven>(`/networks/${encodeURIComponent(networkId)}/revisions/${k}/verdicts`, { method: "POST", json: { verdict, ...(note ? { note } : {}) } });
}

// A verdict changes the revision, its history, the network's summary and both review pages.
export async function refreshAfterVerdict(queryClient: QueryClient, networkId: string, k: number) {
  await Promise.all([
    queryClient.invalidateQueries({ queryKey: ["networks", networkId, "revisions", k] }),
    queryClient.invalidateQueries({ queryKey: ["networks", networkId, "revisions", "list"] }),
    queryClient.invalidateQueries({ queryKey: ["share"] }),
    queryClient.invalidateQueries({ queryKey: ["reviews"] }),
    // Team network lists show each network's latest verdict.
    queryClient.invalidateQueries({ predicate: (query) => query.queryKey[0] === "teams" && query.queryKey[2] === "networks" }),
  ]);
}

export function useGiveVerdict() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: giveVerdict, onSuccess: (_data, { networkId, k }) => refreshAfterVerdict(queryClient, networkId, k) });
}
