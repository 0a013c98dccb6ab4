import { useEffect, useState } from "react";
import type { Diagnostic } from "@/types/api";

const PAUSE_MS = 250; // after the last keystroke

/**
 * What a Solve would refuse, checked in the browser while the designer types: the engine's own
 * pre-solve check, so a message appears and disappears with its cause. Null until the first check.
 */
export function useLiveCheck(text: string, enabled = true): { text: string; diagnostics: Diagnostic[] } | null {
  const [checked, setChecked] = useState<{ text: string; diagnostics: Diagnostic[] } | null>(null);
  useEffect(() => {
    if (!enabled) return;
    let cancelled = false;
    const timer = window.setTimeout(() => {
      void import("@/lib/engine-check").then(({ checkNetworkInput }) => {
        if (cancelled) return;
        let diagnostics: Diagnostic[];
        try {
          diagnostics = checkNetworkInput(text);
        } catch {
          diagnostics = [];
        }
        setChecked({ text, diagnostics });
      });
    }, PAUSE_MS);
    return () => {
      cancelled = true;
      window.clearTimeout(timer);
    };
  }, [text, enabled]);
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
