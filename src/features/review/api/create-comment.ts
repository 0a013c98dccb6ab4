import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";

export interface CreateCommentInput {
  networkId: string;
  k: number;
  stepId: string;
  body: string;
  parentId?: string;
}

export function createComment({ networkId, k, ...input }: CreateCommentInput) {
  return api<unknown>(`/networks/${encodeURIComponent(networkId)}/revisions/${k}/comments`, { method: "POST", json: input });
}

export function useCreateComment(onSaved?: () => void) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createComment,
    onSuccess: async (_data, { networkId, k }) => {
      await queryClient.invalidateQueries({ queryKey: ["networks", networkId, "revisions", k, "comments"] });
      onSaved?.();
    },
  });
}
