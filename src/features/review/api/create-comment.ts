import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { NoteAnchor } from "@/types/api";

export interface CreateCommentInput {
  networkId: string;
  k: number;
  stepId: string;
  body: string;
  parentId?: string;
  anchor?: NoteAnchor;
}

export function createComment({ networkId, k, ...input }: CreateCommentInput) {
  return api<unknown>(`/networks/${encodeURIComponent(networkId)}/revisions/${k}/comments`, { method: "POST", json: input });
}

export function useCreateComment(onSaved?: () => void) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createComment,
    onSuccess: async (_data, { networkId, k }) => {
      // The notes and the revision's count of open ones.
      await queryClient.invalidateQueries({ queryKey: ["networks", networkId, "revisions", k] });
      onSaved?.();
    },
  });
}
