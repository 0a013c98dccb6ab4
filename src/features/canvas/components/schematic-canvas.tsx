import { useId, useRef, useState, type KeyboardEvent as ReactKeyboardEvent, type PointerEvent as ReactPointerEvent } from "react";
import type { CellDefinition, Element, EngineNetwork } from "@/lib/engine-netlist";
import { cellLibrary, isCellPart } from "../model/cell-part";
import type { Extraction } from "../model/connectivity";
import type { Drawing } from "../model/drawing";
import { replaceElement } from "../model/edit";
import { GRID } from "../model/geometry";
import { useCanvasTools } from "../hooks/use-canvas-tools";
import { pansTheView, useCanvasView } from "../hooks/use-canvas-view";
import { useDrawingHistory } from "../hooks/use-drawing-history";
import { CanvasScene } from "./canvas-scene";
import { CanvasToolbars } from "./canvas-toolbars";
import { PartInspector } from "./part-inspector";
import { ShortcutSheet } from "./shortcut-sheet";
import { runShortcut, type CanvasCommands } from "./shortcuts";

export interface SchematicCanvasProps {
  drawing: Drawing;
  network: EngineNetwork;
  extraction: Extraction;
  onChange?: (next: Drawing) => void;
  readOnly?: boolean;
  /** Parts the engine's diagnostics name, with what they say. */
  faults?: Map<string, string>;
  height?: number;
  /** The cells the palette offers: the built-in ones, then the team's. */
  cells?: readonly CellDefinition[];
}

const BUILT_IN_LIST = [...cellLibrary().values()];
const CORNER_BUTTON = "h-6 rounded border border-rule bg-paper text-xs text-ink/70 hover:text-copper";

// The schematic canvas: standard symbols on a faint dotted grid, edited with the pointer and our own keys.
export function SchematicCanvas({ drawing, network, extraction, onChange, readOnly = false, faults = new Map(), height = 440, cells = BUILT_IN_LIST }: SchematicCanvasProps) {
  const gridId = useId().replace(/:/g, "");
  const history = useDrawingHistory(drawing, onChange, readOnly);
  const box = useRef<HTMLDivElement>(null);
  const svg = useRef<SVGSVGElement>(null);
  const view = useCanvasView({ box, svg }, drawing, height);
  const tools = useCanvasTools(history, network);
  const { tool, pointer, selection } = tools;
  const [help, setHelp] = useState(false);

  const commands: CanvasCommands = {
    showKeys: () => setHelp(true),
    zoom: view.zoom,
    fit: view.fit,
    pickTool: tools.pick,
    turn: tools.turn,
    mirror: tools.mirror,
    remove: selection.remove,
    nudge: selection.nudge,
    undo: () => history.undo() && selection.clear(),
    redo: () => history.redo() && selection.clear(),
    selectAll: selection.selectAll,
  };

  const onKeyDown = (event: ReactKeyboardEvent<HTMLDivElement>) => {
    if ((event.target as HTMLElement).closest("input, select, textarea")) return;
    if (runShortcut(event, commands, readOnly)) event.preventDefault();
  };
  const onPointerDown = (event: ReactPointerEvent<SVGSVGElement>) => {
    box.current?.focus();
    if (pansTheView(event, readOnly)) return view.startPan(event);
    if (event.button !== 0) return;
    if (tool.kind === "select") view.capture(event.pointerId);
    tools.press(view.toGrid(event), event.shiftKey);
  };
  const onPointerMove = (event: ReactPointerEvent<SVGSVGElement>) => {
    view.panTo(event);
    tools.hover(view.toGrid(event));
  };
  const onPointerUp = () => {
    view.endPan();
    tools.release();
  };

  const selectedPart = selection.part;
  const placing = tool.kind === "place" || tool.kind === "place-cell";
  const nodeOfPointer = pointer && !placing ? extraction.nodeAt(pointer) : null;

  return (
    <div className="space-y-2">
      {!readOnly && <CanvasToolbars tools={tools} network={network} cells={cells} onShowKeys={() => setHelp(true)} />}
      <div
        ref={box}
        tabIndex={0}
        onKeyDown={onKeyDown}
        aria-label={readOnly ? "Drawing of the network" : "Schematic canvas: press ? for the keys"}
        className="relative overflow-hidden rounded border border-rule bg-white/50 focus:outline-none focus-visible:ring-2 focus-visible:ring-copper/50"
        style={{ height }}
      >
        <svg
          ref={svg}
          role="img"
          aria-label={`Drawing: ${drawing.parts.length} parts, port ${extraction.port ? `${extraction.port.plus} to ${extraction.port.minus}` : "not marked"}`}
          data-testid="schematic-canvas"
          className={`block h-full w-full select-none text-ink ${tool.kind === "select" ? "cursor-default" : "cursor-crosshair"}`}
          onPointerDown={onPointerDown}
          onPointerMove={onPointerMove}
          onPointerUp={onPointerUp}
          onPointerLeave={tools.leave}
          onContextMenu={(e) => e.preventDefault()}
        >
          <defs>
            <pattern id={gridId} width={GRID} height={GRID} patternUnits="userSpaceOnUse" patternTransform={view.transform}>
              <circle cx="0" cy="0" r={0.9 / view.view.scale} fill="#1E2430" opacity="0.3" />
            </pattern>
          </defs>
          <rect width="100%" height="100%" fill={`url(#${gridId})`} />
          <g transform={view.transform}>
            <CanvasScene shown={history.shown} selection={selection.selection} faults={faults} tool={tool} pointer={pointer} ghost={tools.ghost} box={selection.box} />
          </g>
        </svg>
        <div className="pointer-events-none absolute bottom-1 left-2 font-mono text-[10px] text-ink/50">
          {pointer ? `${pointer[0]}, ${pointer[1]}${nodeOfPointer ? ` · node ${nodeOfPointer}` : ""}` : ""}
          {tool.kind === "terminals" ? (tool.plus ? " · click the − terminal" : " · click the + terminal") : ""}
          {tool.kind === "connect" ? (tool.from ? " · click the next point (Escape ends)" : " · click where the wire starts") : ""}
        </div>
        <div className="absolute right-1 top-1 flex gap-0.5">
          {(
            [
              ["−", "Zoom out", () => view.zoom(0.8)],
              ["+", "Zoom in", () => view.zoom(1.25)],
              ["⤢", "Fit the drawing", view.fit],
            ] as const
          ).map(([label, title, act]) => (
            <button key={title} type="button" title={title} aria-label={title} onClick={act} className={`w-6 ${CORNER_BUTTON}`}>
              {label}
            </button>
          ))}
          {!readOnly && (
            <>
              <button type="button" title="Undo (Ctrl+Z)" aria-label="Undo" disabled={!history.canUndo} onClick={commands.undo} className={`px-1 ${CORNER_BUTTON} disabled:opacity-40`}>
                ↶
              </button>
              <button type="button" title="Redo (Ctrl+Shift+Z)" aria-label="Redo" disabled={!history.canRedo} onClick={commands.redo} className={`px-1 ${CORNER_BUTTON} disabled:opacity-40`}>
                ↷
              </button>
            </>
          )}
        </div>
      </div>
      {!readOnly && selectedPart && !isCellPart(selectedPart.element) && (
        <PartInspector
          key={selectedPart.element.name}
          element={selectedPart.element}
          nodes={extraction.nets.map((n) => n.name)}
          elements={drawing.parts.map((p) => p.element.name)}
          onChange={(next: Element) => {
            history.commit(replaceElement(drawing, selectedPart.element.name, next));
            if (next.name !== selectedPart.element.name) selection.selectPart(next.name);
          }}
        />
      )}
      <ShortcutSheet open={help} onClose={() => setHelp(false)} />
    </div>
  );
}
