import { useEffect } from "react";
import { Dialog } from "@/components/ui/dialog";
import { SYNTAX_ENTRIES } from "../lib/syntax-entries";

// The netlist's reference: every kind word and directive with a tiny example, one click from the editor.
export function SyntaxReference({ open, onClose, entry }: { open: boolean; onClose: () => void; entry?: string }) {
  useEffect(() => {
    if (!open || !entry) return;
    const target = document.getElementById(`syntax-${entry}`);
    target?.scrollIntoView({ block: "start" });
    target?.focus();
  }, [open, entry]);
  return (
    <Dialog open={open} onClose={onClose} title="Portfold netlist reference" wide>
      <div className="max-h-[70vh] space-y-3 overflow-y-auto pr-1 text-sm">
        <nav aria-label="Entries" className="flex flex-wrap gap-x-2 gap-y-1 text-xs">
          {SYNTAX_ENTRIES.map((e) => (
            <a key={e.id} href={`#syntax-${e.id}`} className="font-mono text-copper hover:underline">
              {e.title.split(" ")[0]}
            </a>
          ))}
        </nav>
        {SYNTAX_ENTRIES.map((e) => (
          <section key={e.id} id={`syntax-${e.id}`} tabIndex={-1} aria-labelledby={`syntax-${e.id}-title`} className={`scroll-mt-2 rounded border p-2 ${entry === e.id ? "border-copper/60 bg-copper/5" : "border-rule"}`}>
            <h3 id={`syntax-${e.id}-title`} className="font-mono text-sm font-semibold">
              {e.title}
            </h3>
            <p className="mt-0.5 text-xs leading-relaxed text-ink/80">{e.text}</p>
            <pre className="mt-1 overflow-x-auto rounded-sm bg-white px-2 py-1 font-mono text-xs">{e.example}</pre>
          </section>
        ))}
      </div>
    </Dialog>
  );
}
