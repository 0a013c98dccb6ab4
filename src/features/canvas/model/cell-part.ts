// A cell instance on the drawing: one part, a box with a pin per terminal; its pins map to the
// instance's `terminals`, and the network keeps it as a `cells` entry.
import { BUILT_IN_CELLS, type CellDefinition, type CellInstance, type Element, type EngineNetwork } from "@/lib/engine-netlist";
import type { Point } from "./geometry";

/** The cell instance as a part's element: `pins` are its terminal names in pin order. */
export interface CellPartElement extends CellInstance {
  kind: "cell";
  pins: readonly string[];
}

/** What a part stands for: an engine element or a cell instance. */
export type PartElement = Element | CellPartElement;

export const isCellPart = (e: PartElement): e is CellPartElement => e.kind === "cell";

/** The cells a drawing can place: the built-in ones, then the team's. */
export function cellLibrary(teamCells: readonly CellDefinition[] = []): ReadonlyMap<string, CellDefinition> {
  const out = new Map(BUILT_IN_CELLS);
  for (const d of teamCells) if (!out.has(d.id)) out.set(d.id, d);
  return out;
}

// The definition's terminal order where it is known, so a part looks the same however the text lists them.
function pinOrder(instance: CellInstance, library: ReadonlyMap<string, CellDefinition>): string[] {
  const given = Object.keys(instance.terminals);
  const known = library.get(instance.cell)?.terminals ?? [];
  return [...known.filter((t) => given.includes(t)), ...given.filter((t) => !known.includes(t))];
}

function cellPartOf(instance: CellInstance, library: ReadonlyMap<string, CellDefinition>): CellPartElement {
  return { ...instance, kind: "cell", pins: pinOrder(instance, library) };
}

/** The instance the part stands for (the engine's `cells` entry). */
export function instanceOf(part: CellPartElement): CellInstance {
  const { kind: _kind, pins: _pins, ...instance } = part;
  return instance;
}

/** A fresh instance of a cell, every terminal on the ground until wires say otherwise. */
export function newCellPart(definition: CellDefinition, name: string, ground: string): CellPartElement {
  return { name, cell: definition.id, terminals: Object.fromEntries(definition.terminals.map((t) => [t, ground])), kind: "cell", pins: [...definition.terminals] };
}

/** Everything the drawing shows of a network: its elements, then its cell instances. */
export function partElementsOf(network: EngineNetwork, library: ReadonlyMap<string, CellDefinition> = BUILT_IN_CELLS): PartElement[] {
  return [...network.elements, ...(network.cells ?? []).map((c) => cellPartOf(c, library))];
}

/** Half the box height in grid steps for a cell with n pins: pins two steps apart, the larger side first. */
export const cellHalfHeight = (pins: number) => Math.max(2, Math.ceil(pins / 2));

/** Local pin positions: the first half of the terminals on the left, the rest on the right. */
export function cellLocalPins(pins: number): Point[] {
  const left = Math.ceil(pins / 2);
  const column = (count: number, x: number): Point[] => Array.from({ length: count }, (_, k) => [x, 2 * k - (count - 1)] as const).map(([px, py]) => [px, py] as Point);
  return [...column(left, -4), ...column(pins - left, 4)];
}
