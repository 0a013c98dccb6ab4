// Topology checks: the ways a network's graph alone makes the nodal equations singular.
//
// Three graphs over the nodes:
//  - carrying: elements whose current adapts to the network (passives, V-type sources, op-amp output to ground);
//  - driving:  current sources (independent or controlled), which fix their own current;
//  - fixing:   elements that fix a voltage difference (V-type sources and op-amp inputs, the nullator).

import type { Diagnostic, Element, Network } from "../types";
import { diagnostic } from "./diagnostics";
import { currentControlledElements, elementNodes, isControlled, isCurrentType, isOpamp, isVoltageType } from "./elements";

class UnionFind {
  private readonly parent = new Map<string, string>();
  find(a: string): string {
    let p = this.parent.get(a) ?? a;
    if (p === a) return a;
    p = this.find(p);
    this.parent.set(a, p);
    return p;
  }
  union(a: string, b: string): boolean {
    const ra = this.find(a);
    const rb = this.find(b);
    if (ra === rb) return false;
    this.parent.set(ra, rb);
    return true;
  }
}

interface Edge {
  a: string;
  b: string;
  element: string;
}

function carryingEdges(network: Network): Edge[] {
  const out: Edge[] = [];
  for (const e of network.elements) {
    if (isOpamp(e)) out.push({ a: e.output, b: network.ground, element: e.name });
    else if (!isCurrentType(e.kind)) out.push({ a: e.nodes[0], b: e.nodes[1], element: e.name });
  }
  return out;
}

function drivingEdges(network: Network): Edge[] {
  return network.elements
    .filter((e): e is Exclude<Element, { kind: "opamp" }> => !isOpamp(e) && isCurrentType(e.kind))
    .map((e) => ({ a: e.nodes[0], b: e.nodes[1], element: e.name }));
}

function allNodes(network: Network): string[] {
  const seen = new Set<string>();
  const out: string[] = [];
  for (const e of network.elements) {
    for (const n of elementNodes(e)) {
      if (seen.has(n)) continue;
      seen.add(n);
      out.push(n);
    }
  }
  return out;
}

/** Groups of nodes (in network order) not joined to ground by the given edges. */
function groupsAwayFromGround(network: Network, edges: Edge[]): string[][] {
  const uf = new UnionFind();
  for (const e of edges) uf.union(e.a, e.b);
  const g = uf.find(network.ground);
  const groups = new Map<string, string[]>();
  for (const n of allNodes(network)) {
    const r = uf.find(n);
    if (r === g) continue;
    const list = groups.get(r) ?? [];
    list.push(n);
    groups.set(r, list);
  }
  return [...groups.values()];
}

function elementsTouching(network: Network, nodes: string[]): string[] {
  const set = new Set(nodes);
  return network.elements.filter((e) => elementNodes(e).some((n) => set.has(n))).map((e) => e.name);
}

function nodeList(nodes: string[]): string {
  return nodes.map((n) => `"${n}"`).join(", ");
}

/** Every topology diagnostic that makes the open-port equations singular for certain, plus warnings. */
export function checkTopology(network: Network): Diagnostic[] {
  return [...floatingNodes(network), ...voltageSourceLoops(network), ...currentSourceCutsets(network), ...noDcPath(network)];
}

// The KCL rows of a group no element joins to the rest add up to zero, so the system is singular.
function floatingNodes(network: Network): Diagnostic[] {
  const groups = groupsAwayFromGround(network, [...carryingEdges(network), ...drivingEdges(network)]);
  return groups.map((nodes) => {
    const opampInputsOnly = network.elements
      .filter(isOpamp)
      .some((u) => nodes.every((n) => u.inputs.includes(n)) && elementsTouching(network, nodes).every((x) => x === u.name));
    const why = opampInputsOnly
      ? `op-amp inputs draw no current, so ${nodes.length > 1 ? "these nodes need" : "it needs"} another element to set ${nodes.length > 1 ? "their voltages" : "its voltage"}`
      : `no element joins them to ground "${network.ground}"`;
    return diagnostic("floating-node", `node${nodes.length > 1 ? "s" : ""} ${nodeList(nodes)} ${nodes.length > 1 ? "have" : "has"} no path to ground: ${why}`, {
      nodes,
      elements: elementsTouching(network, nodes),
    });
  });
}

/**
 * Loops of elements that fix voltage differences. Reported only where the loop makes the system
 * singular whatever the values: a loop of independent sources and op-amp inputs (dependent rows), or
 * a loop of V-type sources none of whose currents controls anything (a free circulating current).
 */
function voltageSourceLoops(network: Network): Diagnostic[] {
  const controls = currentControlledElements(network);
  const out: Diagnostic[] = [];
  const fixing: (Edge & { dependent: boolean; carries: boolean })[] = [];
  for (const e of network.elements) {
    if (isOpamp(e)) fixing.push({ a: e.inputs[0], b: e.inputs[1], element: e.name, dependent: false, carries: false });
    else if (isVoltageType(e.kind)) fixing.push({ a: e.nodes[0], b: e.nodes[1], element: e.name, dependent: isControlled(e), carries: true });
  }
  for (const loop of findLoops(fixing)) {
    const members = loop.map((i) => fixing[i]);
    const differencesOnly = members.every((m) => !m.dependent);
    const freeCurrent = members.every((m) => m.carries && !controls.has(m.element));
    if (!differencesOnly && !freeCurrent) continue;
    const names = members.map((m) => m.element);
    const nodes = [...new Set(members.flatMap((m) => [m.a, m.b]))];
    const what = members.some((m) => !m.carries)
      ? "voltage sources and op-amp inputs fix the voltages around a loop, so the constraints repeat or contradict each other"
      : "voltage sources form a loop, so the current around it is not determined";
    out.push(diagnostic("voltage-source-loop", `${names.map((n) => `"${n}"`).join(", ")}: ${what}`, { elements: names, nodes }));
  }
  return out;
}

// Each edge that closes a loop in a spanning forest gives one loop (the fundamental loops).
function findLoops(edges: Edge[]): number[][] {
  const uf = new UnionFind();
  const tree = new Map<string, { to: string; edge: number }[]>();
  const loops: number[][] = [];
  edges.forEach((e, i) => {
    if (e.a === e.b) {
      loops.push([i]);
      return;
    }
    if (!uf.union(e.a, e.b)) {
      const path = treePath(tree, e.a, e.b);
      loops.push([...(path ?? []), i]);
      return;
    }
    for (const [x, y] of [
      [e.a, e.b],
      [e.b, e.a],
    ]) {
      const list = tree.get(x) ?? [];
      list.push({ to: y, edge: i });
      tree.set(x, list);
    }
  });
  return loops.map((l) => [...l].sort((p, q) => p - q));
}

function treePath(tree: Map<string, { to: string; edge: number }[]>, from: string, to: string): number[] | null {
  const prev = new Map<string, { node: string; edge: number }>();
  const queue = [from];
  const seen = new Set([from]);
  while (queue.length > 0) {
    const n = queue.shift()!;
    if (n === to) break;
    for (const { to: m, edge } of tree.get(n) ?? []) {
      if (seen.has(m)) continue;
      seen.add(m);
      prev.set(m, { node: n, edge });
      queue.push(m);
    }
  }
  if (!seen.has(to)) return null;
  const path: number[] = [];
  for (let n = to; n !== from; ) {
    const p = prev.get(n)!;
    path.push(p.edge);
    n = p.node;
  }
  return path;
}

/**
 * Groups of nodes joined to the rest only by independent current sources: their KCL rows add up to
 * a row of zeros. The port's short is counted as a joining element, since a port that is an ideal
 * current source is a degenerate port (no Thevenin form), not an error.
 */
function currentSourceCutsets(network: Network): Diagnostic[] {
  const short: Edge = { a: network.port.plus, b: network.port.minus, element: "(port short)" };
  const groups = groupsAwayFromGround(network, [...carryingEdges(network), short]);
  const driving = network.elements.filter((e) => !isOpamp(e) && isCurrentType(e.kind)) as Exclude<Element, { kind: "opamp" }>[];
  const out: Diagnostic[] = [];
  for (const nodes of groups) {
    const set = new Set(nodes);
    const crossing = driving.filter((e) => set.has(e.nodes[0]) !== set.has(e.nodes[1]));
    if (crossing.length === 0) continue; // floating, reported elsewhere
    if (crossing.some((e) => isControlled(e))) continue; // dependent sources may make it solvable
    out.push(
      diagnostic(
        "current-source-cutset",
        `node${nodes.length > 1 ? "s" : ""} ${nodeList(nodes)} ${nodes.length > 1 ? "are" : "is"} joined to the rest of the network only by current source${crossing.length > 1 ? "s" : ""} ${crossing.map((e) => `"${e.name}"`).join(", ")}, so ${nodes.length > 1 ? "their voltages are" : "its voltage is"} not determined`,
        { nodes, elements: crossing.map((e) => e.name) },
      ),
    );
  }
  return out;
}

/** Nodes that reach ground only through capacitors: fine in s, but the result has no DC value there. */
function noDcPath(network: Network): Diagnostic[] {
  const capacitors = new Set(network.elements.filter((e) => e.kind === "capacitor").map((e) => e.name));
  if (capacitors.size === 0) return [];
  const all = [...carryingEdges(network), ...drivingEdges(network)];
  const floating = new Set(groupsAwayFromGround(network, all).flat());
  const groups = groupsAwayFromGround(
    network,
    all.filter((e) => !capacitors.has(e.element)),
  )
    .map((g) => g.filter((n) => !floating.has(n)))
    .filter((g) => g.length > 0);
  return groups.map((nodes) => {
    const set = new Set(nodes);
    const caps = network.elements
      .filter((e) => capacitors.has(e.name) && !isOpamp(e) && set.has(e.nodes[0]) !== set.has(e.nodes[1]))
      .map((e) => e.name);
    return diagnostic(
      "no-dc-path",
      `node${nodes.length > 1 ? "s" : ""} ${nodeList(nodes)} reach${nodes.length > 1 ? "" : "es"} ground only through capacitor${caps.length > 1 ? "s" : ""} ${caps.map((c) => `"${c}"`).join(", ")}; results are exact in s but have no DC value (s -> 0) there`,
      { nodes, elements: caps },
    );
  });
}

/** Structures that may explain a singular system (loops and cutsets involving dependent sources). */
export function suspectStructures(network: Network): { elements: string[]; note: string }[] {
  const out: { elements: string[]; note: string }[] = [];
  const fixing: Edge[] = [];
  for (const e of network.elements) {
    if (isOpamp(e)) fixing.push({ a: e.inputs[0], b: e.inputs[1], element: e.name });
    else if (isVoltageType(e.kind)) fixing.push({ a: e.nodes[0], b: e.nodes[1], element: e.name });
  }
  for (const loop of findLoops(fixing)) {
    const names = loop.map((i) => fixing[i].element);
    out.push({ elements: names, note: `loop of voltage-fixing elements ${names.map((n) => `"${n}"`).join(", ")}` });
  }
  const short: Edge = { a: network.port.plus, b: network.port.minus, element: "(port short)" };
  for (const nodes of groupsAwayFromGround(network, [...carryingEdges(network), short])) {
    const set = new Set(nodes);
    const crossing = drivingEdges(network).filter((e) => set.has(e.a) !== set.has(e.b));
    if (crossing.length === 0) continue;
    const names = crossing.map((e) => e.element);
    out.push({ elements: names, note: `nodes ${nodeList(nodes)} joined to the rest only by current sources ${names.map((n) => `"${n}"`).join(", ")}` });
  }
  return out;
}
