// The netlist into the drawing: parts follow the elements (new ones placed automatically with
// node labels on their pins), and where a pin's node differs from the netlist the drawing is
// corrected with a label, so that reading the drawing back gives the netlist again.
import { BUILT_IN_CELLS, type CellDefinition, type EngineNetwork } from "@/lib/engine-netlist";
import { layoutSchematic } from "./schematic-layout";
import { isCellPart, partElementsOf, type PartElement } from "./cell-part";
import { extractConnectivity } from "./connectivity";
import { EMPTY_DRAWING, elementNodes, partPins, readLayout, toLayout, type Drawing, type Layout, type NodeLabel, type Part } from "./drawing";
import { GRID, insideSegment, samePoint, type Point, type Turn } from "./geometry";

const ROW_GAP = 8; // grid steps between automatically placed parts

// Parts that can stand in for each other when the text renames one: cells of the same pin count, two-terminal parts, op-amps.
function sameShape(a: PartElement, b: PartElement): boolean {
  if (isCellPart(a) || isCellPart(b)) return isCellPart(a) && isCellPart(b) && a.pins.length === b.pins.length;
  return a.kind === b.kind || (a.kind !== "opamp" && b.kind !== "opamp");
}

function matchParts(drawing: Drawing, elements: readonly PartElement[]): { parts: Part[]; fresh: Set<PartElement> } {
  const byName = new Map(drawing.parts.map((p) => [p.element.name, p]));
  const names = new Set(elements.map((e) => e.name));
  // A part whose element disappeared while one of its kind appeared was renamed in the text.
  const orphans = drawing.parts.filter((p) => !names.has(p.element.name));
  const placed = new Map<PartElement, Part>();
  const fresh: PartElement[] = [];
  for (const e of elements) {
    const existing = byName.get(e.name);
    if (existing && sameShape(existing.element, e)) {
      placed.set(e, { ...existing, element: keepPinOrder(existing.element, e) });
      continue;
    }
    const renamed = orphans.findIndex((p) => sameShape(p.element, e));
    if (renamed >= 0) {
      placed.set(e, { ...orphans[renamed], element: keepPinOrder(orphans[renamed].element, e) });
      orphans.splice(renamed, 1);
    } else fresh.push(e);
  }
  const box = bounds(drawing, [...placed.values()]);
  const freshParts = new Set<PartElement>();
  fresh.forEach((e, k) => {
    const at: Point = [box.minX + 4 + k * ROW_GAP, box.maxY + 6];
    placed.set(e, { element: e, at, turn: e.kind === "opamp" || isCellPart(e) ? 0 : 1, mirror: false });
    freshParts.add(e);
  });
  return { parts: elements.map((e) => placed.get(e)!), fresh: freshParts };
}

// A cell part keeps the pin order it is drawn with while the instance has the same terminals.
function keepPinOrder(drawn: PartElement, next: PartElement): PartElement {
  if (!isCellPart(drawn) || !isCellPart(next)) return next;
  const same = drawn.pins.length === next.pins.length && drawn.pins.every((t) => next.pins.includes(t));
  return same ? { ...next, pins: drawn.pins } : next;
}

// A part placed from the text says its nodes by a label (or a ground symbol) on each pin.
function nameFreshPins(drawing: Drawing, fresh: Set<PartElement>, ground: string): Drawing {
  let out = drawing;
  for (const part of drawing.parts) {
    if (!fresh.has(part.element)) continue;
    const pins = partPins(part);
    elementNodes(part.element).forEach((node, j) => (out = nameAt(out, pins[j], node, ground)));
  }
  return out;
}

function bounds(drawing: Drawing, parts: readonly Part[]) {
  const points: Point[] = [...parts.flatMap(partPins), ...drawing.wires.flat(), ...drawing.labels.map((l) => l.at), ...drawing.grounds];
  if (points.length === 0) return { minX: 0, minY: 0, maxX: 0, maxY: -6 };
  return {
    minX: Math.min(...points.map((p) => p[0])),
    minY: Math.min(...points.map((p) => p[1])),
    maxX: Math.max(...points.map((p) => p[0])),
    maxY: Math.max(...points.map((p) => p[1])),
  };
}

function nameAt(drawing: Drawing, at: Point, node: string, ground: string): Drawing {
  if (node === ground) return { ...drawing, grounds: [...drawing.grounds, at] };
  return { ...drawing, labels: [...drawing.labels, { node, at }] };
}

// Cut a pin loose: wires and names that touch its point no longer reach it.
function detach(drawing: Drawing, at: Point): Drawing {
  return {
    ...drawing,
    wires: drawing.wires.filter(([a, b]) => !samePoint(a, at) && !samePoint(b, at) && !insideSegment(at, a, b)),
    labels: drawing.labels.filter((l) => !samePoint(l.at, at)),
    grounds: drawing.grounds.filter((g) => !samePoint(g, at)),
  };
}

/** The drawing brought in step with the netlist; a fixed point once it is (sync twice = sync once). */
export function syncDrawing(start: Drawing, network: EngineNetwork, library: ReadonlyMap<string, CellDefinition> = BUILT_IN_CELLS): Drawing {
  const g = network.ground;
  const matched = matchParts(start, partElementsOf(network, library));
  let drawing = nameFreshPins({ ...start, parts: matched.parts }, matched.fresh, g);
  const wanted = drawing.parts.map((p) => elementNodes(p.element));
  const rounds = 8 + 2 * wanted.flat().length;
  for (let round = 0; round < rounds; round += 1) {
    const x = extractConnectivity(drawing, g, network, library);
    let changed = false;
    for (const net of x.nets) {
      const demands = net.pins.map(([i, j]) => wanted[i][j]);
      const counts = new Map<string, number>();
      for (const d of demands) counts.set(d, (counts.get(d) ?? 0) + 1);
      if (counts.size === 0) continue;
      const majority = [...counts.entries()].sort((a, b) => b[1] - a[1] || (a[0] === net.name ? -1 : b[0] === net.name ? 1 : a[0] < b[0] ? -1 : 1))[0][0];
      if (majority !== net.name) {
        changed = true;
        const pin = net.pins[demands.indexOf(majority)];
        const at = partPins(drawing.parts[pin[0]])[pin[1]];
        const onNet = (l: NodeLabel) => x.nodeAt(l.at) === net.name;
        if (net.labelled && majority !== g) {
          drawing = { ...drawing, labels: drawing.labels.map((l) => (onNet(l) ? { ...l, node: majority } : l)) };
        } else {
          drawing = nameAt({ ...drawing, labels: drawing.labels.filter((l) => !onNet(l)) }, at, majority, g);
          if (net.grounded && majority !== g) drawing = { ...drawing, grounds: drawing.grounds.filter((p) => x.nodeAt(p) !== net.name) };
        }
      }
      net.pins.forEach(([i, j], k) => {
        if (demands[k] === majority) return;
        changed = true;
        const at = partPins(drawing.parts[i])[j];
        drawing = nameAt(detach(drawing, at), at, demands[k], g);
      });
      if (changed) break;
    }
    if (!changed) break;
  }
  return withPort(drawing, network, library);
}

function withPort(drawing: Drawing, network: EngineNetwork, library: ReadonlyMap<string, CellDefinition>): Drawing {
  const x = extractConnectivity(drawing, network.ground, network, library);
  if (x.port && x.port.plus === network.port.plus && x.port.minus === network.port.minus) return drawing;
  const pinOf = (node: string): Point | null => {
    for (const [i, p] of drawing.parts.entries()) {
      const j = x.pinNodes[i].indexOf(node);
      if (j >= 0) return partPins(p)[j];
    }
    return null;
  };
  const keep = (current: Point | undefined, node: string) => (current && x.nodeAt(current) === node ? current : pinOf(node));
  const plus = keep(drawing.port?.plus, network.port.plus);
  const minus = keep(drawing.port?.minus, network.port.minus);
  return plus && minus ? { ...drawing, port: { plus, minus } } : drawing;
}

// The preview's ladder layout, rounded onto the grid, as the first drawing of a network without one.
function autoDrawing(network: EngineNetwork, library: ReadonlyMap<string, CellDefinition> = BUILT_IN_CELLS): Drawing {
  if (network.elements.length === 0 && !network.cells?.length) return EMPTY_DRAWING;
  const ladder = layoutSchematic(network);
  const r = (v: number) => Math.round(v / GRID);
  const pt = (x: number, y: number): Point => [r(x), r(y)];
  const wires: [Point, Point][] = ladder.wires.map(([x1, y1, x2, y2]) => [pt(x1, y1), pt(x2, y2)]);
  const parts: Part[] = [];
  for (const p of ladder.parts) {
    const a = pt(p.x1, p.y1);
    const b = pt(p.x2, p.y2);
    const first = p.reversed ? b : a;
    const second = p.reversed ? a : b;
    const horizontal = a[1] === b[1];
    const c: Point = horizontal ? [Math.round((a[0] + b[0]) / 2), a[1]] : [a[0], Math.round((a[1] + b[1]) / 2)];
    const turn: Turn = horizontal ? (first[0] <= second[0] ? 0 : 2) : first[1] <= second[1] ? 1 : 3;
    const part: Part = { element: p.element, at: c, turn, mirror: false };
    const [p0, p1] = partPins(part);
    if (!samePoint(first, p0)) wires.push([first, p0]);
    if (!samePoint(second, p1)) wires.push([p1, second]);
    parts.push(part);
  }
  for (const o of ladder.opamps) parts.push({ element: o.element, at: pt(o.x, o.y + 30), turn: 3, mirror: false });
  if (ladder.groundRail) wires.push([pt(ladder.groundRail[0], ladder.groundRail[1]), pt(ladder.groundRail[2], ladder.groundRail[3])]);
  const grounds: Point[] = ladder.groundSymbol ? [pt(ladder.groundSymbol.x, ladder.groundSymbol.y)] : [];
  const labels: NodeLabel[] = ladder.nodeLabels.map((n) => ({ node: n.name, at: pt(n.x, n.y) }));
  const order = new Map<PartElement, number>(network.elements.map((e, i) => [e, i]));
  parts.sort((p, q) => order.get(p.element)! - order.get(q.element)!);
  const drawing: Drawing = {
    parts,
    wires: wires.filter(([a, b]) => !samePoint(a, b)),
    labels,
    grounds,
    port: ladder.port ? portOfLadder(ladder.port, pt) : null,
  };
  // Cell instances are not in the preview's ladder: the sync places them below it, named by labels.
  return syncDrawing(drawing, network, library);
}

/** The drawing for a netlist and its stored layout (or an automatic one when there is none). */
export function drawingFor(network: EngineNetwork, layout: unknown, library: ReadonlyMap<string, CellDefinition> = BUILT_IN_CELLS): Drawing {
  const all = partElementsOf(network, library);
  const stored = readLayout(layout, all);
  return stored && (stored.parts.length > 0 || all.length === 0) ? syncDrawing(stored, network, library) : autoDrawing(network, library);
}

/** What Save stores in the circuit's `layout` member. */
export function layoutFor(network: EngineNetwork, layout: unknown, library: ReadonlyMap<string, CellDefinition> = BUILT_IN_CELLS): Layout {
  return toLayout(drawingFor(network, layout, library));
}

function portOfLadder(port: NonNullable<ReturnType<typeof layoutSchematic>["port"]>, pt: (x: number, y: number) => Point) {
  const top = pt(port.top.x, port.top.y);
  const bottom = pt(port.bottom.x, port.bottom.y);
  // The preview draws the non-ground terminal on top, whichever sign it has.
  return port.top.label.startsWith("+") ? { plus: top, minus: bottom } : { plus: bottom, minus: top };
}
