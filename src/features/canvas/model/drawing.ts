// The drawing of a network and its stored form, the circuit's optional `layout` member.
import { z } from "zod";
import { cellLocalPins, isCellPart, type PartElement } from "./cell-part";
import { localPins, place, type Point, type Turn } from "./geometry";

export interface Part {
  /** The element (or cell instance) as the netlist has it; its nodes are recomputed from the wires. */
  element: PartElement;
  at: Point;
  turn: Turn;
  mirror: boolean;
}

type Wire = readonly [Point, Point];

/** A node label: names the node at its point (labels with one name join their nodes). */
export interface NodeLabel {
  node: string;
  at: Point;
}

export interface Drawing {
  parts: Part[];
  wires: Wire[];
  labels: NodeLabel[];
  /** Ground symbols: each ties its point to the ground node. */
  grounds: Point[];
  /** The port's two terminals (copper open circles), or null before it is marked. */
  port: { plus: Point; minus: Point } | null;
}

export const EMPTY_DRAWING: Drawing = { parts: [], wires: [], labels: [], grounds: [], port: null };

const LAYOUT_VERSION = 1;

const point = z.tuple([z.number().int(), z.number().int()]);

/** The stored layout: geometry only, parts keyed by element or cell instance name; those stay in `elements` and `cells`. */
const layoutSchema = z.object({
  version: z.literal(LAYOUT_VERSION),
  parts: z.array(z.object({ element: z.string(), at: point, turn: z.union([z.literal(0), z.literal(1), z.literal(2), z.literal(3)]), mirror: z.boolean() })),
  wires: z.array(z.tuple([point, point])),
  labels: z.array(z.object({ node: z.string().min(1), at: point })),
  grounds: z.array(point),
  port: z.object({ plus: point, minus: point }).nullable(),
});
export type Layout = z.infer<typeof layoutSchema>;

export function toLayout(drawing: Drawing): Layout {
  return {
    version: LAYOUT_VERSION,
    parts: drawing.parts.map((p) => ({ element: p.element.name, at: [p.at[0], p.at[1]], turn: p.turn, mirror: p.mirror })),
    wires: drawing.wires.map(([a, b]) => [
      [a[0], a[1]],
      [b[0], b[1]],
    ]),
    labels: drawing.labels.map((l) => ({ node: l.node, at: [l.at[0], l.at[1]] })),
    grounds: drawing.grounds.map((g) => [g[0], g[1]]),
    port: drawing.port && { plus: [drawing.port.plus[0], drawing.port.plus[1]], minus: [drawing.port.minus[0], drawing.port.minus[1]] },
  };
}

/** The stored layout read back against the elements; null when there is none or it is not ours. */
export function readLayout(layout: unknown, elements: readonly PartElement[]): Drawing | null {
  const parsed = layoutSchema.safeParse(layout);
  if (!parsed.success) return null;
  const byName = new Map(elements.map((e) => [e.name, e]));
  const parts: Part[] = [];
  for (const p of parsed.data.parts) {
    const element = byName.get(p.element);
    if (element) parts.push({ element, at: p.at, turn: p.turn, mirror: p.mirror });
  }
  return { parts, wires: parsed.data.wires, labels: parsed.data.labels, grounds: parsed.data.grounds, port: parsed.data.port };
}

export function partPins(part: Part): Point[] {
  const local = isCellPart(part.element) ? cellLocalPins(part.element.pins.length) : localPins(part.element.kind);
  return local.map((p) => place(p, part.at, part.turn, part.mirror));
}

/** The element's nodes in pin order (a cell instance: its terminals' nodes). */
export function elementNodes(e: PartElement): string[] {
  if (isCellPart(e)) return e.pins.map((t) => e.terminals[t]);
  return e.kind === "opamp" ? [e.inputs[0], e.inputs[1], e.output] : [e.nodes[0], e.nodes[1]];
}

export function withNodes<E extends PartElement>(e: E, nodes: readonly string[]): E;
export function withNodes(e: PartElement, nodes: readonly string[]): PartElement {
  if (isCellPart(e)) return { ...e, terminals: Object.fromEntries(e.pins.map((t, j) => [t, nodes[j]])) };
  if (e.kind === "opamp") return { ...e, inputs: [nodes[0], nodes[1]], output: nodes[2] };
  return { ...e, nodes: [nodes[0], nodes[1]] };
}
