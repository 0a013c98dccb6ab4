import { queryOptions, useQuery } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { CommentList } from "@/lib/api-contract";

// Review notes of one revision, threaded one level deep: each thread's first note with its replies.
export function getComments(networkId: string, k: number) {
  return api<CommentList>(`/networks/${encodeURIComponent(networkId)}/revisions/${k}/comments`).then((body) => body.comments);
}

export const commentsQueryOptions = (networkId: string, k: number) =>
  queryOptions({ queryKey: ["networks", networkId, "revisions", k, "comments"], queryFn: () => getComments(networkId, k) });

export function useComments(networkId: string, k: number, enabled = true) {
  return useQuery({ ...commentsQueryOptions(networkId, k), enabled: enabled && Boolean(networkId) && k > 0 });
}
