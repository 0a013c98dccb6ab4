import type { Verdict } from "@/lib/api-contract";

const VERDICT_WORDS: Record<Verdict, string> = { open: "open", approved: "approved", needs_changes: "needs changes" };

export function VerdictMark({ verdict }: { verdict: Verdict | null }) {
  if (!verdict) return <span className="text-ink/40">none</span>;
  const tone = verdict === "approved" ? "text-verdigris" : verdict === "needs_changes" ? "text-copper" : "text-ink/60";
  return <span className={`font-medium ${tone}`}>{VERDICT_WORDS[verdict]}</span>;
}
