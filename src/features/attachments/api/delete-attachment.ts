import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";

function deleteAttachment({ networkId, attachmentId }: { networkId: string; attachmentId: string }) {
  return api<null>(`/networks/${encodeURIComponent(networkId)}/attachments/${encodeURIComponent(attachmentId)}`, { method: "DELETE" });
}

export function useDeleteAttachment() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: deleteAttachment, onSuccess: (_d, { networkId }) => queryClient.invalidateQueries({ queryKey: ["networks", networkId, "attachments"] }) });
}
