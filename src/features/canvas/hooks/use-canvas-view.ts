import { useEffect, useLayoutEffect, useRef, useState, type PointerEvent as ReactPointerEvent, type RefObject } from "react";
import { partPins, type Drawing } from "../model/drawing";
import { GRID, type Point } from "../model/geometry";

/** Where the drawing sits on screen: the screen px of the world origin, and the zoom. */
export interface View {
  x: number;
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

/** A press that pans rather than edits: the middle button, Alt, or any press on a drawing that cannot change. */
export const pansTheView = (event: { button: number; altKey: boolean }, readOnly: boolean) => event.button === 1 || event.altKey || (readOnly && event.button === 0);

/** The canvas's elements: the focusable box (its width) and the SVG (pointer positions, capture, the wheel). */
export interface CanvasElements {
  box: RefObject<HTMLDivElement | null>;
  svg: RefObject<SVGSVGElement | null>;
}

// Pan, zoom and fit of the canvas, and the mapping from a pointer on screen to the drawing's grid.
export function useCanvasView({ box, svg }: CanvasElements, drawing: Drawing, height: number) {
  const [view, setView] = useState<View>({ x: 60, y: 60, scale: 1 });
  const pan = useRef<{ from: [number, number]; view: View } | null>(null);
  const width = () => box.current?.clientWidth ?? 600;
  const capture = (pointerId: number) => svg.current?.setPointerCapture(pointerId);

  const fit = () => {
    const b = boundsOf(drawing);
    const w = width();
    if (!b) return setView({ x: w / 2, y: height / 2, scale: 1 });
    const scale = Math.min(2, Math.max(0.3, Math.min(w / ((b.maxX - b.minX) * GRID), height / ((b.maxY - b.minY) * GRID))));
    setView({ scale, x: -b.minX * GRID * scale + (w - (b.maxX - b.minX) * GRID * scale) / 2, y: -b.minY * GRID * scale + (height - (b.maxY - b.minY) * GRID * scale) / 2 });
  };
  // Fit once the box has its size; later edits keep the designer's view.
  // eslint-disable-next-line react-hooks/set-state-in-effect, react-hooks/exhaustive-deps -- the fit needs the box's measured width, once
  useLayoutEffect(fit, []);

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
  }, [svg]);

  return {
    view,
    /** The SVG transform from grid px to screen px. */
    transform: `translate(${view.x} ${view.y}) scale(${view.scale})`,
    fit,
    /** Zooms about the middle of the canvas. */
    zoom: (factor: number) => zoomAt(factor, width() / 2, height / 2),
    /** The pointer's place on the drawing, in grid steps, not rounded. */
    toGrid: (event: { clientX: number; clientY: number }): Point => {
      const r = svg.current!.getBoundingClientRect();
      return [(event.clientX - r.left - view.x) / view.scale / GRID, (event.clientY - r.top - view.y) / view.scale / GRID];
    },
    /** Keeps the pointer's moves and release on the canvas while a drag lasts. */
    capture,
    startPan: (event: ReactPointerEvent) => {
      pan.current = { from: [event.clientX, event.clientY], view };
      capture(event.pointerId);
    },
    panTo: (event: { clientX: number; clientY: number }) => {
      const start = pan.current;
      if (start) setView({ ...start.view, x: start.view.x + event.clientX - start.from[0], y: start.view.y + event.clientY - start.from[1] });
    },
    endPan: () => {
      pan.current = null;
    },
  };
}

