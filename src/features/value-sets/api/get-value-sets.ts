import { queryOptions, useQuery } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { ValueSet } from "@/types/api";

export function getValueSets(networkId: string) {
  return api<{ valueSets: ValueSet[] }>(`/networks/${encodeURIComponent(networkId)}/value-sets`).then((r) => r.valueSets);
}

export const valueSetsQueryOptions = (networkId: string) => queryOptions({ queryKey: ["networks", networkId, "value-sets"], queryFn: () => getValueSets(networkId) });

export function useValueSets(networkId: string | undefined) {
  return useQuery({ ...valueSetsQueryOptions(networkId ?? ""), enabled: Boolean(networkId) });
}
