import { queryOptions, useQuery } from "@tanstack/react-query";
import { api, ApiError } from "@/lib/api-client";
import type { Me } from "@/lib/api-contract";

// null when signed out: a 401 here is an answer, not an error.
async function getMe(): Promise<Me | null> {
  try {
    return await api<Me>("/me");
  } catch (error) {
    if (error instanceof ApiError && error.status === 401) return null;
    throw error;
  }
}

const meQueryOptions = () => queryOptions({ queryKey: ["me"], queryFn: getMe, staleTime: 60_000 });

export function useMe() {
  return useQuery(meQueryOptions());
}
