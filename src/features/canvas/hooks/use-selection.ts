import { useState } from "react";
import { deleteSelection, isEmpty, mirrorSelection, moveSelection, NOTHING, selectAll, turnSelection, type Selection } from "../model/edit";
import type { Point } from "../model/geometry";
import { pickAt, roundPoint, selectionInBox, toggleSelection } from "../model/pick";
import type { DrawingHistory } from "./use-drawing-history";

type Drag = { kind: "move"; from: Point } | { kind: "box"; from: Point; to: Point } | null;

// What is selected, and what the select tool's press, drag and release do: a press on something
// picks it (Shift adds or drops it) and drags what is selected; a press on empty grid draws a box.
export function useSelection(history: DrawingHistory) {
  const [selection, setSelection] = useState<Selection>(NOTHING);
  const [drag, setDrag] = useState<Drag>(null);
  const { drawing, commit } = history;

  const press = (w: Point, p: Point, shift: boolean) => {
    const hit = pickAt(history.shown, w, p);
    if (isEmpty(hit)) {
      if (!shift) setSelection(NOTHING);
      return setDrag({ kind: "box", from: w, to: w });
    }
    const already = hit.parts.some((n) => selection.parts.includes(n)) || hit.wires.some((i) => selection.wires.includes(i));
    setSelection(shift ? toggleSelection(selection, hit) : already ? selection : hit);
    setDrag({ kind: "move", from: roundPoint(w) });
  };

  const dragTo = (w: Point) => {
    if (drag?.kind === "box") setDrag({ ...drag, to: w });
    if (drag?.kind === "move") {
      const at = roundPoint(w);
      history.draft(moveSelection(drawing, selection, [at[0] - drag.from[0], at[1] - drag.from[1]]));
    }
  };

  const release = () => {
    history.settle();
    const boxed = drag?.kind === "box" ? selectionInBox(drawing, drag.from, drag.to) : null;
    if (boxed) setSelection((s) => toggleSelection(s, boxed));
    setDrag(null);
  };

  const only = selection.parts.length === 1 && selection.wires.length + selection.labels.length + selection.grounds.length === 0;
  return {
    selection,
    /** Selects this part alone (a part just placed or renamed). */
    selectPart: (name: string) => setSelection({ ...NOTHING, parts: [name] }),
    clear: () => setSelection(NOTHING),
    selectAll: () => setSelection(selectAll(drawing)),
    /** The selection box being drawn, in grid steps. */
    box: drag?.kind === "box" ? drag : null,
    /** The one part selected alone, if that is what is selected. */
    part: only ? drawing.parts.find((p) => p.element.name === selection.parts[0]) : undefined,
    press,
    dragTo,
    release,
    // With nothing selected these change nothing, so they leave no step to undo.
    turn: (by: 1 | 3) => !isEmpty(selection) && commit(turnSelection(drawing, selection, by)),
    mirror: () => !isEmpty(selection) && commit(mirrorSelection(drawing, selection)),
    remove: () => {
      if (isEmpty(selection)) return;
      commit(deleteSelection(drawing, selection));
      setSelection(NOTHING);
    },
    /** Moves the selection a grid step; false when nothing is selected. */
    nudge: (delta: Point) => {
      if (isEmpty(selection)) return false;
      commit(moveSelection(drawing, selection, delta));
      return true;
    },
  };
}
