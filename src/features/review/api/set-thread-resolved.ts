import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { Comment } from "@/lib/api-contract";

function setThreadResolved({ networkId, number, commentId, resolved }: { networkId: string; number: number; commentId: string; resolved: boolean }) {
  return api<Comment>(`/networks/${encodeURIComponent(networkId)}/revisions/${number}/comments/${encodeURIComponent(commentId)}/${resolved ? "resolve" : "reopen"}`, { method: "POST" });
}

export function useSetThreadResolved() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: setThreadResolved,
    // The thread and the revision's count of open notes.
    onSuccess: (_data, { networkId, number }) => queryClient.invalidateQueries({ queryKey: ["networks", networkId, "revisions", number] }),
  });
}
