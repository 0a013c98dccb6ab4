import { queryOptions, useQuery } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { Attachment } from "@/types/api";

export interface AttachmentList {
  attachments: Attachment[];
  limits: { maxBytes: number; types: string[] };
}

export async function getAttachments(networkId: string): Promise<AttachmentList> {
  const raw = await api<{ attachments: (Omit<Attachment, "uploadedBy"> & { uploadedBy: { name: string } | null })[]; limits: AttachmentList["limits"] }>(`/networks/${encodeURIComponent(networkId)}/attachments`);
  return { attachments: raw.attachments.map((a) => ({ ...a, uploadedBy: a.uploadedBy?.name ?? null })), limits: raw.limits };
}

export const attachmentsQueryOptions = (networkId: string) => queryOptions({ queryKey: ["networks", networkId, "attachments"], queryFn: () => getAttachments(networkId) });

export function useAttachments(networkId: string) {
  return useQuery(attachmentsQueryOptions(networkId));
}
