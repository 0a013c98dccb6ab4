import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { Comment, EditCommentRequest } from "@/lib/api-contract";

export function updateComment({ networkId, k, commentId, body }: EditCommentRequest & { networkId: string; k: number; commentId: string }) {
  return api<Comment>(`/networks/${encodeURIComponent(networkId)}/revisions/${k}/comments/${encodeURIComponent(commentId)}`, {
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
