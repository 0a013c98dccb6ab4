import { queryOptions, useQuery } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { AttachmentList } from "@/lib/api-contract";

// The limits travel with the list, so the page states them before anyone tries an upload.
function getAttachments(networkId: string) {
  return api<AttachmentList>(`/networks/${encodeURIComponent(networkId)}/attachments`);
}

const attachmentsQueryOptions = (networkId: string) => queryOptions({ queryKey: ["networks", networkId, "attachments"], queryFn: () => getAttachments(networkId) });

export function useAttachments(networkId: string) {
  return useQuery(attachmentsQueryOptions(networkId));
}
