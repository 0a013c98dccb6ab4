import { useId } from "react";
import { InlineError } from "@/components/ui/states";
import type { Verdict } from "@/types/api";
import { useSetVerdict } from "../api/set-verdict";

export const VERDICT_WORDS: Record<Verdict, string> = { open: "open", approved: "approved", needs_changes: "needs changes" };

export function VerdictMark({ verdict }: { verdict: Verdict | null }) {
  if (!verdict) return <span className="text-ink/40">none</span>;
  const tone = verdict === "approved" ? "text-verdigris" : verdict === "needs_changes" ? "text-copper" : "text-ink/60";
  return <span className={`font-medium ${tone}`}>{VERDICT_WORDS[verdict]}</span>;
}

// The review verdict on one revision: reviewers, editors and owners may set it.
export function VerdictControl({ networkId, k, verdict, canSet }: { networkId: string; k: number; verdict: Verdict; canSet: boolean }) {
  const id = useId();
  const setVerdict = useSetVerdict();
  if (!canSet) {
    return (
      <p className="text-xs">
        Review: <VerdictMark verdict={verdict} />
      </p>
    );
  }
  return (
    <div className="text-xs">
      <label htmlFor={id} className="mr-1.5">
        Review verdict
      </label>
      <select
        id={id}
        value={verdict}
        disabled={setVerdict.isPending}
        onChange={(e) => setVerdict.mutate({ networkId, k, verdict: e.target.value as Verdict })}
        className="rounded border border-rule bg-white px-1.5 py-0.5 text-xs"
      >
        {(Object.keys(VERDICT_WORDS) as Verdict[]).map((v) => (
          <option key={v} value={v}>
            {VERDICT_WORDS[v]}
          </option>
        ))}
      </select>
      <InlineError error={setVerdict.error} />
    </div>
  );
}
