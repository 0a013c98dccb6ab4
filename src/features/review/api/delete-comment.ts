import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";

export function deleteComment({ networkId, k, commentId }: { networkId: string; k: number; commentId: string }) {
  return api<null>(`/networks/${encodeURIComponent(networkId)}/revisions/${k}/comments/${encodeURIComponent(commentId)}`, {
    method: "DELETE",
  });
}

export function useDeleteComment() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteComment,
    onSuccess: async (_data, { networkId, k }) => {
      await queryClient.invalidateQueries({ queryKey: ["networks", networkId, "revisions", k] });
    },
  });
}
