import { useEffect, useId, useLayoutEffect, useMemo, useRef, useState, type KeyboardEvent as ReactKeyboardEvent, type PointerEvent as ReactPointerEvent } from "react";
import { Dialog } from "@/components/ui/dialog";
import { type CellDefinition, type Element, type ElementKind, type EngineNetwork } from "@/lib/engine-netlist";
import { cellHalfHeight, cellLibrary, isCellPart, newCellPart } from "../model/cell-part";
import type { Extraction } from "../model/connectivity";
import { partPins, type Drawing, type Part } from "../model/drawing";
import {
  NOTHING,
  addGround,
  addLabel,
  addPart,
  addWire,
  deleteSelection,
  freshName,
  isEmpty,
  mirrorSelection,
  moveSelection,
  newElement,
  PALETTE,
  replaceElement,
  selectAll,
  setPort,
  turnSelection,
  wiresAt,
  type PalettePreset,
  type Selection,
} from "../model/edit";
import { GRID, insideSegment, samePoint, type Point, type Turn } from "../model/geometry";
import { junctionsOf } from "../model/junctions";
import { PartInspector } from "./part-inspector";
import { PartSymbol } from "./part-symbol";
import { SHORTCUTS } from "./shortcuts";

type Tool = { kind: "select" } | { kind: "connect"; from: Point | null } | { kind: "name" } | { kind: "zero" } | { kind: "terminals"; plus: Point | null } | { kind: "place"; preset: PalettePreset; turn: Turn; mirror: boolean } | { kind: "place-cell"; cell: CellDefinition; turn: Turn; mirror: boolean };

// Sources stand upright by default, as they are usually drawn; passives lie along the wire.
const DEFAULT_TURN = (kind: ElementKind): Turn => (kind === "voltage" || kind === "current" ? 1 : 0);

interface View {
  x: number; // screen px of world origin
  y: number;
  scale: number;
}

function boundsOf(d: Drawing) {
  const pts: Point[] = [...d.parts.flatMap(partPins), ...d.wires.flat(), ...d.labels.map((l) => l.at), ...d.grounds];
  if (!pts.length) return null;
  const xs = pts.map((p) => p[0]);
  const ys = pts.map((p) => p[1]);
  return { minX: Math.min(...xs) - 5, minY: Math.min(...ys) - 5, maxX: Math.max(...xs) + 8, maxY: Math.max(...ys) + 5 };
}

function partAt(d: Drawing, p: [number, number]): Part | undefined {
  // A part's body: 3 grid steps either way along its axis, 2 across (in its own frame).
  return [...d.parts].reverse().find((part) => {
    const dx = p[0] - part.at[0];
    const dy = p[1] - part.at[1];
    const horizontal = part.turn % 2 === 0;
    const [u, v] = horizontal ? [dx, dy] : [dy, dx];
    // A cell's box: 3 steps either way across its pin columns, its half height along them.
    if (isCellPart(part.element)) return Math.abs(u) <= 3.2 && Math.abs(v) <= cellHalfHeight(part.element.pins.length) + 0.2;
    return Math.abs(u) <= 2.6 && Math.abs(v) <= 2.2;
  });
}

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

// The schematic canvas: standard symbols on a faint dotted grid, edited with the pointer and our own keys.
export function SchematicCanvas({ drawing, network, extraction, onChange, readOnly = false, faults = new Map(), height = 440, cells = BUILT_IN_LIST }: SchematicCanvasProps) {
  const gridId = useId().replace(/:/g, "");
  const box = useRef<HTMLDivElement>(null);
  const svg = useRef<SVGSVGElement>(null);
  const [view, setView] = useState<View>({ x: 60, y: 60, scale: 1 });
  const [tool, setTool] = useState<Tool>({ kind: "select" });
  const [selection, setSelection] = useState<Selection>(NOTHING);
  const [pointer, setPointer] = useState<Point | null>(null);
  const [drag, setDrag] = useState<{ kind: "move"; from: Point; preview: Drawing } | { kind: "pan"; from: [number, number]; view: View } | { kind: "box"; from: [number, number]; to: [number, number] } | null>(null);
  const [nodeName, setNodeName] = useState("out");
  const [help, setHelp] = useState(false);
  const undo = useRef<Drawing[]>([]);
  const redo = useRef<Drawing[]>([]);
  const shown = drag?.kind === "move" ? drag.preview : drawing;
  const junctions = useMemo(() => junctionsOf(shown), [shown]);

  const commit = (next: Drawing) => {
    if (readOnly || !onChange || next === drawing) return;
    undo.current.push(drawing);
    redo.current = [];
    onChange(next);
  };

  const fit = () => {
    const b = boundsOf(drawing);
    const w = box.current?.clientWidth ?? 600;
    if (!b) return setView({ x: w / 2, y: height / 2, scale: 1 });
    const scale = Math.min(2, Math.max(0.3, Math.min(w / ((b.maxX - b.minX) * GRID), height / ((b.maxY - b.minY) * GRID))));
    setView({ scale, x: -b.minX * GRID * scale + (w - (b.maxX - b.minX) * GRID * scale) / 2, y: -b.minY * GRID * scale + (height - (b.maxY - b.minY) * GRID * scale) / 2 });
  };
  // Fit once the box has its size; later edits keep the designer's view.
  useLayoutEffect(fit, []); // eslint-disable-line react-hooks/exhaustive-deps

  const world = (event: { clientX: number; clientY: number }): [number, number] => {
    const r = svg.current!.getBoundingClientRect();
    return [(event.clientX - r.left - view.x) / view.scale / GRID, (event.clientY - r.top - view.y) / view.scale / GRID];
  };
  // Points snap to a pin within reach, otherwise to the grid.
  const snapped = (w: [number, number]): Point => {
    const pin = shown.parts.flatMap(partPins).find((p) => Math.hypot(p[0] - w[0], p[1] - w[1]) < 0.7);
    return pin ?? [Math.round(w[0]), Math.round(w[1])];
  };

  const pickAt = (w: [number, number], p: Point): Selection => {
    const part = partAt(shown, w);
    if (part) return { ...NOTHING, parts: [part.element.name] };
    const label = shown.labels.findIndex((l) => samePoint(l.at, p));
    if (label >= 0) return { ...NOTHING, labels: [label] };
    const ground = shown.grounds.findIndex((g) => Math.abs(g[0] - w[0]) < 1 && w[1] - g[1] > -0.5 && w[1] - g[1] < 2);
    if (ground >= 0) return { ...NOTHING, grounds: [ground] };
    const near = shown.wires.findIndex(([a, b]) => {
      const q: Point = a[0] === b[0] ? [a[0], Math.round(w[1])] : [Math.round(w[0]), a[1]];
      const close = a[0] === b[0] ? Math.abs(w[0] - a[0]) < 0.4 : Math.abs(w[1] - a[1]) < 0.4;
      return close && (insideSegment(q, a, b) || samePoint(q, a) || samePoint(q, b));
    });
    if (near >= 0) return { ...NOTHING, wires: [near] };
    return wiresAt(shown, p).length ? { ...NOTHING, wires: wiresAt(shown, p) } : NOTHING;
  };

  const merge = (a: Selection, b: Selection): Selection => {
    const toggle = <T,>(xs: T[], ys: T[]) => [...xs.filter((x) => !ys.includes(x)), ...ys.filter((y) => !xs.includes(y))];
    return { parts: toggle(a.parts, b.parts), wires: toggle(a.wires, b.wires), labels: toggle(a.labels, b.labels), grounds: toggle(a.grounds, b.grounds) };
  };

  const onPointerDown = (event: ReactPointerEvent<SVGSVGElement>) => {
    box.current?.focus();
    const w = world(event);
    const p = snapped(w);
    if (event.button === 1 || event.altKey || (readOnly && event.button === 0)) {
      setDrag({ kind: "pan", from: [event.clientX, event.clientY], view });
      svg.current?.setPointerCapture(event.pointerId);
      return;
    }
    if (event.button !== 0) return;
    switch (tool.kind) {
      case "select": {
        const hit = pickAt(w, p);
        if (isEmpty(hit)) {
          if (!event.shiftKey) setSelection(NOTHING);
          setDrag({ kind: "box", from: w, to: w });
        } else {
          const already = hit.parts.some((n) => selection.parts.includes(n)) || hit.wires.some((i) => selection.wires.includes(i));
          const next = event.shiftKey ? merge(selection, hit) : already ? selection : hit;
          setSelection(next);
          setDrag({ kind: "move", from: [Math.round(w[0]), Math.round(w[1])], preview: drawing });
        }
        svg.current?.setPointerCapture(event.pointerId);
        return;
      }
      case "connect": {
        if (!tool.from) return setTool({ kind: "connect", from: p });
        const next = addWire(drawing, tool.from, p);
        commit(next);
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
      case "place-cell": {
        const name = freshName(drawing, tool.cell.id);
        commit(addPart(drawing, newCellPart(tool.cell, name, network.ground), [Math.round(w[0]), Math.round(w[1])], tool.turn, tool.mirror));
        setSelection({ ...NOTHING, parts: [name] });
        if (!event.shiftKey) setTool({ kind: "select" });
        return;
      }
      case "place": {
        const name = freshName(drawing, tool.preset.kind);
        const element = newElement(tool.preset, name, network, drawing);
        commit(addPart(drawing, element, [Math.round(w[0]), Math.round(w[1])], tool.turn, tool.mirror));
        setSelection({ ...NOTHING, parts: [name] });
        if (!event.shiftKey) setTool({ kind: "select" });
        return;
      }
    }
  };

  const onPointerMove = (event: ReactPointerEvent<SVGSVGElement>) => {
    const w = world(event);
    setPointer(tool.kind === "place" || tool.kind === "place-cell" ? [Math.round(w[0]), Math.round(w[1])] : snapped(w));
    if (!drag) return;
    if (drag.kind === "pan") setView({ ...drag.view, x: drag.view.x + event.clientX - drag.from[0], y: drag.view.y + event.clientY - drag.from[1] });
    else if (drag.kind === "box") setDrag({ ...drag, to: w });
    else if (drag.kind === "move" && !readOnly) {
      const delta: Point = [Math.round(w[0]) - drag.from[0], Math.round(w[1]) - drag.from[1]];
      setDrag({ ...drag, preview: moveSelection(drawing, selection, delta) });
    }
  };

  const onPointerUp = () => {
    if (drag?.kind === "move" && drag.preview !== drawing) commit(drag.preview);
    if (drag?.kind === "box") {
      const [x1, x2] = [Math.min(drag.from[0], drag.to[0]), Math.max(drag.from[0], drag.to[0])];
      const [y1, y2] = [Math.min(drag.from[1], drag.to[1]), Math.max(drag.from[1], drag.to[1])];
      const inside = (p: Point) => p[0] >= x1 && p[0] <= x2 && p[1] >= y1 && p[1] <= y2;
      if (x2 - x1 > 0.5 || y2 - y1 > 0.5) {
        setSelection((s) =>
          merge(s, {
            parts: drawing.parts.filter((p) => inside(p.at)).map((p) => p.element.name),
            wires: drawing.wires.map((wire, i) => [wire, i] as const).filter(([[a, b]]) => inside(a) && inside(b)).map(([, i]) => i),
            labels: drawing.labels.map((l, i) => [l, i] as const).filter(([l]) => inside(l.at)).map(([, i]) => i),
            grounds: drawing.grounds.map((g, i) => [g, i] as const).filter(([g]) => inside(g)).map(([, i]) => i),
          }),
        );
      }
    }
    setDrag(null);
  };

  const step = (which: "undo" | "redo") => {
    const from = which === "redo" ? redo.current : undo.current;
    const to = which === "redo" ? undo.current : redo.current;
    const back = from.pop();
    if (!back || !onChange) return;
    to.push(drawing);
    setSelection(NOTHING);
    onChange(back);
  };

  const zoomAt = (factor: number, sx: number, sy: number) =>
    setView((v) => {
      const scale = Math.min(4, Math.max(0.25, v.scale * factor));
      return { scale, x: sx - ((sx - v.x) * scale) / v.scale, y: sy - ((sy - v.y) * scale) / v.scale };
    });

  // The wheel zooms the drawing, not the page.
  useEffect(() => {
    const el = svg.current;
    if (!el) return;
    const wheel = (event: WheelEvent) => {
      event.preventDefault();
      const r = el.getBoundingClientRect();
      zoomAt(event.deltaY < 0 ? 1.15 : 1 / 1.15, event.clientX - r.left, event.clientY - r.top);
    };
    el.addEventListener("wheel", wheel, { passive: false });
    return () => el.removeEventListener("wheel", wheel);
  }, []);

  const onKeyDown = (event: ReactKeyboardEvent<HTMLDivElement>) => {
    if ((event.target as HTMLElement).closest("input, select, textarea")) return;
    const key = event.key;
    const ctrl = event.ctrlKey || event.metaKey;
    const w = box.current?.clientWidth ?? 600;
    const handled = () => event.preventDefault();
    if (key === "?") return handled(), setHelp(true);
    if (key === "=" || key === "+") return handled(), zoomAt(1.25, w / 2, height / 2);
    if (key === "-") return handled(), zoomAt(0.8, w / 2, height / 2);
    if (key === "Home") return handled(), fit();
    if (key === "Escape") return handled(), setTool({ kind: "select" });
    if (readOnly) return;
    if (ctrl && key.toLowerCase() === "z") return handled(), step(event.shiftKey ? "redo" : "undo");
    if (ctrl && key.toLowerCase() === "y") return handled(), step("redo");
    if (ctrl && key.toLowerCase() === "a") return handled(), setSelection(selectAll(drawing));
    if (ctrl) return;
    const lower = key.toLowerCase();
    if (lower === "c") return handled(), setTool({ kind: "connect", from: null });
    if (lower === "n") return handled(), setTool({ kind: "name" });
    if (lower === "z") return handled(), setTool({ kind: "zero" });
    if (lower === "t") return handled(), setTool({ kind: "terminals", plus: null });
    if (lower === "q" || lower === "x") {
      handled();
      if (tool.kind === "place" || tool.kind === "place-cell") return setTool(lower === "x" ? { ...tool, mirror: !tool.mirror } : { ...tool, turn: ((tool.turn + (event.shiftKey ? 3 : 1)) % 4) as Turn });
      return commit(lower === "x" ? mirrorSelection(drawing, selection) : turnSelection(drawing, selection, event.shiftKey ? 3 : 1));
    }
    if (key === "Delete" || key === "Backspace") {
      handled();
      commit(deleteSelection(drawing, selection));
      return setSelection(NOTHING);
    }
    const arrows: Record<string, Point> = { ArrowLeft: [-1, 0], ArrowRight: [1, 0], ArrowUp: [0, -1], ArrowDown: [0, 1] };
    if (arrows[key] && !isEmpty(selection)) return handled(), commit(moveSelection(drawing, selection, arrows[key]));
  };

  const selectedPart = selection.parts.length === 1 && selection.wires.length + selection.labels.length + selection.grounds.length === 0 ? drawing.parts.find((p) => p.element.name === selection.parts[0]) : undefined;
  const toolButton = (label: string, shortcut: string, active: boolean, onClick: () => void) => (
    <button type="button" aria-pressed={active} onClick={onClick} title={`${label} (${shortcut})`} className={`rounded border px-2 py-0.5 text-xs ${active ? "border-copper bg-copper/10 text-ink" : "border-rule bg-white/60 text-ink/80 hover:border-ink/40"}`}>
      {label} <kbd className="font-mono text-[10px] text-ink/50">{shortcut}</kbd>
    </button>
  );
  const ghost =
    tool.kind === "place" && pointer
      ? ({ element: newElement(tool.preset, freshName(drawing, tool.preset.kind), network, drawing), at: pointer, turn: tool.turn, mirror: tool.mirror } satisfies Part)
      : tool.kind === "place-cell" && pointer
        ? ({ element: newCellPart(tool.cell, freshName(drawing, tool.cell.id), network.ground), at: pointer, turn: tool.turn, mirror: tool.mirror } satisfies Part)
        : null;
  const nodeOfPointer = pointer && tool.kind !== "place" && tool.kind !== "place-cell" ? extraction.nodeAt(pointer) : null;
  const s = (p: Point) => [p[0] * GRID, p[1] * GRID] as const;

  return (
    <div className="space-y-2">
      {!readOnly && (
        <div className="space-y-1.5">
          <div role="toolbar" aria-label="Palette" className="flex flex-wrap gap-1">
            {PALETTE.map((preset) => (
              <button
                key={preset.label}
                type="button"
                aria-pressed={tool.kind === "place" && tool.preset === preset}
                title={preset.value ? `${preset.kind} = ${preset.value.replaceAll("{ground}", network.ground).replaceAll("{first}", "…")}` : "ideal op-amp"}
                onClick={() => setTool({ kind: "place", preset, turn: DEFAULT_TURN(preset.kind), mirror: false })}
                className={`rounded border px-1.5 py-0.5 font-mono text-[11px] ${tool.kind === "place" && tool.preset === preset ? "border-copper bg-copper/10" : "border-rule bg-white/60 hover:border-ink/40"}`}
              >
                {preset.label}
              </button>
            ))}
            <span className="mx-1 self-center text-[11px] text-ink/50">cells:</span>
            {cells.map((cell) => (
              <button
                key={cell.id}
                type="button"
                title={`${cell.title} (terminals ${cell.terminals.join(", ")})`}
                aria-pressed={tool.kind === "place-cell" && tool.cell.id === cell.id}
                onClick={() => setTool({ kind: "place-cell", cell, turn: 0, mirror: false })}
                className={`rounded border px-1.5 py-0.5 font-mono text-[11px] ${tool.kind === "place-cell" && tool.cell.id === cell.id ? "border-copper bg-copper/10" : "border-dashed border-rule bg-white/60 hover:border-ink/40"}`}
              >
                {cell.id}
              </button>
            ))}
          </div>
          <div role="toolbar" aria-label="Drawing tools" className="flex flex-wrap items-center gap-1">
            {toolButton("Select", "Esc", tool.kind === "select", () => setTool({ kind: "select" }))}
            {toolButton("Connect", "C", tool.kind === "connect", () => setTool({ kind: "connect", from: null }))}
            {toolButton("Name node", "N", tool.kind === "name", () => setTool({ kind: "name" }))}
            <label className="flex items-center gap-1 text-xs">
              <span className="sr-only">Node name</span>
              <input aria-label="Node name" value={nodeName} onChange={(e) => setNodeName(e.target.value.replace(/[^\p{L}\p{N}_]/gu, ""))} className="w-16 rounded border border-rule bg-white px-1 py-0.5 font-mono text-xs" />
            </label>
            {toolButton("Ground", "Z", tool.kind === "zero", () => setTool({ kind: "zero" }))}
            {toolButton("Port", "T", tool.kind === "terminals", () => setTool({ kind: "terminals", plus: null }))}
            <span className="mx-1 h-4 border-l border-rule" />
            <button type="button" className="rounded border border-rule bg-white/60 px-2 py-0.5 text-xs" onClick={() => setHelp(true)}>
              Keys <kbd className="font-mono text-[10px] text-ink/50">?</kbd>
            </button>
          </div>
        </div>
      )}
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
          onPointerLeave={() => setPointer(null)}
          onContextMenu={(e) => e.preventDefault()}
        >
          <defs>
            <pattern id={gridId} width={GRID} height={GRID} patternUnits="userSpaceOnUse" patternTransform={`translate(${view.x} ${view.y}) scale(${view.scale})`}>
              <circle cx="0" cy="0" r={0.9 / view.scale} fill="#1E2430" opacity="0.3" />
            </pattern>
          </defs>
          <rect width="100%" height="100%" fill={`url(#${gridId})`} />
          <g transform={`translate(${view.x} ${view.y}) scale(${view.scale})`}>
            <g fill="none" stroke="currentColor" strokeWidth="1.4" strokeLinecap="round" strokeLinejoin="round">
              {shown.wires.map(([a, b], i) => (
                <path key={i} data-wire={i} d={`M${s(a)[0]} ${s(a)[1]}L${s(b)[0]} ${s(b)[1]}`} stroke={selection.wires.includes(i) ? "#B5562B" : "currentColor"} strokeWidth={selection.wires.includes(i) ? 2.2 : 1.4} />
              ))}
              {shown.grounds.map((g, i) => (
                <path key={i} data-ground={i} d={`M${s(g)[0]} ${s(g)[1]}v8m-9 0h18m-13 4h8m-5 4h2`} stroke={selection.grounds.includes(i) ? "#B5562B" : "currentColor"} />
              ))}
              {shown.parts.map((part) => (
                <PartSymbol key={part.element.name} part={part} selected={selection.parts.includes(part.element.name)} faulty={faults.has(part.element.name)} note={faults.get(part.element.name)} />
              ))}
              {ghost && (
                <g opacity={0.45}>
                  <PartSymbol part={ghost} selected={false} faulty={false} />
                </g>
              )}
              {tool.kind === "connect" && tool.from && pointer && (
                <path d={`M${s(tool.from)[0]} ${s(tool.from)[1]}H${s(pointer)[0]}V${s(pointer)[1]}`} stroke="#B5562B" strokeDasharray="4 3" />
              )}
            </g>
            <g fill="currentColor">
              {junctions.map((j, i) => (
                <circle key={i} data-junction="" cx={s(j)[0]} cy={s(j)[1]} r={3} />
              ))}
            </g>
            <g fontSize="10" className="font-mono">
              {shown.labels.map((l, i) => (
                <g key={i} data-label={l.node}>
                  <path d={`M${s(l.at)[0]} ${s(l.at)[1]}l4 -5h${6 * l.node.length + 8}`} fill="none" stroke={selection.labels.includes(i) ? "#B5562B" : "#1E2430"} strokeOpacity={0.6} />
                  <text x={s(l.at)[0] + 7} y={s(l.at)[1] - 8} fill={selection.labels.includes(i) ? "#B5562B" : "#1E2430"}>
                    {l.node}
                  </text>
                </g>
              ))}
            </g>
            {shown.port && (
              <g data-port="">
                {(["plus", "minus"] as const).map((which) => {
                  const [x, y] = s(shown.port![which]);
                  return (
                    <g key={which}>
                      <circle cx={x} cy={y} r={5} fill="#FAF8F3" stroke="#B5562B" strokeWidth={1.8} />
                      <text x={x + 8} y={y + 14} fontSize="11" fontWeight="600" fill="#B5562B">
                        {which === "plus" ? "+" : "−"}
                      </text>
                    </g>
                  );
                })}
              </g>
            )}
            {tool.kind === "terminals" && tool.plus && <circle cx={s(tool.plus)[0]} cy={s(tool.plus)[1]} r={5} fill="none" stroke="#B5562B" strokeDasharray="2 2" strokeWidth={1.8} />}
            {drag?.kind === "box" && (
              <rect
                x={Math.min(drag.from[0], drag.to[0]) * GRID}
                y={Math.min(drag.from[1], drag.to[1]) * GRID}
                width={Math.abs(drag.to[0] - drag.from[0]) * GRID}
                height={Math.abs(drag.to[1] - drag.from[1]) * GRID}
                fill="#B5562B"
                fillOpacity={0.05}
                stroke="#B5562B"
                strokeDasharray="3 3"
              />
            )}
          </g>
        </svg>
        <div className="pointer-events-none absolute bottom-1 left-2 font-mono text-[10px] text-ink/50">
          {pointer ? `${pointer[0]}, ${pointer[1]}${nodeOfPointer ? ` · node ${nodeOfPointer}` : ""}` : ""}
          {tool.kind === "terminals" ? (tool.plus ? " · click the − terminal" : " · click the + terminal") : ""}
          {tool.kind === "connect" ? (tool.from ? " · click the next point (Escape ends)" : " · click where the wire starts") : ""}
        </div>
        <div className="absolute right-1 top-1 flex gap-0.5">
          {[
            ["−", "Zoom out", () => zoomAt(0.8, (box.current?.clientWidth ?? 600) / 2, height / 2)],
            ["+", "Zoom in", () => zoomAt(1.25, (box.current?.clientWidth ?? 600) / 2, height / 2)],
            ["⤢", "Fit the drawing", fit],
          ].map(([label, title, act]) => (
            <button key={title as string} type="button" title={title as string} aria-label={title as string} onClick={act as () => void} className="h-6 w-6 rounded border border-rule bg-paper text-xs text-ink/70 hover:text-copper">
              {label as string}
            </button>
          ))}
          {!readOnly && (
            <>
              <button type="button" title="Undo (Ctrl+Z)" aria-label="Undo" disabled={!undo.current.length} onClick={() => step("undo")} className="h-6 rounded border border-rule bg-paper px-1 text-xs text-ink/70 hover:text-copper disabled:opacity-40">
                ↶
              </button>
              <button type="button" title="Redo (Ctrl+Shift+Z)" aria-label="Redo" disabled={!redo.current.length} onClick={() => step("redo")} className="h-6 rounded border border-rule bg-paper px-1 text-xs text-ink/70 hover:text-copper disabled:opacity-40">
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
            commit(replaceElement(drawing, selectedPart.element.name, next));
            if (next.name !== selectedPart.element.name) setSelection({ ...NOTHING, parts: [next.name] });
          }}
        />
      )}
      <Dialog open={help} onClose={() => setHelp(false)} title="Keys of the drawing" wide>
        <table className="w-full text-sm">
          <tbody>
            {SHORTCUTS.map((k) => (
              <tr key={k.keys} className="border-b border-rule/70">
                <th scope="row" className="whitespace-nowrap py-1 pr-4 text-left font-mono text-xs font-medium">
                  {k.keys}
                </th>
                <td className="py-1">{k.does}</td>
              </tr>
            ))}
          </tbody>
        </table>
        <p className="mt-3 text-xs text-ink/60">Pick a kind in the palette, then click the grid to place it (Q and X turn and mirror it first; Shift+click places several).</p>
      </Dialog>
    </div>
  );
}

