// Random networks for the cross-check tests: small, connected, every element kind, deterministic per seed.

import { readdirSync, readFileSync } from "node:fs";
import { ELEMENT_KINDS as ELEMENT_KIND_LIST, type Element, type ElementKind, type NetworkInput } from "../../shared/engine";

export function mulberry32(seed: number): () => number {
  let t = seed >>> 0;
  return () => {
    t = (t + 0x6d2b79f5) >>> 0;
    let r = Math.imul(t ^ (t >>> 15), 1 | t);
    r = (r + Math.imul(r ^ (r >>> 7), 61 | r)) ^ r;
    return ((r ^ (r >>> 14)) >>> 0) / 4294967296;
  };
}

/** What an extra element is: a passive, an independent source, or a source controlled by a voltage, a current, or several. */
type Extra = "resistor" | "conductance" | "capacitor" | "inductor" | "v-independent" | "i-independent" | "v-by-voltage" | "i-by-voltage" | "v-by-current" | "i-by-current" | "i-by-several";
const EXTRAS: Extra[] = ["resistor", "conductance", "capacitor", "inductor", "v-independent", "i-independent", "v-by-voltage", "i-by-voltage", "v-by-current", "i-by-current", "i-by-several"];

/** The extras that produce an element of a kind, for GeneratorOptions.force. */
const EXTRAS_OF_KIND: Partial<Record<ElementKind, Extra[]>> = {
  voltage: ["v-independent", "v-by-voltage", "v-by-current"],
  current: ["i-independent", "i-by-voltage", "i-by-current", "i-by-several"],
};

export interface GeneratorOptions {
  /** Allow plain numbers with SI prefixes and composite values. */
  numbers?: boolean;
  /** Allow reactive elements (results in s). */
  reactive?: boolean;
  /** Force this kind to appear. */
  force?: ElementKind;
}

/** A connected network of 2–4 nodes with a passive backbone, extra elements of any kind, and a port. */
export function randomNetwork(rand: () => number, opts: GeneratorOptions = {}): NetworkInput {
  const pick = <T>(xs: readonly T[]): T => xs[Math.floor(rand() * xs.length)];
  const nodeCount = 2 + Math.floor(rand() * 3);
  const nodes = Array.from({ length: nodeCount }, (_, i) => `n${i + 1}`);
  const all = ["0", ...nodes];
  const elements: Element[] = [];
  // V-type elements and op-amp inputs must not close a loop among themselves.
  const parent = new Map<string, string>();
  const find = (a: string): string => (parent.get(a) ?? a) === a ? a : find(parent.get(a)!);
  const fixes = (a: string, b: string) => {
    const ra = find(a);
    const rb = find(b);
    if (ra === rb) return false;
    parent.set(ra, rb);
    return true;
  };
  let k = 0;
  // Names say what a part is (Res, Amp, Gm...), numbered to keep them apart.
  const name = (word: string) => `${word}${++k}`;
  const passiveValue = (kind: ElementKind, id: string): string => {
    const letter = { resistor: "R", conductance: "G", capacitor: "C", inductor: "L" }[kind as "resistor"];
    const r = rand();
    if (opts.numbers && r < 0.15) return pick(kind === "resistor" ? ["4.7k", "1k", "220", "2.2M"] : kind === "conductance" ? ["1m", "20u"] : kind === "capacitor" ? ["100n", "4.7u"] : ["10m", "2.2u"]);
    if (opts.numbers && r < 0.22) return `${letter}${id}a + ${letter}${id}b`;
    if (opts.numbers && r < 0.27) return `2*${letter}${id}`;
    return `${letter}${id}`;
  };
  const addPassive = (a: string, b: string, kind?: ElementKind) => {
    const kinds: ElementKind[] = opts.reactive ? ["resistor", "resistor", "resistor", "conductance", "capacitor", "inductor"] : ["resistor", "resistor", "conductance"];
    const kd = kind ?? pick(kinds);
    const id = String(k + 1);
    const prefix = { resistor: "Res", conductance: "Cond", capacitor: "Cap", inductor: "Ind" }[kd as "resistor"];
    elements.push({ name: name(prefix), kind: kd as "resistor", nodes: [a, b], value: passiveValue(kd, id) });
  };

  // Backbone: every node joined to an earlier node or ground through a passive.
  nodes.forEach((n, i) => addPassive(n, pick(all.slice(0, i + 1))));

  const extras = 1 + Math.floor(rand() * 4);
  const kinds: Extra[] = [];
  if (opts.force && opts.force !== "opamp") kinds.push(EXTRAS_OF_KIND[opts.force] ? pick(EXTRAS_OF_KIND[opts.force]!) : (opts.force as Extra));
  while (kinds.length < extras) {
    const kd = pick(EXTRAS);
    if (!opts.reactive && (kd === "capacitor" || kd === "inductor")) continue;
    kinds.push(kd);
  }
  const across = () => {
    const c1 = pick(all);
    let c2 = pick(all);
    if (c1 === c2) c2 = c1 === "0" ? nodes[nodes.length - 1] : "0";
    return `across(${c1}, ${c2})`;
  };
  const through = () => `through(${pick(elements.filter((e) => e.kind !== "opamp")).name})`;
  for (const kd of kinds) {
    const a = pick(all);
    let b = pick(all);
    if (a === b) b = a === "0" ? nodes[0] : "0";
    const id = String(k + 1);
    if (kd === "resistor" || kd === "conductance" || kd === "capacitor" || kd === "inductor") {
      addPassive(a, b, kd);
      continue;
    }
    const voltage = kd.startsWith("v-");
    if (voltage && !fixes(a, b)) continue;
    const kind = voltage ? "voltage" : "current";
    let value: string;
    if (kd === "v-independent" || kd === "i-independent") {
      value = opts.numbers && rand() < 0.2 ? pick(["5", "1.5", "3.3"]) : `${voltage ? "V" : "I"}${id}`;
    } else if (kd === "v-by-voltage") {
      const gain = opts.reactive && rand() < 0.25 ? `(A${id}/(1 + s*T${id}))` : `mu${id}`;
      // Now and then an independent part beside the controlled one.
      value = rand() < 0.2 ? `V${id} + ${gain} * ${across()}` : `${gain} * ${across()}`;
    } else if (kd === "i-by-voltage") {
      value = `gm${id} * ${across()}`;
    } else if (kd === "v-by-current") {
      value = `rm${id} * ${through()}`;
    } else if (kd === "i-by-current") {
      value = `beta${id} * ${through()}`;
    } else {
      // One source, two controls: a transconductance with body effect, or a voltage and a current control.
      value = rand() < 0.5 ? `gm${id} * ${across()} + gmb${id} * ${across()}` : `gm${id} * ${across()} - beta${id} * ${through()}`;
    }
    const word = { "v-independent": "Src", "i-independent": "Feed", "v-by-voltage": "Amp", "i-by-voltage": "Gm", "v-by-current": "Sense", "i-by-current": "Mirror", "i-by-several": "Dev" }[kd];
    elements.push({ name: name(word), kind, nodes: [a, b], value });
  }

  if (opts.force === "opamp") {
    // Op-amp in a feedback loop: output on a new node, feedback passive to its inverting input.
    const o = `n${nodeCount + 1}`;
    const inv = pick(nodes);
    const non = pick(["0", ...nodes.filter((n) => n !== inv)]);
    if (fixes(non, inv)) {
      elements.push({ name: name("Buf"), kind: "opamp", inputs: [non, inv], output: o });
      addPassive(o, inv, "resistor");
      if (rand() < 0.5) addPassive(o, "0", "resistor");
      nodes.push(o);
    }
  }
  const plus = pick([...nodes]);
  let minus = pick(["0", "0", ...nodes]);
  if (minus === plus) minus = "0";
  return { port: { plus, minus }, elements };
}

/** The generated corpus that the sympy cross-check solves: every element kind forced in turn, numbers and s alternating. */
export function generatedCorpus(count: number): NetworkInput[] {
  return Array.from({ length: count }, (_, i) => {
    const rand = mulberry32(1000 + i);
    return randomNetwork(rand, { numbers: i % 3 === 0, reactive: i % 2 === 1, force: ELEMENT_KIND_LIST[i % ELEMENT_KIND_LIST.length] });
  });
}

/** The networks of fixtures/ (JSON and Portfold netlist), by file name. */
export function fixtureNetworks(): { file: string; text: string }[] {
  const dir = new URL("../../fixtures/", import.meta.url).pathname;
  return readdirSync(dir)
    .filter((f) => f.endsWith(".json") || f.endsWith(".pfn"))
    .sort()
    .map((file) => ({ file, text: readFileSync(dir + file, "utf8") }));
}
