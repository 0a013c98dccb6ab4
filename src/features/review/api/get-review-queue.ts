import { keepPreviousData, queryOptions, useQuery } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { ReviewQueuePage } from "@/lib/api-contract";

export type ReviewQueue = "awaiting" | "mine";

// "awaiting": open revisions waiting for my verdict; "mine": revisions I solved that are not approved yet.
function getReviewQueue(queue: ReviewQueue, page: number, pageSize: number) {
  return api<ReviewQueuePage>(`/reviews/${queue}?page=${page}&pageSize=${pageSize}`);
}

const reviewQueueQueryOptions = (queue: ReviewQueue, page: number, pageSize: number) =>
  queryOptions({ queryKey: ["reviews", queue, { page, pageSize }], queryFn: () => getReviewQueue(queue, page, pageSize), placeholderData: keepPreviousData });

export function useReviewQueue(queue: ReviewQueue, page: number, pageSize = 20) {
  return useQuery(reviewQueueQueryOptions(queue, page, pageSize));
}
