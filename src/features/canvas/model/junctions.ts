// Junction dots: where three or more conductor ends meet (a wire running through counts twice).
import { partPins, type Drawing } from "./drawing";
import { insideSegment, pointKey, type Point } from "./geometry";

export function junctionsOf(d: Drawing): Point[] {
  const count = new Map<string, number>();
  const bump = (p: Point, by = 1) => count.set(pointKey(p), (count.get(pointKey(p)) ?? 0) + by);
  const ends: Point[] = [...d.parts.flatMap(partPins)];
  for (const [a, b] of d.wires) ends.push(a, b);
  for (const p of ends) bump(p);
  const seen = new Set(ends.map(pointKey));
  for (const [a, b] of d.wires) for (const key of seen) {
    const [x, y] = key.split(",").map(Number);
    if (insideSegment([x, y], a, b)) bump([x, y], 2);
  }
  return [...count.entries()].filter(([, n]) => n >= 3).map(([key]) => key.split(",").map(Number) as unknown as Point);
}
