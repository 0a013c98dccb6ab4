// Cells: reusable blocks (a small-signal transistor, a finite-gain amplifier, a block a team saved)
// placed in a network as one part with named terminals, and expanded into engine elements before
// solving. Each instance may rename the cell's symbols (gm -> gm1), so two devices can differ.

import { parseValue, RationalFunction } from "../algebra";
import { controlOfSymbol, controlSymbol, printValue } from "../algebra/expression";
import type { CellDefinition, CellInstance, Diagnostic, Element, Network, ParseResult } from "../types";
import { diagnostic } from "./diagnostics";
import { elementNodes, isOpamp, sourceControls } from "./elements";
import { RENAMED_INCLUDE } from "./renamed";
import { NAME_PATTERN } from "./schema";

/** Node name inside a cell definition that stands for the network's ground. */
export const CELL_GROUND = "0";

/**
 * Small-signal bipolar transistor, hybrid-π: r_pi from base to emitter, gm·v_be from collector to
 * emitter, ro from collector to emitter.
 */
export const BJT_HYBRID_PI: CellDefinition = {
  id: "bjt-hybrid-pi",
  title: "Bipolar transistor, small-signal hybrid-π",
  terminals: ["b", "c", "e"],
  symbols: ["gm", "r_pi", "ro"],
  elements: [
    { name: "rpi", kind: "resistor", nodes: ["b", "e"], value: "r_pi" },
    { name: "gm", kind: "current", nodes: ["c", "e"], value: "gm * across(b, e)" },
    { name: "ro", kind: "resistor", nodes: ["c", "e"], value: "ro" },
  ],
};

/**
 * Small-signal MOSFET: one current source gm·v_gs + gmb·v_bs from drain to source, ro from drain to
 * source, and on request the gate capacitances Cgs and Cgd.
 */
export const MOSFET: CellDefinition = {
  id: "mosfet",
  title: "MOSFET, small-signal with body effect",
  terminals: ["g", "d", "s", "b"],
  symbols: ["gm", "gmb", "ro", "Cgs", "Cgd"],
  elements: [
    { name: "gm", kind: "current", nodes: ["d", "s"], value: "gm * across(g, s) + gmb * across(b, s)" },
    { name: "ro", kind: "resistor", nodes: ["d", "s"], value: "ro" },
    { name: "Cgs", kind: "capacitor", nodes: ["g", "s"], value: "Cgs" },
    { name: "Cgd", kind: "capacitor", nodes: ["g", "d"], value: "Cgd" },
  ],
  optional: ["Cgs", "Cgd"],
};

/** Finite-gain amplifier: Rin across the inputs, A·(v_p − v_n) behind Ro at the output (referenced to ground). */
export const AMPLIFIER: CellDefinition = {
  id: "amplifier",
  title: "Amplifier with finite gain, input and output resistance",
  terminals: ["p", "n", "o"],
  symbols: ["A", "Rin", "Ro"],
  elements: [
    { name: "Rin", kind: "resistor", nodes: ["p", "n"], value: "Rin" },
    { name: "A", kind: "voltage", nodes: ["x", CELL_GROUND], value: "A * across(p, n)" },
    { name: "Ro", kind: "resistor", nodes: ["x", "o"], value: "Ro" },
  ],
};

/** The cells every network can use, by id. */
export const BUILT_IN_CELLS: ReadonlyMap<string, CellDefinition> = new Map([BJT_HYBRID_PI, MOSFET, AMPLIFIER].map((c) => [c.id, c]));

/** Cell ids: letters, digits, underscore and hyphen. */
const CELL_ID_PATTERN = /^[\p{L}\p{N}_-]+$/u;

export interface ExpandedNetwork {
  /** The network with every cell instance replaced by its elements; null when an instance is invalid. */
  network: Network | null;
  diagnostics: Diagnostic[];
  /** Expanded element name -> the instance it came from. */
  origin: ReadonlyMap<string, string>;
  positions?: ParseResult["positions"];
}

/** Element name of a cell's element inside an instance. */
function expandedName(instance: string, element: string): string {
  return `${instance}_${element}`;
}

/** Replace every cell instance by its elements (network order: plain elements first, then instances in order). */
export function expandCells(network: Network, positions?: ParseResult["positions"], library: readonly CellDefinition[] = []): ExpandedNetwork {
  const instances = network.cells ?? [];
  const origin = new Map<string, string>();
  if (instances.length === 0) return { network, diagnostics: [], origin, positions };
  const definitions = new Map(BUILT_IN_CELLS);
  for (const d of [...library, ...(network.cellDefinitions ?? [])]) definitions.set(d.id, d);

  const diagnostics: Diagnostic[] = [];
  const elements: Element[] = [...network.elements];
  const placed: NonNullable<ParseResult["positions"]> = { ...(positions ?? {}) };
  instances.forEach((instance, i) => {
    const where = (key: string) => ({ elements: [instance.name], path: ["cells", i, key], ...linePosition(positions, instance.name) });
    const definition = definitions.get(instance.cell);
    if (!definition) {
      const known = [...definitions.keys()].join(", ");
      diagnostics.push(diagnostic("cell-unknown", `"${instance.name}" is an instance of cell "${instance.cell}", which is not defined (known cells: ${known})`, where("cell")));
      return;
    }
    const problems = instanceProblems(instance, definition);
    if (problems.length > 0) {
      for (const p of problems) diagnostics.push(diagnostic(p.code, `cell "${instance.name}" (${definition.id}): ${p.message}`, where(p.key)));
      return;
    }
    const expanded = expandInstance(instance, definition, network.ground);
    for (const e of expanded) {
      origin.set(e.name, instance.name);
      if (positions?.[instance.name]) placed[e.name] = positions[instance.name];
    }
    elements.push(...expanded);
  });
  if (diagnostics.length > 0) return { network: null, diagnostics, origin, positions };
  const { cells: _cells, cellDefinitions: _definitions, ...rest } = network;
  return { network: { ...rest, elements }, diagnostics, origin, positions: positions ? placed : undefined };
}

function linePosition(positions: ParseResult["positions"], name: string): { line?: number; column?: number } {
  const p = positions?.[name];
  return p ? { line: p.line, column: 1 } : {};
}

function instanceProblems(instance: CellInstance, definition: CellDefinition): { code: "cell-terminals" | "cell-symbols"; key: string; message: string }[] {
  const out: { code: "cell-terminals" | "cell-symbols"; key: string; message: string }[] = [];
  const given = Object.keys(instance.terminals);
  const missing = definition.terminals.filter((t) => instance.terminals[t] === undefined);
  const unknown = given.filter((t) => !definition.terminals.includes(t));
  if (missing.length > 0) out.push({ code: "cell-terminals", key: "terminals", message: `terminal${missing.length > 1 ? "s" : ""} ${missing.join(", ")} not connected (the cell's terminals are ${definition.terminals.join(", ")})` });
  if (unknown.length > 0) out.push({ code: "cell-terminals", key: "terminals", message: `the cell has no terminal ${unknown.join(", ")} (its terminals are ${definition.terminals.join(", ")})` });
  for (const [symbol, text] of Object.entries(instance.symbols ?? {})) {
    if (!definition.symbols.includes(symbol)) {
      out.push({ code: "cell-symbols", key: "symbols", message: `the cell has no symbol "${symbol}" to rename (its symbols are ${definition.symbols.join(", ")})` });
      continue;
    }
    try {
      parseValue(text);
    } catch (e) {
      out.push({ code: "cell-symbols", key: "symbols", message: `the new name for "${symbol}", "${text}", is not a symbol or expression (${e instanceof Error ? e.message : String(e)})` });
    }
  }
  for (const part of instance.with ?? []) {
    if (!(definition.optional ?? []).includes(part)) {
      const parts = definition.optional?.length ? `its optional parts are ${definition.optional.join(", ")}` : "it has no optional parts";
      out.push({ code: "cell-symbols", key: "with", message: `cannot place "${part}" with it: ${parts}` });
    }
  }
  return out;
}

/** The elements one instance stands for: names prefixed, terminals joined, internal nodes made unique, symbols renamed. */
function expandInstance(instance: CellInstance, definition: CellDefinition, ground: string): Element[] {
  const node = (n: string) => (definition.terminals.includes(n) ? instance.terminals[n] : n === CELL_GROUND ? ground : expandedName(instance.name, n));
  const inner = new Set(definition.elements.map((e) => e.name));
  const renames: Record<string, RationalFunction> = {};
  for (const [symbol, text] of Object.entries(instance.symbols ?? {})) renames[symbol] = parseValue(text);
  // Symbols take the instance's names; the controls a value names move to the instance's nodes and elements.
  const rename = (value: string) => {
    const f = parseValue(value);
    const moved: Record<string, RationalFunction> = {};
    for (const v of f.variables()) {
      const c = controlOfSymbol(v);
      if (!c) continue;
      const args = c.word === "across" ? c.args.map(node) : c.args.map((x) => (inner.has(x) ? expandedName(instance.name, x) : x));
      moved[v] = RationalFunction.variable(controlSymbol(c.word, args));
    }
    const all = { ...renames, ...moved };
    return Object.keys(all).length === 0 ? value : printValue(f.substituteExpressions(all));
  };
  const included = new Set(instance.with ?? []);
  return definition.elements
    .filter((e) => !(definition.optional ?? []).includes(e.name) || included.has(e.name))
    .map((e): Element => {
      const name = expandedName(instance.name, e.name);
      if (isOpamp(e)) return { name, kind: "opamp", inputs: [node(e.inputs[0]), node(e.inputs[1])], output: node(e.output) };
      const nodes: [string, string] = [node(e.nodes[0]), node(e.nodes[1])];
      return { name, kind: e.kind, nodes, value: rename(e.value) };
    });
}

/**
 * Name the instance in diagnostics that name elements it expanded into; a JSON path into the
 * expanded elements is pointed at the instance instead.
 */
export function attributeToCells(diagnostics: Diagnostic[], origin: ReadonlyMap<string, string>, cells: readonly CellInstance[] = []): Diagnostic[] {
  if (origin.size === 0) return diagnostics;
  return diagnostics.map((d) => {
    const instances = [...new Set(d.elements.map((e) => origin.get(e)).filter((x): x is string => x !== undefined))];
    if (instances.length === 0) return d;
    const label = instances.map((x) => `"${x}"`).join(", ");
    const out: Diagnostic = { ...d, elements: [...new Set([...instances, ...d.elements])], message: `${d.message} (inside cell ${label})` };
    const index = cells.findIndex((c) => c.name === instances[0]);
    if (d.path?.[0] === "elements" && index >= 0) out.path = ["cells", index];
    return out;
  });
}

/** Structural check of a cell definition (a team's own cell): names, terminals, nodes. */
export function checkCellDefinition(definition: CellDefinition): string[] {
  const out: string[] = [];
  if (!CELL_ID_PATTERN.test(definition.id)) out.push(`cell id "${definition.id}": letters, digits, underscore and hyphen`);
  if (definition.terminals.length < 2) out.push("a cell has at least two terminals");
  for (const t of definition.terminals) if (!NAME_PATTERN.test(t) || t === CELL_GROUND) out.push(`terminal "${t}": letters, digits and underscore, and not "${CELL_GROUND}" (the ground)`);
  const names = new Set<string>();
  for (const e of definition.elements) {
    if (names.has(e.name)) out.push(`two elements are named "${e.name}"`);
    names.add(e.name);
  }
  if (definition.elements.length === 0) out.push("a cell has at least one element");
  // A terminal may only sense a voltage (a transistor's gate drives nothing in the small-signal model).
  const sensed = definition.elements.flatMap((e) => sourceControls(e).flatMap((c) => ("nodes" in c ? c.nodes : [])));
  const touched = new Set([...definition.elements.flatMap((e) => elementNodes(e)), ...sensed]);
  for (const t of definition.terminals) if (!touched.has(t)) out.push(`terminal "${t}" is neither a node of an element nor a controlling node`);
  for (const o of definition.optional ?? []) if (!names.has(o)) out.push(`optional part "${o}" is not an element of the cell`);
  return out;
}

// ---------------------------------------------------------------------------------------------
// The netlist line of a cell instance:
//   <name> cell <cell> <terminal>=<node> ... [with <part> ...] [rename <symbol>:<new> ...]

export class CellLineError extends Error {
  constructor(
    message: string,
    readonly column: number,
  ) {
    super(message);
  }
}

const CELL_LINE_USAGE = "<name> cell <cell> <terminal>=<node> ... [with <part> ...] [rename <symbol>:<new> ...]";

/** Read a cell line from its whitespace-separated tokens (1-based columns). */
export function readCellLine(tokens: readonly { text: string; column: number }[]): CellInstance {
  const [nameToken, , cellToken] = tokens;
  if (!NAME_PATTERN.test(nameToken.text)) throw new CellLineError(`"${nameToken.text}" is not a valid cell instance name (letters, digits and underscore)`, nameToken.column);
  if (!cellToken) throw new CellLineError(`missing the cell; write "${CELL_LINE_USAGE}"`, tokens[1].column + 5);
  if (!CELL_ID_PATTERN.test(cellToken.text)) throw new CellLineError(`"${cellToken.text}" is not a cell id`, cellToken.column);
  const instance: CellInstance = { name: nameToken.text, cell: cellToken.text, terminals: {} };
  let section: "terminals" | "with" | "rename" = "terminals";
  for (const t of tokens.slice(3)) {
    if (t.text === "include") throw new CellLineError(RENAMED_INCLUDE, t.column);
    if (t.text === "with" || t.text === "rename") {
      section = t.text;
      continue;
    }
    if (section === "with") {
      if (!NAME_PATTERN.test(t.text)) throw new CellLineError(`"${t.text}" is not a part name`, t.column);
      (instance.with ??= []).push(t.text);
    } else if (section === "rename") {
      const m = /^([\p{L}\p{N}_]+):(.+)$/u.exec(t.text);
      if (!m) throw new CellLineError(`write a rename as <symbol>:<new>, e.g. gm:gm1 (no spaces)`, t.column);
      (instance.symbols ??= {})[m[1]] = m[2];
    } else {
      const m = /^([\p{L}\p{N}_]+)=([\p{L}\p{N}_]+)$/u.exec(t.text);
      if (!m) throw new CellLineError(`write a terminal as <terminal>=<node>, e.g. b=in (no spaces)`, t.column);
      if (instance.terminals[m[1]] !== undefined) throw new CellLineError(`terminal "${m[1]}" is connected twice`, t.column);
      instance.terminals[m[1]] = m[2];
    }
  }
  return instance;
}

export function printCellLine(c: CellInstance): string {
  const parts = [c.name, "cell", c.cell, ...Object.entries(c.terminals).map(([t, n]) => `${t}=${n}`)];
  if (c.with && c.with.length > 0) parts.push("with", ...c.with);
  const renames = Object.entries(c.symbols ?? {});
  if (renames.length > 0) parts.push("rename", ...renames.map(([s, v]) => `${s}:${v.replace(/\s+/g, "")}`));
  return parts.join(" ");
}
