import { queryOptions, useQuery } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { Network } from "@/types/api";

type Loose = Record<string, unknown>;

export function normaliseNetwork(raw: Loose): Network {
  const author = raw.author as { id?: string; name?: string } | string | null;
  return {
    id: String(raw.id),
    teamId: String(raw.teamId ?? ""),
    slug: String(raw.slug ?? raw.id),
    title: String(raw.title ?? ""),
    description: String(raw.description ?? ""),
    circuit: (raw.circuit ?? { port: { plus: "", minus: "0" }, elements: [] }) as Network["circuit"],
    netlist: typeof raw.netlist === "string" ? raw.netlist : null,
    quantities: (raw.quantities ?? {}) as Record<string, string>,
    author: typeof author === "string" ? author : (author?.name ?? null),
    authorId: typeof author === "object" && author ? (author.id ?? null) : null,
    createdAt: String(raw.createdAt ?? ""),
    updatedAt: String(raw.updatedAt ?? ""),
    role: (raw.role ?? null) as Network["role"],
    latestRevision: typeof raw.latestRevision === "number" ? raw.latestRevision : null,
  };
}

export async function getNetwork(networkId: string): Promise<Network> {
  return normaliseNetwork(await api<Loose>(`/networks/${encodeURIComponent(networkId)}`));
}

export const networkQueryOptions = (networkId: string) =>
  queryOptions({ queryKey: ["networks", networkId], queryFn: () => getNetwork(networkId) });

export function useNetwork(networkId: string) {
  return useQuery({ ...networkQueryOptions(networkId), enabled: Boolean(networkId) });
}
