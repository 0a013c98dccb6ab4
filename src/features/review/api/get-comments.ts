import { queryOptions, useQuery } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { CommentList } from "@/lib/api-contract";

// Review notes of one revision, threaded one level deep: each thread's first note with its replies.
function getComments(networkId: string, number: number) {
  return api<CommentList>(`/networks/${encodeURIComponent(networkId)}/revisions/${number}/comments`).then((body) => body.comments);
}

const commentsQueryOptions = (networkId: string, number: number) =>
  queryOptions({ queryKey: ["networks", networkId, "revisions", number, "comments"], queryFn: () => getComments(networkId, number) });

export function useComments(networkId: string, number: number, enabled = true) {
  return useQuery({ ...commentsQueryOptions(networkId, number), enabled: enabled && Boolean(networkId) && number > 0 });
}
