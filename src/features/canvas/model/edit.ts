// Editing the drawing: pure functions from one drawing to the next. Wires, labels, ground
// symbols and port terminals that sit on a pin travel with it when the part moves or turns.
import type { Element, ElementKind, EngineNetwork } from "@/lib/engine-netlist";
import type { PartElement } from "./cell-part";
import { partPins, type Drawing, type Part } from "./drawing";
import { insideSegment, pointKey, samePoint, type Point, type Turn } from "./geometry";

export interface Selection {
  parts: string[];
  wires: number[];
  labels: number[];
  grounds: number[];
}

export const NOTHING: Selection = { parts: [], wires: [], labels: [], grounds: [] };

export const isEmpty = (s: Selection) => s.parts.length + s.wires.length + s.labels.length + s.grounds.length === 0;

export function selectAll(d: Drawing): Selection {
  return { parts: d.parts.map((p) => p.element.name), wires: d.wires.map((_, i) => i), labels: d.labels.map((_, i) => i), grounds: d.grounds.map((_, i) => i) };
}

// Every point that ends up somewhere else, old → new; the rest of the drawing follows the map.
function follow(d: Drawing, moves: Map<string, Point>, parts: Part[], selected: Selection): Drawing {
  const to = (p: Point, force: boolean, delta?: Point): Point => {
    const m = moves.get(pointKey(p));
    if (m) return m;
    return force && delta ? [p[0] + delta[0], p[1] + delta[1]] : p;
  };
  const wires = new Set(selected.wires);
  const labels = new Set(selected.labels);
  const grounds = new Set(selected.grounds);
  const delta = moves.get("delta");
  // A port terminal may sit inside a wire, not on a moved point; it rides along when that wire is moved whole.
  const portTo = (p: Point) => to(p, d.wires.some(([a, b], i) => wires.has(i) && insideSegment(p, a, b)), delta);
  return {
    parts,
    wires: d.wires.map(([a, b], i) => [to(a, wires.has(i), delta), to(b, wires.has(i), delta)] as const),
    labels: d.labels.map((l, i) => ({ ...l, at: to(l.at, labels.has(i), delta) })),
    grounds: d.grounds.map((g, i) => to(g, grounds.has(i), delta)),
    port: d.port && { plus: portTo(d.port.plus), minus: portTo(d.port.minus) },
  };
}

export function moveSelection(d: Drawing, s: Selection, delta: Point): Drawing {
  if (delta[0] === 0 && delta[1] === 0) return d;
  const chosen = new Set(s.parts);
  const moves = new Map<string, Point>();
  const shift = (p: Point): Point => [p[0] + delta[0], p[1] + delta[1]];
  for (const part of d.parts) if (chosen.has(part.element.name)) for (const p of partPins(part)) moves.set(pointKey(p), shift(p));
  for (const i of s.wires) for (const p of d.wires[i]) moves.set(pointKey(p), shift(p));
  for (const i of s.labels) moves.set(pointKey(d.labels[i].at), shift(d.labels[i].at));
  for (const i of s.grounds) moves.set(pointKey(d.grounds[i]), shift(d.grounds[i]));
  moves.set("delta", delta);
  const parts = d.parts.map((p) => (chosen.has(p.element.name) ? { ...p, at: shift(p.at) } : p));
  return follow(d, moves, parts, s);
}

function reorient(d: Drawing, s: Selection, change: (p: Part) => Part): Drawing {
  const chosen = new Set(s.parts);
  const moves = new Map<string, Point>();
  const parts = d.parts.map((p) => {
    if (!chosen.has(p.element.name)) return p;
    const next = change(p);
    const before = partPins(p);
    const after = partPins(next);
    // Pins that only trade places (a two-terminal part mirrored along its axis) keep their wires where
    // they are, so the part turns round in place; moving the wires with them would lay them across it.
    const samePlaces = new Set(before.map(pointKey));
    if (after.length === before.length && after.every((q) => samePlaces.has(pointKey(q)))) return next;
    before.forEach((q, j) => moves.set(pointKey(q), after[j]));
    return next;
  });
  return follow(d, moves, parts, NOTHING);
}

export const turnSelection = (d: Drawing, s: Selection, by: 1 | 3) => reorient(d, s, (p) => ({ ...p, turn: ((p.turn + by) % 4) as Turn }));
export const mirrorSelection = (d: Drawing, s: Selection) => reorient(d, s, (p) => ({ ...p, mirror: !p.mirror }));

export function deleteSelection(d: Drawing, s: Selection): Drawing {
  const parts = new Set(s.parts);
  const keep = <T,>(list: readonly T[], gone: number[]) => list.filter((_, i) => !gone.includes(i));
  return { ...d, parts: d.parts.filter((p) => !parts.has(p.element.name)), wires: keep(d.wires, s.wires), labels: keep(d.labels, s.labels), grounds: keep(d.grounds, s.grounds) };
}

/** A wire from a to b drawn as one straight run or an L (across first, then down). */
export function addWire(d: Drawing, a: Point, b: Point): Drawing {
  if (samePoint(a, b)) return d;
  const corner: Point = [b[0], a[1]];
  const runs: [Point, Point][] = a[0] === b[0] || a[1] === b[1] ? [[a, b]] : [
    [a, corner],
    [corner, b],
  ];
  const fresh = runs.filter(([p, q]) => !d.wires.some(([u, v]) => (samePoint(u, p) && samePoint(v, q)) || (samePoint(u, q) && samePoint(v, p))));
  return fresh.length ? { ...d, wires: [...d.wires, ...fresh] } : d;
}

export const addLabel = (d: Drawing, at: Point, node: string): Drawing => ({ ...d, labels: [...d.labels.filter((l) => !samePoint(l.at, at)), { node, at }] });
export const addGround = (d: Drawing, at: Point): Drawing => (d.grounds.some((g) => samePoint(g, at)) ? d : { ...d, grounds: [...d.grounds, at] });
export const setPort = (d: Drawing, plus: Point, minus: Point): Drawing => ({ ...d, port: { plus, minus } });

export function replaceElement(d: Drawing, name: string, element: Element): Drawing {
  return { ...d, parts: d.parts.map((p) => (p.element.name === name ? { ...p, element } : p)) };
}

/** Names are ours: the kind's word (or the cell's id) and a number, never a letter prefix. */
export function freshName(d: Drawing, kind: ElementKind | string): string {
  const word = kind.replace(/[^\p{L}\p{N}_]/gu, "_");
  const names = new Set(d.parts.map((p) => p.element.name));
  for (let k = 1; ; k += 1) if (!names.has(`${word}${k}`)) return `${word}${k}`;
}

/** What the palette places: a kind and a starting value; a source's value may name its control. */
export interface PalettePreset {
  label: string;
  kind: ElementKind;
  /** The starting value; "{ground}" and "{first}" stand for the ground and the first part's name. */
  value: string | null;
}

export const PALETTE: readonly PalettePreset[] = [
  { label: "resistor", kind: "resistor", value: "R" },
  { label: "conductance", kind: "conductance", value: "G" },
  { label: "capacitor", kind: "capacitor", value: "C" },
  { label: "inductor", kind: "inductor", value: "L" },
  { label: "voltage", kind: "voltage", value: "V" },
  { label: "current", kind: "current", value: "I" },
  { label: "voltage by across", kind: "voltage", value: "mu * across({ground}, {ground})" },
  { label: "current by across", kind: "current", value: "gm * across({ground}, {ground})" },
  { label: "voltage by through", kind: "voltage", value: "rm * through({first})" },
  { label: "current by through", kind: "current", value: "beta * through({first})" },
  { label: "op-amp", kind: "opamp", value: null },
];

/** A new element from a palette preset; nodes are filled in by the wires, controls named in the inspector. */
export function newElement(preset: PalettePreset, name: string, network: EngineNetwork, d: Drawing): Element {
  const g = network.ground;
  if (preset.kind === "opamp") return { name, kind: "opamp", inputs: [g, g], output: g };
  const value = (preset.value ?? "1").replaceAll("{ground}", g).replaceAll("{first}", d.parts[0]?.element.name ?? name);
  return { name, kind: preset.kind, nodes: [g, g], value };
}

export function addPart(d: Drawing, element: PartElement, at: Point, turn: Turn, mirror = false): Drawing {
  return { ...d, parts: [...d.parts, { element, at, turn, mirror }] };
}

/** Which wires run through a point (for picking). */
export const wiresAt = (d: Drawing, p: Point) => d.wires.map((w, i) => [w, i] as const).filter(([[a, b]]) => samePoint(a, p) || samePoint(b, p) || insideSegment(p, a, b)).map(([, i]) => i);
