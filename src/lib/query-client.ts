import { QueryClient } from "@tanstack/react-query";
import { ApiError } from "./api-client";

// A refusal (4xx) will not change on a second try; only network trouble and 5xx are retried, once.
function retry(failureCount: number, error: unknown): boolean {
  if (error instanceof ApiError && error.status >= 400 && error.status < 500) return false;
  return failureCount < 1;
}

export const queryClient = new QueryClient({
  defaultOptions: { queries: { staleTime: 30_000, retry, refetchOnWindowFocus: false } },
});
