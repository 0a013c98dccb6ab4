import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { VerdictGiven } from "@/lib/api-contract";
import { refreshAfterVerdict } from "./give-verdict";

export function withdrawVerdict({ networkId, k, verdictId }: { networkId: string; k: number; verdictId: string }) {
  return api<VerdictGiven>(`/networks/${encodeURIComponent(networkId)}/revisions/${k}/verdicts/${encodeURIComponent(verdictId)}/withdraw`, { method: "POST" });
}

export function useWithdrawVerdict() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: withdrawVerdict, onSuccess: (_data, { networkId, k }) => refreshAfterVerdict(queryClient, networkId, k) });
}
