// Comparing two revisions of a network: what changed in the circuit, which results changed.
import type { Database } from "../db/client.js";
import type { Network } from "../solver/engine.js";
import { requireRevision } from "./revisions.js";

type Element = Network["elements"][number];

interface ElementChange {
  name: string;
  before: Element;
  after: Element;
  fields: string[];
}

export interface CircuitChanges {
  added: Element[];
  removed: Element[];
  changed: ElementChange[];
  port: { before: Network["port"]; after: Network["port"] } | null;
  ground: { before: string; after: string } | null;
  quantities: { symbol: string; before: string | null; after: string | null }[];
}

const resultNames = ["vth", "isc", "rth", "rthFromVocIsc"] as const;

export interface ResultChange {
  name: (typeof resultNames)[number];
  before: string | null;
  after: string | null;
  changed: boolean;
}

const same = (a: unknown, b: unknown) => JSON.stringify(a) === JSON.stringify(b);

// Elements are matched by name, the one identity a netlist gives them.
function circuitChanges(before: Network, after: Network): CircuitChanges {
  const old = new Map(before.elements.map((e) => [e.name, e]));
  const now = new Map(after.elements.map((e) => [e.name, e]));
  const changed: ElementChange[] = [];
  for (const [name, element] of now) {
    const previous = old.get(name);
    if (!previous || same(previous, element)) continue;
    const keys = new Set([...Object.keys(previous), ...Object.keys(element)]);
    const fields = [...keys].filter((key) => !same((previous as unknown as Record<string, unknown>)[key], (element as unknown as Record<string, unknown>)[key])).sort();
    changed.push({ name, before: previous, after: element, fields });
  }
  const beforeQuantities = before.quantities ?? {};
  const afterQuantities = after.quantities ?? {};
  const symbols = [...new Set([...Object.keys(beforeQuantities), ...Object.keys(afterQuantities)])].sort();
  return {
    added: after.elements.filter((e) => !old.has(e.name)),
    removed: before.elements.filter((e) => !now.has(e.name)),
    changed,
    port: same(before.port, after.port) ? null : { before: before.port, after: after.port },
    ground: before.ground === after.ground ? null : { before: before.ground, after: after.ground },
    quantities: symbols
      .filter((s) => beforeQuantities[s] !== afterQuantities[s])
      .map((s) => ({ symbol: s, before: beforeQuantities[s] ?? null, after: afterQuantities[s] ?? null })),
  };
}

// The engine prints equal results equally (canonical form), so comparing the infix text is exact.
function resultChanges(before: Record<string, unknown>, after: Record<string, unknown>): ResultChange[] {
  const infix = (results: Record<string, unknown>, name: string) => {
    const entry = results[name] as { infix?: unknown } | null | undefined;
    return typeof entry?.infix === "string" ? entry.infix : null;
  };
  return resultNames.map((name) => {
    const a = infix(before, name);
    const b = infix(after, name);
    return { name, before: a, after: b, changed: a !== b };
  });
}

export async function compareRevisions(db: Database, userId: string, networkId: string, from: number, to: number) {
  const a = await requireRevision(db, userId, networkId, from, "viewer");
  const b = await requireRevision(db, userId, networkId, to, "viewer");
  return {
    from: { number: a.revision.number, createdAt: a.revision.createdAt.toISOString() },
    to: { number: b.revision.number, createdAt: b.revision.createdAt.toISOString() },
    circuit: circuitChanges(a.revision.circuit as Network, b.revision.circuit as Network),
    results: resultChanges(a.revision.results as Record<string, unknown>, b.revision.results as Record<string, unknown>),
  };
}
