import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";

export function updateComment({ networkId, k, commentId, body }: { networkId: string; k: number; commentId: string; body: string }) {
  return api<unknown>(`/networks/${encodeURIComponent(networkId)}/revisions/${k}/comments/${encodeURIComponent(commentId)}`, {
    method: "PATCH",
    json: { body },
  });
}

export function useUpdateComment() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateComment,
    onSuccess: async (_data, { networkId, k }) => {
      await queryClient.invalidateQueries({ queryKey: ["networks", networkId, "revisions", k] });
    },
  });
}
