// Networks for bench:engine: ladders, and small dense or non-planar graphs (complete graphs,
// the complete bipartite K3,3, grids, a bridged T, a lattice), each plain, with three
// controlled sources, and with capacitors and inductors (results in s).

import type { Element, NetworkInput } from "../shared/engine";

/** A current source driving gm·V(cp, cn) from a to b (a transconductance). */
export function transconductor(name: string, a: string, b: string, cp: string, cn: string, gm: string): Element {
  return { name, kind: "current", nodes: [a, b], value: `${gm} * across(${cp}, ${cn})` };
}

/** A voltage source holding rm·I(sense) across a, b (a transresistance). */
export function transresistor(name: string, a: string, b: string, sense: string, rm: string): Element {
  return { name, kind: "voltage", nodes: [a, b], value: `${rm} * through(${sense})` };
}

/** An independent voltage source V(a) − V(b) = value. */
export function drive(name: string, a: string, b: string, value: string): Element {
  return { name, kind: "voltage", nodes: [a, b], value };
}

/** n sections of series Ra_i and shunt Rb_i, driven by Vs; optionally a transconductance gm_i·V(n_{i-1}) in every section. */
export function ladderNetwork(n: number, withGm: boolean): NetworkInput {
  const elements: Element[] = [drive("Vin", "n0", "0", "Vs")];
  for (let i = 1; i <= n; i++) {
    elements.push({ name: `Ra${i}`, kind: "resistor", nodes: [`n${i - 1}`, `n${i}`], value: `Ra_${i}` });
    elements.push({ name: `Rb${i}`, kind: "resistor", nodes: [`n${i}`, "0"], value: `Rb_${i}` });
    if (withGm) elements.push(transconductor(`Gm${i}`, `n${i}`, "0", `n${i - 1}`, "0", `gm_${i}`));
  }
  return { port: { plus: `n${n}`, minus: "0" }, elements };
}

type Edge = [string, string];

/** Resistors on the given edges (values R1, R2, ...), driven by Vs behind Rs into `feed` unless the drive is one of the edges. */
function resistive(edges: Edge[], feed: string | null, port: Edge, prefix = "Leg"): NetworkInput {
  const elements: Element[] = [];
  if (feed !== null) {
    elements.push(drive("Drive", "src", "0", "Vs"));
    elements.push({ name: "Rsrc", kind: "resistor", nodes: ["src", feed], value: "Rs" });
  }
  edges.forEach(([a, b], i) => elements.push({ name: `${prefix}${i + 1}`, kind: "resistor", nodes: [a, b], value: `R${i + 1}` }));
  return { port: { plus: port[0], minus: port[1] }, elements };
}

function completeEdges(nodes: string[]): Edge[] {
  const edges: Edge[] = [];
  for (let i = 0; i < nodes.length; i++) for (let j = i + 1; j < nodes.length; j++) edges.push([nodes[i], nodes[j]]);
  return edges;
}

/** K5: every pair of five nodes joined by a resistor, fed at k1 through Rs; port k4 to k2. */
export function completeK5(): NetworkInput {
  return resistive(completeEdges(["0", "k1", "k2", "k3", "k4"]), "k1", ["k4", "k2"]);
}

/** K6 with the port as one of its fifteen edges and the drive as another (an ideal Vs from k1 to 0): 13 resistors. */
export function completeK6(): NetworkInput {
  const edges = completeEdges(["0", "k1", "k2", "k3", "k4", "k5"]).filter(([a, b]) => !(a === "0" && b === "k1") && !(a === "k4" && b === "k5"));
  const net = resistive(edges, null, ["k5", "k4"]);
  return { ...net, elements: [drive("Drive", "k1", "0", "Vs"), ...net.elements] };
}

/** K3,3: three nodes a (one of them ground) each joined to three nodes b; fed at a1 through Rs, port b3 to a2. */
export function bipartiteK33(): NetworkInput {
  const a = ["a1", "a2", "0"];
  const b = ["b1", "b2", "b3"];
  return resistive(a.flatMap((x) => b.map((y): Edge => [x, y])), "a1", ["b3", "a2"]);
}

/** An n×n grid of nodes g_r_c (g_0_0 is ground) with a resistor on every side of every cell. */
function gridEdges(n: number): Edge[] {
  const at = (r: number, c: number) => (r === 0 && c === 0 ? "0" : `g${r}_${c}`);
  const edges: Edge[] = [];
  for (let r = 0; r < n; r++)
    for (let c = 0; c < n; c++) {
      if (c + 1 < n) edges.push([at(r, c), at(r, c + 1)]);
      if (r + 1 < n) edges.push([at(r, c), at(r + 1, c)]);
    }
  return edges;
}

/** 3×3 grid, fed at the far corner through Rs, port from the centre to ground. */
export function grid3(): NetworkInput {
  return resistive(gridEdges(3), "g2_2", ["g1_1", "0"]);
}

/**
 * 4×4 grid: 24 sides, so above fourteen elements; the twelve sides on the rim are symbolic
 * (R1 ... R12) and the twelve inside are 1 kΩ each, which keeps it at fourteen symbols.
 * Fed at the far corner through Rs, port from g1_1 to ground.
 */
export function grid4(): NetworkInput {
  const rim = (r: number, c: number, r2: number, c2: number) => (r === r2 && (r === 0 || r === 3)) || (c === c2 && (c === 0 || c === 3));
  const at = (r: number, c: number) => (r === 0 && c === 0 ? "0" : `g${r}_${c}`);
  const elements: Element[] = [drive("Drive", "src", "0", "Vs"), { name: "Rsrc", kind: "resistor", nodes: ["src", "g3_3"], value: "Rs" }];
  let k = 0;
  const side = (r: number, c: number, r2: number, c2: number) => {
    const symbolic = rim(r, c, r2, c2);
    elements.push({ name: `Side${r}${c}_${r2}${c2}`, kind: "resistor", nodes: [at(r, c), at(r2, c2)], value: symbolic ? `R${++k}` : "1k" });
  };
  for (let r = 0; r < 4; r++)
    for (let c = 0; c < 4; c++) {
      if (c + 1 < 4) side(r, c, r, c + 1);
      if (r + 1 < 4) side(r, c, r + 1, c);
    }
  return { port: { plus: "g1_1", minus: "0" }, elements };
}

/** Bridged T: two series arms, a shunt from their junction, a bridge across both, a load; fed through Rs. */
export function bridgedT(): NetworkInput {
  return resistive([["in", "mid"], ["mid", "out"], ["mid", "0"], ["in", "out"], ["out", "0"]], "in", ["out", "0"]);
}

/** Two symmetric lattice sections in cascade (series arms and crossed arms), fed through Rs, a load across the output. */
export function lattice(): NetworkInput {
  return resistive(
    [["in", "m1"], ["0", "m0"], ["in", "m0"], ["0", "m1"], ["m1", "out"], ["m0", "ret"], ["m1", "ret"], ["m0", "out"], ["out", "ret"]],
    "in",
    ["out", "ret"],
  );
}

/**
 * The same network with three controlled sources: a transconductance across the first edge's
 * nodes, one sensing the port, and a transresistance sensing the first resistor. Added beside
 * existing edges while the network stays within fourteen elements, otherwise in place of the last
 * resistors (their symbols go, so the symbol count stays within fourteen too).
 */
export function withControlledSources(net: NetworkInput): NetworkInput {
  const resistors = net.elements.filter((e) => e.kind === "resistor" && e.name !== "Rsrc");
  const add = net.elements.length + 3 <= 14;
  const hosts = resistors.slice(-3) as Array<Element & { nodes: [string, string] }>;
  const first = resistors[0] as Element & { nodes: [string, string] };
  const extra: Element[] = [
    transconductor("Gm1", hosts[0].nodes[0], hosts[0].nodes[1], first.nodes[0], first.nodes[1], "gm1"),
    transconductor("Gm2", hosts[1].nodes[0], hosts[1].nodes[1], net.port.plus, net.port.minus, "gm2"),
    transresistor("Trans", hosts[2].nodes[0], hosts[2].nodes[1], first.name, "rm"),
  ];
  const kept = add ? net.elements : net.elements.filter((e) => !hosts.includes(e as (typeof hosts)[number]));
  return { ...net, elements: [...kept, ...extra] };
}

/** The same network with every third resistor a capacitor and the one after it an inductor (results in s). */
export function withReactances(net: NetworkInput): NetworkInput {
  let i = 0;
  const elements = net.elements.map((e): Element => {
    if (e.kind !== "resistor" || e.name === "Rsrc") return e;
    i++;
    if (!/^R/.test(String(e.value))) return e;
    const tag = String(e.value).replace(/^R/, "");
    if (i % 3 === 1) return { ...e, kind: "capacitor", value: `C${tag}` };
    if (i % 3 === 2) return { ...e, kind: "inductor", value: `L${tag}` };
    return e;
  });
  return { ...net, elements };
}

export const FAMILIES: Record<string, () => NetworkInput> = {
  K5: completeK5,
  K6: completeK6,
  "K3,3": bipartiteK33,
  "grid-3x3": grid3,
  "grid-4x4": grid4,
  "bridged-T": bridgedT,
  lattice,
};

/** Every family network by name: plain, "+ctl" (controlled sources) and "+LC" (reactive). */
export function familyNetworks(): Array<{ name: string; network: NetworkInput }> {
  return Object.entries(FAMILIES).flatMap(([name, make]) => [
    { name, network: make() },
    { name: `${name}+ctl`, network: withControlledSources(make()) },
    { name: `${name}+LC`, network: withReactances(make()) },
  ]);
}
