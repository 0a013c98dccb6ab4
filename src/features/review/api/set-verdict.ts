import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { Verdict } from "@/types/api";

export function setVerdict({ networkId, k, verdict }: { networkId: string; k: number; verdict: Verdict }) {
  return api<unknown>(`/networks/${encodeURIComponent(networkId)}/revisions/${k}/verdict`, { method: "PUT", json: { verdict } });
}

export function useSetVerdict() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: setVerdict,
    onSuccess: async (_data, { networkId, k }) => {
      await queryClient.invalidateQueries({ queryKey: ["networks", networkId, "revisions", k], exact: true });
      await queryClient.invalidateQueries({ queryKey: ["networks", networkId, "revisions", "list"] });
      await queryClient.invalidateQueries({ queryKey: ["share"] });
    },
  });
}
