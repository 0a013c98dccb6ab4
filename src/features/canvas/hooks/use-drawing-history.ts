import { useRef, useState } from "react";
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
  const undone = useRef<Drawing[]>([]);
  const redone = useRef<Drawing[]>([]);
  const [draft, setDraft] = useState<Drawing | null>(null);

  const commit = (next: Drawing) => {
    if (readOnly || !onChange || next === drawing) return;
    undone.current.push(drawing);
    redone.current = [];
    onChange(next);
  };
  const step = (from: Drawing[], to: Drawing[]) => {
    const back = from.pop();
    if (!back || !onChange) return false;
    to.push(drawing);
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
    undo: () => step(undone.current, redone.current),
    redo: () => step(redone.current, undone.current),
    canUndo: undone.current.length > 0,
    canRedo: redone.current.length > 0,
  };
}
