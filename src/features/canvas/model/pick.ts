// Picking on the drawing: what lies under a point of the grid, what a box holds, where a point snaps.
// A world point is in grid steps but not rounded; a grid point is rounded or on a pin.
import { cellHalfHeight, isCellPart } from "./cell-part";
import { partPins, type Drawing, type Part } from "./drawing";
import { NOTHING, wiresAt, type Selection } from "./edit";
import { insideSegment, samePoint, type Point } from "./geometry";

export const roundPoint = (w: Point): Point => [Math.round(w[0]), Math.round(w[1])];

/** Points snap to a pin within reach, otherwise to the grid. */
export function snapToPin(d: Drawing, w: Point): Point {
  return d.parts.flatMap(partPins).find((p) => Math.hypot(p[0] - w[0], p[1] - w[1]) < 0.7) ?? roundPoint(w);
}

function partAt(d: Drawing, w: Point): Part | undefined {
  // A part's body: 3 grid steps either way along its axis, 2 across (in its own frame).
  return [...d.parts].reverse().find((part) => {
    const dx = w[0] - part.at[0];
    const dy = w[1] - part.at[1];
    const horizontal = part.turn % 2 === 0;
    const [u, v] = horizontal ? [dx, dy] : [dy, dx];
    // A cell's box: 3 steps either way across its pin columns, its half height along them.
    if (isCellPart(part.element)) return Math.abs(u) <= 3.2 && Math.abs(v) <= cellHalfHeight(part.element.pins.length) + 0.2;
    return Math.abs(u) <= 2.6 && Math.abs(v) <= 2.2;
  });
}

/** What a press at world point w (snapped to p) picks: a part's body first, then a label, a ground, a wire. */
export function pickAt(d: Drawing, w: Point, p: Point): Selection {
  const part = partAt(d, w);
  if (part) return { ...NOTHING, parts: [part.element.name] };
  const label = d.labels.findIndex((l) => samePoint(l.at, p));
  if (label >= 0) return { ...NOTHING, labels: [label] };
  const ground = d.grounds.findIndex((g) => Math.abs(g[0] - w[0]) < 1 && w[1] - g[1] > -0.5 && w[1] - g[1] < 2);
  if (ground >= 0) return { ...NOTHING, grounds: [ground] };
  const near = d.wires.findIndex(([a, b]) => {
    const q: Point = a[0] === b[0] ? [a[0], Math.round(w[1])] : [Math.round(w[0]), a[1]];
    const close = a[0] === b[0] ? Math.abs(w[0] - a[0]) < 0.4 : Math.abs(w[1] - a[1]) < 0.4;
    return close && (insideSegment(q, a, b) || samePoint(q, a) || samePoint(q, b));
  });
  if (near >= 0) return { ...NOTHING, wires: [near] };
  return wiresAt(d, p).length ? { ...NOTHING, wires: wiresAt(d, p) } : NOTHING;
}

/** a with each thing of b added, or dropped when a already holds it (Shift+click). */
export function toggleSelection(a: Selection, b: Selection): Selection {
  const toggle = <T>(xs: T[], ys: T[]) => [...xs.filter((x) => !ys.includes(x)), ...ys.filter((y) => !xs.includes(y))];
  return { parts: toggle(a.parts, b.parts), wires: toggle(a.wires, b.wires), labels: toggle(a.labels, b.labels), grounds: toggle(a.grounds, b.grounds) };
}

/** What lies wholly inside the box from–to; null for a box too small to be meant (a click). */
export function selectionInBox(d: Drawing, from: Point, to: Point): Selection | null {
  const [x1, x2] = [Math.min(from[0], to[0]), Math.max(from[0], to[0])];
  const [y1, y2] = [Math.min(from[1], to[1]), Math.max(from[1], to[1])];
  if (x2 - x1 <= 0.5 && y2 - y1 <= 0.5) return null;
  const inside = (p: Point) => p[0] >= x1 && p[0] <= x2 && p[1] >= y1 && p[1] <= y2;
  const indicesWhere = <T>(list: readonly T[], keep: (item: T) => boolean) => list.flatMap((item, i) => (keep(item) ? [i] : []));
  return {
    parts: d.parts.filter((p) => inside(p.at)).map((p) => p.element.name),
    wires: indicesWhere(d.wires, ([a, b]) => inside(a) && inside(b)),
    labels: indicesWhere(d.labels, (l) => inside(l.at)),
    grounds: indicesWhere(d.grounds, inside),
  };
}
