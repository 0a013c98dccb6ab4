import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import { normaliseShareLink } from "./get-share-links";

export interface CreateShareLinkInput {
  networkId: string;
  k: number;
  expiresAt?: string;
}

export async function createShareLink({ networkId, k, expiresAt }: CreateShareLinkInput) {
  const body = await api<Record<string, unknown>>(`/networks/${encodeURIComponent(networkId)}/revisions/${k}/share`, {
    method: "POST",
    json: expiresAt ? { expiresAt } : {},
  });
  return normaliseShareLink(body, k);
}

export function useCreateShareLink() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createShareLink,
    onSuccess: (_data, { networkId, k }) => queryClient.invalidateQueries({ queryKey: ["networks", networkId, "revisions", k, "shares"] }),
  });
}
