import { useState } from "react";
import { Button } from "@/components/ui/button";

// Lines of one text not in the other, for a quick look at what changed (not a full diff).
function linesOnlyIn(a: string, b: string): string[] {
  const other = new Set(b.split("\n").map((l) => l.trimEnd()));
  return a.split("\n").filter((l) => l.trim() !== "" && !other.has(l.trimEnd()));
}

/**
 * Someone saved the network after this copy was loaded. Shows what differs and lets the designer
 * keep their own text, take the other one, or copy their own out first; nothing typed is lost.
 */
export function SaveConflict({ mine, theirs, by, onKeepMine, onTakeTheirs }: { mine: string; theirs: string; by?: string | null; onKeepMine: () => void; onTakeTheirs: () => void }) {
  const [copied, setCopied] = useState(false);
  const onlyMine = linesOnlyIn(mine, theirs);
  const onlyTheirs = linesOnlyIn(theirs, mine);
  return (
    <section role="alert" aria-label="Saved by someone else" className="rounded border border-copper/60 bg-copper/5 p-3 text-sm">
      <p className="font-medium">This network was saved{by ? ` by ${by}` : " by someone else"} after you opened it.</p>
      <p className="mt-0.5 text-xs text-ink/70">Your text is still here. Choose which version to keep.</p>
      <div className="mt-2 grid gap-2 text-xs sm:grid-cols-2">
        <div className="min-w-0">
          <p className="font-medium">Only in yours</p>
          <pre className="mt-0.5 max-h-40 overflow-auto rounded-sm bg-white px-2 py-1 font-mono" data-testid="only-mine">{onlyMine.join("\n") || "(nothing)"}</pre>
        </div>
        <div className="min-w-0">
          <p className="font-medium">Only in theirs</p>
          <pre className="mt-0.5 max-h-40 overflow-auto rounded-sm bg-white px-2 py-1 font-mono" data-testid="only-theirs">{onlyTheirs.join("\n") || "(nothing)"}</pre>
        </div>
      </div>
      <div className="mt-2 flex flex-wrap gap-2">
        <Button variant="primary" onClick={onKeepMine}>
          Keep mine (save over theirs)
        </Button>
        <Button onClick={onTakeTheirs}>Take theirs</Button>
        <Button onClick={() => void navigator.clipboard?.writeText(mine).then(() => setCopied(true), () => undefined)}>{copied ? "Copied yours" : "Copy mine"}</Button>
      </div>
    </section>
  );
}
