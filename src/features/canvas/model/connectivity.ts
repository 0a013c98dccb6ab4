// Electrical connectivity from the drawing: wires merge the points they join, labels name
// nodes (one name joins its points), ground symbols are the ground node; the result is the
// engine's network (elements with node names, the port).
import type { CellDefinition, CellInstance, Element, EngineNetwork } from "@/lib/engine-netlist";
import { instanceOf, isCellPart, partElementsOf, type PartElement } from "./cell-part";
import { elementNodes, partPins, withNodes, type Drawing } from "./drawing";
import { insideSegment, pointKey, type Point } from "./geometry";

interface CanvasDiagnostic {
  code: "node-two-names" | "port-unmarked" | "port-off-node" | "duplicate-name";
  message: string;
  parts: string[];
}

interface Net {
  name: string;
  /** Pins on this node as [part index, pin index]. */
  pins: [number, number][];
  labelled: boolean;
  grounded: boolean;
}

export interface Extraction {
  elements: Element[];
  /** The cell instances, terminals joined to the nodes their pins touch. */
  cells: CellInstance[];
  /** Node name of every pin, by part then pin. */
  pinNodes: string[][];
  nets: Net[];
  port: { plus: string; minus: string } | null;
  diagnostics: CanvasDiagnostic[];
  /** The node name at a point, when the point touches the drawing's conductors. */
  nodeAt: (p: Point) => string | null;
}

class UnionFind {
  private parent = new Map<string, string>();
  find(key: string): string {
    let root = this.parent.get(key) ?? key;
    if (root === key) {
      if (!this.parent.has(key)) this.parent.set(key, key);
      return key;
    }
    root = this.find(root);
    this.parent.set(key, root);
    return root;
  }
  has(key: string) {
    return this.parent.has(key);
  }
  union(a: string, b: string) {
    const ra = this.find(a);
    const rb = this.find(b);
    if (ra !== rb) this.parent.set(rb, ra);
  }
}

/**
 * The network the drawing stands for. `previous` (the netlist as it was) keeps the names of
 * unlabelled nodes stable across edits; a node that never had a name gets the first free nK.
 */
export function extractConnectivity(drawing: Drawing, ground: string, previous?: EngineNetwork | null, library?: ReadonlyMap<string, CellDefinition>): Extraction {
  const uf = new UnionFind();
  const pins = drawing.parts.map(partPins);
  const special: Point[] = [...pins.flat(), ...drawing.labels.map((l) => l.at), ...drawing.grounds];
  for (const [a, b] of drawing.wires) special.push(a, b);
  for (const p of special) uf.find(pointKey(p));
  // A wire joins its two ends and every pin, end, label or ground lying along it (a T joint).
  for (const [a, b] of drawing.wires) {
    uf.union(pointKey(a), pointKey(b));
    for (const p of special) if (insideSegment(p, a, b)) uf.union(pointKey(a), pointKey(p));
  }
  // One label name is one node, wherever its labels stand; every ground symbol is the ground node.
  const firstLabel = new Map<string, string>();
  for (const l of drawing.labels) {
    const key = l.node === ground ? "ground" : l.node;
    const seen = firstLabel.get(key);
    if (seen) uf.union(seen, pointKey(l.at));
    else firstLabel.set(key, pointKey(l.at));
  }
  const groundKey = firstLabel.get("ground") ?? (drawing.grounds[0] ? pointKey(drawing.grounds[0]) : null);
  for (const g of drawing.grounds) if (groundKey) uf.union(groundKey, pointKey(g));

  const roots = new Map<string, { pins: [number, number][]; labels: string[]; grounded: boolean }>();
  const rootOf = (key: string) => {
    const r = uf.find(key);
    if (!roots.has(r)) roots.set(r, { pins: [], labels: [], grounded: false });
    return roots.get(r)!;
  };
  pins.forEach((list, i) => list.forEach((p, j) => rootOf(pointKey(p)).pins.push([i, j])));
  for (const l of drawing.labels) {
    const r = rootOf(pointKey(l.at));
    if (l.node === ground) r.grounded = true;
    else if (!r.labels.includes(l.node)) r.labels.push(l.node);
  }
  for (const g of drawing.grounds) rootOf(pointKey(g)).grounded = true;

  const diagnostics: CanvasDiagnostic[] = [];
  const partNames = (pinList: [number, number][]) => [...new Set(pinList.map(([i]) => drawing.parts[i].element.name))];
  const names = new Map<string, string>();
  const used = new Set<string>();
  for (const [root, r] of roots) {
    if (!r.grounded && r.labels.length === 0) continue;
    const name = r.grounded ? ground : r.labels[0];
    const extra = r.grounded ? r.labels : r.labels.slice(1);
    if (extra.length > 0) {
      diagnostics.push({
        code: "node-two-names",
        message: `One node carries the names ${[name, ...extra].join(", ")}; it is read as ${name}.`,
        parts: partNames(r.pins),
      });
    }
    names.set(root, name);
    used.add(name);
  }
  // Unlabelled nodes, in the order of their first pin: keep the name the netlist gave most of their pins.
  const previousNodes = new Map((previous ? partElementsOf(previous, library) : []).map((e) => [e.name, pinNodesByOrder(e, drawing)]));
  const unnamed = [...roots.entries()].filter(([root, r]) => !names.has(root) && r.pins.length > 0);
  unnamed.sort(([, a], [, b]) => a.pins[0][0] - b.pins[0][0] || a.pins[0][1] - b.pins[0][1]);
  const reserved = new Set([ground, ...drawing.labels.map((l) => l.node)]);
  const fresh = () => {
    for (let k = 1; ; k += 1) if (!used.has(`n${k}`) && !reserved.has(`n${k}`) && !allPrevious(previous).has(`n${k}`)) return `n${k}`;
  };
  for (const [root, r] of unnamed) {
    const votes = new Map<string, number>();
    for (const [i, j] of r.pins) {
      const before = previousNodes.get(drawing.parts[i].element.name)?.[j];
      if (before !== undefined && before !== ground && !used.has(before) && !reserved.has(before)) votes.set(before, (votes.get(before) ?? 0) + 1);
    }
    const best = [...votes.entries()].sort((a, b) => b[1] - a[1] || (a[0] < b[0] ? -1 : 1))[0]?.[0];
    const name = best ?? fresh();
    names.set(root, name);
    used.add(name);
  }

  const nameOfKey = (key: string) => (uf.has(key) ? (names.get(uf.find(key)) ?? null) : null);
  const nodeAt = (p: Point): string | null => {
    const direct = nameOfKey(pointKey(p));
    if (direct) return direct;
    const wire = drawing.wires.find(([a, b]) => insideSegment(p, a, b));
    return wire ? nameOfKey(pointKey(wire[0])) : null;
  };

  const pinNodes = pins.map((list) => list.map((p) => nameOfKey(pointKey(p))!));
  const placed: PartElement[] = drawing.parts.map((part, i) => withNodes(part.element, pinNodes[i]));
  const elements = placed.filter((e): e is Element => !isCellPart(e));
  const cells = placed.filter(isCellPart).map(instanceOf);
  const seenNames = new Set<string>();
  for (const e of placed) {
    if (seenNames.has(e.name)) diagnostics.push({ code: "duplicate-name", message: `Two parts are named ${e.name}.`, parts: [e.name] });
    seenNames.add(e.name);
  }

  let port: Extraction["port"] = null;
  if (!drawing.port) {
    diagnostics.push({ code: "port-unmarked", message: "Mark the port: choose Port, then click the + terminal and the − terminal.", parts: [] });
  } else {
    const plus = nodeAt(drawing.port.plus);
    const minus = nodeAt(drawing.port.minus);
    if (plus && minus) port = { plus, minus };
    else diagnostics.push({ code: "port-off-node", message: "A port terminal is not on a node: move it onto a pin or a wire.", parts: [] });
  }

  const nets: Net[] = [...roots.entries()]
    .filter(([root]) => names.has(root))
    .map(([root, r]) => ({ name: names.get(root)!, pins: r.pins, labelled: r.labels.length > 0, grounded: r.grounded }));
  return { elements, cells, pinNodes, nets, port, diagnostics, nodeAt };
}

// A previous instance's nodes in the pin order of the part now drawn for it.
function pinNodesByOrder(e: PartElement, drawing: Drawing): string[] {
  if (!isCellPart(e)) return elementNodes(e);
  const drawn = drawing.parts.find((p) => p.element.name === e.name)?.element;
  return drawn && isCellPart(drawn) ? drawn.pins.map((t) => e.terminals[t]) : elementNodes(e);
}

function allPrevious(previous?: EngineNetwork | null): Set<string> {
  return new Set([...(previous?.elements ?? []).flatMap(elementNodes), ...(previous?.cells ?? []).flatMap((c) => Object.values(c.terminals))]);
}

/** The drawing as the engine's network; where the drawing has no port yet, the netlist's port stays. */
export function networkOfDrawing(drawing: Drawing, base: EngineNetwork, library?: ReadonlyMap<string, CellDefinition>): { network: EngineNetwork; extraction: Extraction } {
  const extraction = extractConnectivity(drawing, base.ground, base, library);
  const { cells: _cells, ...rest } = base;
  const network: EngineNetwork = { ...rest, elements: extraction.elements, port: extraction.port ?? base.port, ...(extraction.cells.length > 0 ? { cells: extraction.cells } : {}) };
  return { network, extraction };
}
