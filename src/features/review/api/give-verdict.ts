import { useMutation, useQueryClient, type QueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { VerdictGiven, VerdictRequest } from "@/lib/api-contract";

type GiveVerdictInput = VerdictRequest & { networkId: string; number: number };

function giveVerdict({ networkId, number, verdict, note }: GiveVerdictInput) {
  return api<VerdictGiven>(`/networks/${encodeURIComponent(networkId)}/revisions/${number}/verdicts`, { method: "POST", json: { verdict, ...(note ? { note } : {}) } });
}

// A verdict changes the revision, its history, the network's summary and both review pages.
export async function refreshAfterVerdict(queryClient: QueryClient, networkId: string, number: number) {
  await Promise.all([
    queryClient.invalidateQueries({ queryKey: ["networks", networkId, "revisions", number] }),
    queryClient.invalidateQueries({ queryKey: ["networks", networkId, "revisions", "list"] }),
    queryClient.invalidateQueries({ queryKey: ["share"] }),
    queryClient.invalidateQueries({ queryKey: ["reviews"] }),
    // Team network lists show each network's latest verdict.
    queryClient.invalidateQueries({ predicate: (query) => query.queryKey[0] === "teams" && query.queryKey[2] === "networks" }),
  ]);
}

export function useGiveVerdict() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: giveVerdict, onSuccess: (_data, { networkId, number }) => refreshAfterVerdict(queryClient, networkId, number) });
}
