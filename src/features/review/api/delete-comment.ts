import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";

function deleteComment({ networkId, number, commentId }: { networkId: string; number: number; commentId: string }) {
  return api<null>(`/networks/${encodeURIComponent(networkId)}/revisions/${number}/comments/${encodeURIComponent(commentId)}`, {
    method: "DELETE",
  });
}

export function useDeleteComment() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteComment,
    onSuccess: async (_data, { networkId, number }) => {
      await queryClient.invalidateQueries({ queryKey: ["networks", networkId, "revisions", number] });
    },
  });
}
