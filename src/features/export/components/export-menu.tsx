import { useEffect, useRef, useState } from "react";
import { Button } from "@/components/ui/button";
import { NETLIST_EXTENSION, printNetlistText, type EngineNetwork } from "@/lib/engine-netlist";
import type { Revision, ValueSet } from "@/lib/api-contract";
import { valueSetsCsv } from "@/features/value-sets";
import { downloadText, fileSafe } from "@/lib/download";
import { ledgerLatex } from "../lib/latex";

// Export of one revision: the ledger as LaTeX, the network as our JSON and as our text, and print.
export function ExportMenu({ revision, valueSets = [] }: { revision: Revision; valueSets?: ValueSet[] }) {
  const [open, setOpen] = useState(false);
  const menu = useRef<HTMLDivElement>(null);
  useEffect(() => {
    if (!open) return;
    const close = (event: MouseEvent | KeyboardEvent) => {
      if (event instanceof KeyboardEvent ? event.key === "Escape" : !menu.current?.contains(event.target as Node)) setOpen(false);
    };
    document.addEventListener("mousedown", close);
    document.addEventListener("keydown", close);
    return () => {
      document.removeEventListener("mousedown", close);
      document.removeEventListener("keydown", close);
    };
  }, [open]);
  const base = `${fileSafe(revision.network.title)}-r${revision.number}`;
  const choose = (action: () => void) => () => {
    setOpen(false);
    action();
  };
  const network = { ground: "0", ...revision.circuit } as EngineNetwork;
  const item = "block w-full px-3 py-1.5 text-left text-sm hover:bg-rule/50 focus:bg-rule/50 focus:outline-none";
  return (
    <div ref={menu} className="relative print:hidden">
      <Button aria-haspopup="menu" aria-expanded={open} onClick={() => setOpen(!open)}>
        Export
      </Button>
      {open && (
        <div role="menu" className="absolute right-0 z-20 mt-1 w-64 rounded border border-rule bg-paper py-1 shadow-lg">
          <button role="menuitem" type="button" className={item} onClick={choose(() => downloadText(`${base}.tex`, ledgerLatex(revision, valueSets), "application/x-tex"))}>
            Ledger as LaTeX (.tex){valueSets.length > 0 ? ", with the value sets" : ""}
          </button>
          {valueSets.length > 0 && (
            <button role="menuitem" type="button" className={item} onClick={choose(() => downloadText(`${base}-value-sets.csv`, valueSetsCsv(valueSets), "text/csv"))}>
              Value sets as CSV (.csv)
            </button>
          )}
          <button role="menuitem" type="button" className={item} onClick={choose(() => downloadText(`${base}.json`, `${JSON.stringify(revision.circuit, null, 2)}\n`, "application/json"))}>
            Network as JSON (.json)
          </button>
          <button role="menuitem" type="button" className={item} onClick={choose(() => downloadText(`${base}${NETLIST_EXTENSION}`, printNetlistText(network, revision.network.title), "text/plain"))}>
            Network as Portfold netlist ({NETLIST_EXTENSION})
          </button>
          <button
            role="menuitem"
            type="button"
            className={item}
            onClick={choose(() => requestAnimationFrame(() => window.print()))}
          >
            Print or save as PDF
          </button>
        </div>
      )}
    </div>
  );
}
