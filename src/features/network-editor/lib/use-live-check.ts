import { useEffect, useState } from "react";
import { parseNetlistText, type CellDefinition } from "@/lib/engine-netlist";
import type { Diagnostic } from "@/lib/api-contract";

const PAUSE_MS = 250; // after the last keystroke

/**
 * What a Solve would refuse, checked in the browser while the designer types: the engine's own
 * pre-solve check, so a message appears and disappears with its cause. Null until the first check.
 */
export function useLiveCheck(text: string, enabled = true, teamCells?: CellDefinition[]): { text: string; diagnostics: Diagnostic[] } | null {
  const [checked, setChecked] = useState<{ text: string; diagnostics: Diagnostic[] } | null>(null);
  useEffect(() => {
    if (!enabled) return;
    let cancelled = false;
    const timer = window.setTimeout(() => {
      void import("@/lib/engine-check").then(({ checkNetworkInput }) => {
        if (cancelled) return;
        let diagnostics: Diagnostic[];
        try {
          // The team's own cells are known to the solve; so they are here (the text's lines are kept for the rest).
          const parsed = parseNetlistText(text).network;
          const placesTeamCell = parsed?.cells?.some((c) => teamCells?.some((d) => d.id === c.cell));
          diagnostics = parsed && placesTeamCell ? checkNetworkInput({ ...parsed, cellDefinitions: [...(parsed.cellDefinitions ?? []), ...(teamCells ?? [])] }) : checkNetworkInput(text);
        } catch {
          diagnostics = [];
        }
        // Until the team's cells have loaded, a cell the browser does not know yet is not called unknown.
        setChecked({ text, diagnostics: teamCells ? diagnostics : diagnostics.filter((d) => d.code !== "cell-unknown") });
      });
    }, PAUSE_MS);
    return () => {
      cancelled = true;
      window.clearTimeout(timer);
    };
  }, [text, enabled, teamCells]);
  // A check of older text is not shown against newer text.
  return checked && checked.text === text ? checked : null;
}

/** Diagnostics of two sources, each said once. */
export function mergeDiagnostics(...lists: Diagnostic[][]): Diagnostic[] {
  const seen = new Set<string>();
  return lists.flat().filter((d) => {
    const key = `${d.code}|${d.line ?? ""}|${d.message}`;
    if (seen.has(key)) return false;
    seen.add(key);
    return true;
  });
}
