import type { Element, EngineNetwork } from "@/lib/engine-netlist";

// An automatic ladder layout: non-ground nodes are columns on a top rail, ground is a bottom
// rail, elements to ground hang between the rails, elements between two nodes bridge columns
// (stacked in levels above the rail when they would overlap), and the port sits at the right.

const RAIL_Y = 0;
const GROUND_Y = 130;
const SLOT = 76; // horizontal room per element hanging from one node
const GAP = 120; // room for a bridging element between adjacent columns
const LEVEL = 56; // height between stacked bridging elements
const PORT_GAP = 56;

type Segment = [number, number, number, number];

export interface PlacedPart {
  element: Element;
  /** Symbol axis from (x1, y1) to (x2, y2); the symbol sits in the middle, leads fill the rest. */
  x1: number;
  y1: number;
  x2: number;
  y2: number;
  /** True when the element's first node is at (x2, y2): polarity marks flip. */
  reversed: boolean;
}

export interface PlacedOpamp {
  element: Element & { kind: "opamp" };
  x: number;
  y: number;
}

export interface SchematicLayout {
  wires: Segment[];
  parts: PlacedPart[];
  opamps: PlacedOpamp[];
  nodeLabels: { name: string; x: number; y: number }[];
  junctions: { x: number; y: number }[];
  groundRail: Segment | null;
  groundSymbol: { x: number; y: number } | null;
  port: { top: { x: number; y: number; label: string }; bottom: { x: number; y: number; label: string; connected: boolean } } | null;
  bounds: { minX: number; minY: number; maxX: number; maxY: number };
}

function columnOrder(network: EngineNetwork): string[] {
  const g = network.ground;
  const seen: string[] = [];
  const add = (n: string) => {
    if (n !== g && !seen.includes(n)) seen.push(n);
  };
  for (const e of network.elements) {
    if (e.kind === "opamp") [e.output, ...e.inputs].forEach(add);
    else e.nodes.forEach(add);
  }
  const { plus, minus } = network.port;
  const top = plus !== g ? plus : minus;
  const bottom = top === plus ? minus : plus;
  // The port's top terminal is the last column, so its wire to the port is short and straight.
  const ordered = seen.filter((n) => n !== top && n !== bottom);
  if (bottom !== g && seen.includes(bottom)) ordered.push(bottom);
  if (seen.includes(top)) ordered.push(top);
  return ordered;
}

export function layoutSchematic(network: EngineNetwork): SchematicLayout {
  const g = network.ground;
  const columns = columnOrder(network);
  const index = new Map(columns.map((n, i) => [n, i]));
  const hanging = new Map<string, Element[]>(columns.map((n) => [n, []]));
  const bridging: { element: Element; from: number; to: number }[] = [];

  for (const e of network.elements) {
    if (e.kind === "opamp") {
      if (e.output !== g) hanging.get(e.output)?.push(e);
      continue;
    }
    const [a, b] = e.nodes;
    if (a === g && b === g) continue;
    if (a === g || b === g) hanging.get(a === g ? b : a)?.push(e);
    else if (a !== b) {
      const ia = index.get(a)!;
      const ib = index.get(b)!;
      bridging.push({ element: e, from: Math.min(ia, ib), to: Math.max(ia, ib) });
    }
  }

  // Column positions: each node's bus is as wide as the elements hanging from it, labels included.
  const busStart: number[] = [];
  const busEnd: number[] = [];
  const slotX: number[][] = [];
  let x = 0;
  columns.forEach((n, i) => {
    const list = hanging.get(n)!;
    busStart[i] = x;
    slotX[i] = [];
    let sx = x;
    list.forEach((e, j) => {
      slotX[i].push(sx);
      if (j < list.length - 1) sx += slotWidth(e);
    });
    busEnd[i] = sx;
    x = busEnd[i] + GAP + (list.length ? Math.max(0, slotWidth(list[list.length - 1]) - SLOT) : 0);
  });

  const wires: Segment[] = [];
  const parts: PlacedPart[] = [];
  const opamps: PlacedOpamp[] = [];
  let hasGroundAttachment = false;
  let groundMin = Infinity;
  let groundMax = -Infinity;

  columns.forEach((n, i) => {
    if (busEnd[i] > busStart[i]) wires.push([busStart[i], RAIL_Y, busEnd[i], RAIL_Y]);
    hanging.get(n)!.forEach((e, slot) => {
      const sx = slotX[i][slot];
      if (e.kind === "opamp") {
        opamps.push({ element: e, x: sx, y: RAIL_Y + 34 });
        wires.push([sx, RAIL_Y, sx, RAIL_Y + 34]);
        return;
      }
      hasGroundAttachment = true;
      groundMin = Math.min(groundMin, sx);
      groundMax = Math.max(groundMax, sx);
      parts.push({ element: e, x1: sx, y1: RAIL_Y, x2: sx, y2: GROUND_Y, reversed: e.nodes[0] === g });
    });
  });

  // Bridging elements: level 0 on the rail between adjacent columns, higher levels arch over.
  const levels: { from: number; to: number }[][] = [];
  const usedAdjacent = new Set<number>();
  let minY = RAIL_Y - 30;
  for (const b of bridging.sort((p, q) => p.to - p.from - (q.to - q.from))) {
    const left = busEnd[b.from];
    const right = busStart[b.to];
    const reversed = b.element.kind !== "opamp" && b.element.nodes[0] !== columns[b.from];
    if (b.to === b.from + 1 && !usedAdjacent.has(b.from)) {
      usedAdjacent.add(b.from);
      parts.push({ element: b.element, x1: left, y1: RAIL_Y, x2: right, y2: RAIL_Y, reversed });
      continue;
    }
    let level = 1;
    while ((levels[level] ?? []).some((o) => !(b.to <= o.from || b.from >= o.to))) level += 1;
    (levels[level] ??= []).push({ from: b.from, to: b.to });
    const y = RAIL_Y - level * LEVEL;
    minY = Math.min(minY, y - 30);
    wires.push([left, RAIL_Y, left, y], [right, RAIL_Y, right, y]);
    parts.push({ element: b.element, x1: left, y1: y, x2: right, y2: y, reversed });
  }

  const nodeLabels = columns.map((name, i) => ({ name, x: busStart[i], y: RAIL_Y }));

  let port: SchematicLayout["port"] = null;
  const { plus, minus } = network.port;
  const topNode = plus !== g ? plus : minus;
  const bottomNode = topNode === plus ? minus : plus;
  const topIndex = index.get(topNode);
  let maxX = x - GAP;
  if (topIndex !== undefined) {
    const px = busEnd[topIndex] + PORT_GAP;
    wires.push([busEnd[topIndex], RAIL_Y, px, RAIL_Y]);
    const connected = bottomNode === g;
    if (connected) {
      hasGroundAttachment = true;
      groundMin = Math.min(groundMin, px);
      groundMax = Math.max(groundMax, px);
    }
    port = {
      top: { x: px, y: RAIL_Y, label: `${topNode === plus ? "+" : "−"} ${topNode}` },
      bottom: { x: px, y: GROUND_Y, label: `${topNode === plus ? "−" : "+"} ${bottomNode}`, connected },
    };
    maxX = px;
  }

  const groundRail: Segment | null = hasGroundAttachment ? [groundMin, GROUND_Y, Math.max(groundMax, groundMin), GROUND_Y] : null;
  const groundSymbol = hasGroundAttachment ? { x: groundMin, y: GROUND_Y } : null;
  if (groundRail) groundRail[0] = Math.min(groundRail[0], groundMin);

  // Junction dots where three or more conductors meet.
  const ends = new Map<string, number>();
  const touch = (px: number, py: number) => ends.set(`${px},${py}`, (ends.get(`${px},${py}`) ?? 0) + 1);
  for (const [x1, y1, x2, y2] of wires) {
    touch(x1, y1);
    touch(x2, y2);
  }
  for (const p of parts) {
    touch(p.x1, p.y1);
    touch(p.x2, p.y2);
  }
  for (const o of opamps) touch(o.x, o.y);
  // Bus interior points count twice (the bus runs through them).
  columns.forEach((_, i) => {
    for (const sx of slotX[i]) if (sx > busStart[i] && sx < busEnd[i]) {
      touch(sx, RAIL_Y);
      touch(sx, RAIL_Y);
    }
  });
  if (groundRail) for (const p of parts) if (p.y2 === GROUND_Y && p.x2 > groundRail[0] && p.x2 < groundRail[2]) {
    touch(p.x2, GROUND_Y);
    touch(p.x2, GROUND_Y);
  }
  const junctions = [...ends.entries()]
    .filter(([, count]) => count >= 3)
    .map(([key]) => {
      const [jx, jy] = key.split(",").map(Number);
      return { x: jx, y: jy };
    });

  const hasOpamp = opamps.length > 0;
  return {
    wires,
    parts,
    opamps,
    nodeLabels,
    junctions,
    groundRail,
    groundSymbol,
    port,
    bounds: { minX: -50, minY, maxX: maxX + 70, maxY: Math.max(GROUND_Y + 40, hasOpamp ? RAIL_Y + 110 : 0) },
  };
}

// Room for an element hanging from a bus: its symbol plus the name and value written beside it.
function slotWidth(e: Element): number {
  if (e.kind === "opamp") return SLOT;
  const value = e.value;
  const chars = Math.max(e.name.length * 1.1, Math.min(18, value.length));
  return Math.max(SLOT, Math.ceil(30 + 5.6 * chars));
}


