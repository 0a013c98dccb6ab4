// Grid geometry of the drawing: points in grid steps, a part's pins from its kind, turn and mirror.
import type { ElementKind } from "@/lib/engine-netlist";

/** A point on the drawing grid, in grid steps (one step is GRID px on screen at zoom 1). */
export type Point = readonly [number, number];
/** Quarter turns clockwise on screen (y grows downwards). */
export type Turn = 0 | 1 | 2 | 3;

export const GRID = 10;

export const pointKey = (p: Point) => `${p[0]},${p[1]}`;
export const samePoint = (a: Point, b: Point) => a[0] === b[0] && a[1] === b[1];

/** Local pin positions: two-terminal parts lie along x, first node at the left; an op-amp points right. */
export function localPins(kind: ElementKind): Point[] {
  return kind === "opamp"
    ? [
        [-3, -1],
        [-3, 1],
        [3, 0],
      ]
    : [
        [-3, 0],
        [3, 0],
      ];
}

// Mirror first (across the local vertical axis), then turn; the same order everywhere.
export function orient(p: Point, turn: Turn, mirror: boolean): Point {
  let [x, y] = p;
  if (mirror) x = -x;
  for (let i = 0; i < turn; i += 1) [x, y] = [-y, x];
  return [x + 0, y + 0];
}

export function place(p: Point, at: Point, turn: Turn, mirror: boolean): Point {
  const [x, y] = orient(p, turn, mirror);
  return [at[0] + x, at[1] + y];
}

/** True when p lies on the segment a–b strictly between its ends. */
export function insideSegment(p: Point, a: Point, b: Point): boolean {
  const cross = (b[0] - a[0]) * (p[1] - a[1]) - (b[1] - a[1]) * (p[0] - a[0]);
  if (cross !== 0) return false;
  const dot = (p[0] - a[0]) * (b[0] - a[0]) + (p[1] - a[1]) * (b[1] - a[1]);
  const length2 = (b[0] - a[0]) ** 2 + (b[1] - a[1]) ** 2;
  return dot > 0 && dot < length2;
}

