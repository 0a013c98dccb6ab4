import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { Comment, EditCommentRequest } from "@/lib/api-contract";

function updateComment({ networkId, number, commentId, body }: EditCommentRequest & { networkId: string; number: number; commentId: string }) {
  return api<Comment>(`/networks/${encodeURIComponent(networkId)}/revisions/${number}/comments/${encodeURIComponent(commentId)}`, {
    method: "PATCH",
    json: { body },
  });
}

export function useUpdateComment() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateComment,
    onSuccess: async (_data, { networkId, number }) => {
      await queryClient.invalidateQueries({ queryKey: ["networks", networkId, "revisions", number] });
    },
  });
}
