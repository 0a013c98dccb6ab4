import { keepPreviousData, queryOptions, useQuery } from "@tanstack/react-query";
import { normaliseReviewState } from "@/features/derivations/api/normalise-revision";
import { api } from "@/lib/api-client";
import type { ReviewQueuePage } from "@/types/api";

export type ReviewQueue = "awaiting" | "mine";

type Loose = Record<string, unknown>;

// "awaiting": open revisions waiting for my verdict; "mine": revisions I solved that are not approved yet.
export async function getReviewQueue(queue: ReviewQueue, page: number, pageSize: number): Promise<ReviewQueuePage> {
  const body = await api<{ items: Loose[]; total: number; page: number; pageSize: number }>(`/reviews/${queue}?page=${page}&pageSize=${pageSize}`);
  return {
    ...body,
    items: body.items.map((raw) => {
      const network = raw.network as Loose;
      return {
        networkId: String(network.id),
        title: String(network.title),
        teamName: String(network.teamName),
        k: Number(raw.revision),
        author: ((raw.author as Loose | null)?.name as string | undefined) ?? null,
        createdAt: String(raw.createdAt),
        state: normaliseReviewState(raw.state as Loose),
        openNotes: Number(raw.openNotes ?? 0),
      };
    }),
  };
}

export const reviewQueueQueryOptions = (queue: ReviewQueue, page: number, pageSize: number) =>
  queryOptions({ queryKey: ["reviews", queue, { page, pageSize }], queryFn: () => getReviewQueue(queue, page, pageSize), placeholderData: keepPreviousData });

export function useReviewQueue(queue: ReviewQueue, page: number, pageSize = 20) {
  return useQuery(reviewQueueQueryOptions(queue, page, pageSize));
}
