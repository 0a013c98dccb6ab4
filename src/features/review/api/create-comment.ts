import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { Comment, CommentRequest } from "@/lib/api-contract";

type CreateCommentInput = CommentRequest & { networkId: string; number: number };

function createComment({ networkId, number, ...input }: CreateCommentInput) {
  return api<Comment>(`/networks/${encodeURIComponent(networkId)}/revisions/${number}/comments`, { method: "POST", json: input });
}

export function useCreateComment(onSaved?: () => void) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createComment,
    onSuccess: async (_data, { networkId, number }) => {
      // The notes and the revision's count of open ones.
      await queryClient.invalidateQueries({ queryKey: ["networks", networkId, "revisions", number] });
      onSaved?.();
    },
  });
}
