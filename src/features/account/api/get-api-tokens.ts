import { queryOptions, useQuery } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { TokenList } from "@/lib/api-contract";

const apiTokensQueryOptions = () => queryOptions({ queryKey: ["api-tokens"], queryFn: () => api<TokenList>("/account/tokens") });

export function useApiTokens() {
  return useQuery(apiTokensQueryOptions());
}
