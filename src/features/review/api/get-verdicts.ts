import { queryOptions, useQuery } from "@tanstack/react-query";
import { normaliseReviewState } from "@/features/derivations/api/normalise-revision";
import { api } from "@/lib/api-client";
import type { ReviewState, Role, Verdict, VerdictEntry } from "@/types/api";

type Loose = Record<string, unknown>;

function entry(raw: Loose): VerdictEntry {
  const by = raw.by as { id?: string; name?: string } | null;
  return {
    id: String(raw.id),
    k: Number(raw.revision),
    verdict: raw.verdict as Verdict,
    by: by?.name ?? null,
    byId: by?.id ?? null,
    role: (raw.role as Role | null) ?? null,
    note: (raw.note as string | null) ?? null,
    at: String(raw.at ?? ""),
    withdraws: (raw.withdraws as string | null) ?? null,
    withdrawnAt: (raw.withdrawnAt as string | null) ?? null,
  };
}

// Every verdict on one revision, newest first, and the state the server derives from them.
export async function getVerdicts(networkId: string, k: number): Promise<{ entries: VerdictEntry[]; state: ReviewState }> {
  const body = await api<{ verdicts: Loose[]; state: Loose }>(`/networks/${encodeURIComponent(networkId)}/revisions/${k}/verdicts`);
  return { entries: body.verdicts.map(entry), state: normaliseReviewState(body.state) };
}

export const verdictsQueryOptions = (networkId: string, k: number) =>
  queryOptions({ queryKey: ["networks", networkId, "revisions", k, "verdicts"], queryFn: () => getVerdicts(networkId, k) });

export function useVerdicts(networkId: string, k: number, enabled = true) {
  return useQuery({ ...verdictsQueryOptions(networkId, k), enabled: enabled && Boolean(networkId) && k > 0 });
}
