import { useState } from "react";
import type { Drawing } from "../model/drawing";

export interface DrawingHistory {
  /** The drawing as the owner holds it. */
  drawing: Drawing;
  /** What the canvas shows: the draft of an edit in progress (a drag), else the drawing. */
  shown: Drawing;
  /** Shows a draft without committing it. */
  draft(next: Drawing): void;
  /** Commits the draft, if any, and drops it. */
  settle(): void;
  /** Hands an edit to the owner and keeps the drawing it replaces for undo. */
  commit(next: Drawing): void;
  /** Steps back (or forward again); false when there is nothing to step to. */
  undo(): boolean;
  redo(): boolean;
  canUndo: boolean;
  canRedo: boolean;
}

// The owner keeps the drawing; the canvas keeps the drawings it replaced, to step back and forth.
export function useDrawingHistory(drawing: Drawing, onChange: ((next: Drawing) => void) | undefined, readOnly: boolean): DrawingHistory {
  const [past, setPast] = useState<{ undone: Drawing[]; redone: Drawing[] }>({ undone: [], redone: [] });
  const [draft, setDraft] = useState<Drawing | null>(null);

  const commit = (next: Drawing) => {
    if (readOnly || !onChange || next === drawing) return;
    setPast((p) => ({ undone: [...p.undone, drawing], redone: [] }));
    onChange(next);
  };
  // Takes the last drawing of one stack and puts the present one on the other.
  const step = (direction: "undo" | "redo") => {
    const from = direction === "undo" ? past.undone : past.redone;
    const back = from.at(-1);
    if (!back || !onChange) return false;
    const rest = from.slice(0, -1);
    setPast((p) => (direction === "undo" ? { undone: rest, redone: [...p.redone, drawing] } : { undone: [...p.undone, drawing], redone: rest }));
    onChange(back);
    return true;
  };
  return {
    drawing,
    shown: draft ?? drawing,
    draft: setDraft,
    settle: () => {
      if (draft) commit(draft);
      setDraft(null);
    },
    commit,
    undo: () => step("undo"),
    redo: () => step("redo"),
    canUndo: past.undone.length > 0,
    canRedo: past.redone.length > 0,
  };
}
