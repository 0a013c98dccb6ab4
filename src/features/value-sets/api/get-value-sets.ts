import { queryOptions, useQuery } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { ValueSetList } from "@/lib/api-contract";

function getValueSets(networkId: string) {
  return api<ValueSetList>(`/networks/${encodeURIComponent(networkId)}/value-sets`).then((r) => r.valueSets);
}

const valueSetsQueryOptions = (networkId: string) => queryOptions({ queryKey: ["networks", networkId, "value-sets"], queryFn: () => getValueSets(networkId) });

export function useValueSets(networkId: string | undefined) {
  return useQuery({ ...valueSetsQueryOptions(networkId ?? ""), enabled: Boolean(networkId) });
}
