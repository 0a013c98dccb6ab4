import { queryOptions, useQuery } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { RevisionSummary, Verdict } from "@/types/api";

type Loose = Record<string, unknown>;

export async function getRevisions(networkId: string): Promise<RevisionSummary[]> {
  const body = await api<Loose[] | { revisions: Loose[] }>(`/networks/${encodeURIComponent(networkId)}/revisions`);
  const list = Array.isArray(body) ? body : body.revisions;
  return list
    .map((r) => {
      const verdict = r.verdict as { verdict?: Verdict } | Verdict | null;
      const summary = (r.summary ?? {}) as RevisionSummary["summary"];
      return {
        k: Number(r.number ?? r.k),
        createdAt: String(r.createdAt ?? ""),
        author: ((r.createdBy as { name?: string } | null)?.name ?? null) as string | null,
        verdict: (typeof verdict === "string" ? verdict : (verdict?.verdict ?? null)) as Verdict | null,
        permalink: typeof r.permalink === "string" ? r.permalink : null,
        summary: { vth: summary.vth ?? null, rth: summary.rth ?? null, isc: summary.isc ?? null },
      };
    })
    .sort((a, b) => b.k - a.k);
}

export const revisionsQueryOptions = (networkId: string) =>
  queryOptions({ queryKey: ["networks", networkId, "revisions", "list"], queryFn: () => getRevisions(networkId) });

export function useRevisions(networkId: string) {
  return useQuery(revisionsQueryOptions(networkId));
}
