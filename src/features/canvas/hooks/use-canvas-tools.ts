import { useState } from "react";
import type { CellDefinition, ElementKind, EngineNetwork } from "@/lib/engine-netlist";
import { newCellPart, type PartElement } from "../model/cell-part";
import { partPins, type Drawing, type Part } from "../model/drawing";
import { addGround, addLabel, addPart, addWire, freshName, newElement, setPort, wiresAt, type PalettePreset } from "../model/edit";
import { samePoint, type Point, type Turn } from "../model/geometry";
import { roundPoint, snapToPin } from "../model/pick";
import type { DrawingHistory } from "./use-drawing-history";
import { useSelection } from "./use-selection";

type Placing = { kind: "place"; preset: PalettePreset; turn: Turn; mirror: boolean } | { kind: "place-cell"; cell: CellDefinition; turn: Turn; mirror: boolean };
export type Tool = { kind: "select" } | { kind: "connect"; from: Point | null } | { kind: "name" } | { kind: "zero" } | { kind: "terminals"; plus: Point | null } | Placing;
/** The tools a key or a toolbar button picks (placing starts from the palette). */
export type DrawingTool = "select" | "connect" | "name" | "zero" | "terminals";

const freshTool = (kind: DrawingTool): Tool => (kind === "connect" ? { kind, from: null } : kind === "terminals" ? { kind, plus: null } : { kind });

// Sources stand upright by default, as they are usually drawn; passives lie along the wire.
const DEFAULT_TURN = (kind: ElementKind): Turn => (kind === "voltage" || kind === "current" ? 1 : 0);

/** The part a placing tool puts down at a point, under the next free name. */
function placedPart(tool: Placing, d: Drawing, network: EngineNetwork, at: Point): Part {
  const element: PartElement = tool.kind === "place" ? newElement(tool.preset, freshName(d, tool.preset.kind), network, d) : newCellPart(tool.cell, freshName(d, tool.cell.id), network.ground);
  return { element, at, turn: tool.turn, mirror: tool.mirror };
}

// The current tool and what a press does with each: select (and drag), connect point to point,
// name a node, put a ground, mark the port's terminals, place a part from the palette.
export function useCanvasTools(history: DrawingHistory, network: EngineNetwork) {
  const [tool, setTool] = useState<Tool>({ kind: "select" });
  const [pointer, setPointer] = useState<Point | null>(null);
  const [nodeName, setNodeName] = useState("out");
  const selection = useSelection(history);
  const { drawing, commit } = history;
  const placing = tool.kind === "place" || tool.kind === "place-cell" ? tool : null;

  /** A press of the main button at world point w (only the select tool goes on to drag). */
  const press = (w: Point, shift: boolean) => {
    const p = snapToPin(history.shown, w);
    switch (tool.kind) {
      case "select":
        return selection.press(w, p, shift);
      case "connect": {
        if (!tool.from) return setTool({ kind: "connect", from: p });
        commit(addWire(drawing, tool.from, p));
        // A wire ends on a pin or on another conductor; otherwise it goes on from here.
        const landed = drawing.parts.flatMap(partPins).some((q) => samePoint(q, p)) || wiresAt(drawing, p).length > 0;
        setTool({ kind: "connect", from: landed ? null : p });
        return;
      }
      case "name":
        if (nodeName.trim()) commit(addLabel(drawing, p, nodeName.trim()));
        return;
      case "zero":
        commit(addGround(drawing, p));
        return;
      case "terminals":
        if (!tool.plus) return setTool({ kind: "terminals", plus: p });
        commit(setPort(drawing, tool.plus, p));
        setTool({ kind: "select" });
        return;
      case "place":
      case "place-cell": {
        const part = placedPart(tool, drawing, network, roundPoint(w));
        commit(addPart(drawing, part.element, part.at, part.turn, part.mirror));
        selection.selectPart(part.element.name);
        if (!shift) setTool({ kind: "select" });
        return;
      }
    }
  };

  return {
    tool,
    pick: (kind: DrawingTool) => setTool(freshTool(kind)),
    place: (preset: PalettePreset) => setTool({ kind: "place", preset, turn: DEFAULT_TURN(preset.kind), mirror: false }),
    placeCell: (cell: CellDefinition) => setTool({ kind: "place-cell", cell, turn: 0, mirror: false }),
    /** The grid point under the pointer: on the grid while placing, else snapped to a pin. */
    pointer,
    nodeName,
    setNodeName,
    selection,
    press,
    hover: (w: Point) => {
      setPointer(placing ? roundPoint(w) : snapToPin(history.shown, w));
      selection.dragTo(w);
    },
    leave: () => setPointer(null),
    release: selection.release,
    /** The part about to be placed, drawn faintly under the pointer. */
    ghost: placing && pointer ? placedPart(placing, drawing, network, pointer) : null,
    // While placing, Q and X turn and mirror the part to come; otherwise the selection.
    turn: (by: 1 | 3) => (placing ? setTool({ ...placing, turn: ((placing.turn + by) % 4) as Turn }) : selection.turn(by)),
    mirror: () => (placing ? setTool({ ...placing, mirror: !placing.mirror }) : selection.mirror()),
  };
}

export type CanvasTools = ReturnType<typeof useCanvasTools>;
