import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { VerdictGiven } from "@/lib/api-contract";
import { refreshAfterVerdict } from "./give-verdict";

function withdrawVerdict({ networkId, number, verdictId }: { networkId: string; number: number; verdictId: string }) {
  return api<VerdictGiven>(`/networks/${encodeURIComponent(networkId)}/revisions/${number}/verdicts/${encodeURIComponent(verdictId)}/withdraw`, { method: "POST" });
}

export function useWithdrawVerdict() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: withdrawVerdict, onSuccess: (_data, { networkId, number }) => refreshAfterVerdict(queryClient, networkId, number) });
}
