import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { Attachment } from "@/lib/api-contract";

function uploadAttachment({ networkId, file }: { networkId: string; file: File }) {
  const form = new FormData();
  form.append("file", file);
  return api<Attachment>(`/networks/${encodeURIComponent(networkId)}/attachments`, { method: "POST", body: form });
}

export function useUploadAttachment() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: uploadAttachment, onSuccess: (_d, { networkId }) => queryClient.invalidateQueries({ queryKey: ["networks", networkId, "attachments"] }) });
}
