import type { Circuit, CircuitElement, Revision } from "@/lib/api-contract";

export interface ElementDifference {
  name: string;
  before: CircuitElement | null;
  after: CircuitElement | null;
}

const same = (a: unknown, b: unknown) => JSON.stringify(a) === JSON.stringify(b);

// Elements are matched by name, the one identity a netlist gives them.
export function circuitDifferences(before: Circuit, after: Circuit): { elements: ElementDifference[]; portChanged: boolean } {
  const old = new Map(before.elements.map((e) => [e.name, e]));
  const now = new Map(after.elements.map((e) => [e.name, e]));
  const names = [...new Set([...old.keys(), ...now.keys()])];
  const elements = names
    .map((name) => ({ name, before: old.get(name) ?? null, after: now.get(name) ?? null }))
    .filter((d) => !same(d.before, d.after));
  return { elements, portChanged: !same(before.port, after.port) };
}

export function resultChanged(a: Revision, b: Revision, name: "vth" | "rth" | "isc"): boolean {
  // Canonical printing makes equal results print equally, so the text comparison is exact.
  return (a.results[name]?.infix ?? null) !== (b.results[name]?.infix ?? null);
}
