// The interchange format (JSON) checked at the edge with zod; issues become diagnostics with a path.

import { z } from "zod";
import type { Diagnostic, Network, NetworkInput, Quantity } from "../types";
import { ELEMENT_KINDS, QUANTITIES } from "../types";
import { diagnostic } from "./diagnostics";
import { RENAMED_CONTROL, RENAMED_INCLUDE, renamedKind } from "./renamed";

/** Element and node names: letters, digits and underscore, so the text netlist can always spell them. */
export const NAME_PATTERN = /^[\p{L}\p{N}_]+$/u;

const name = z.string().regex(NAME_PATTERN, "a name is letters, digits and underscore");
const node = z.string().regex(NAME_PATTERN, "a node name is letters, digits and underscore");
// Numbers are accepted for convenience and kept as their decimal text.
const value = z.union([z.string().trim().min(1, "a value cannot be empty"), z.number().finite().transform((n) => String(n))]);
const nodePair = z.tuple([node, node]);

// A source's controls live in its value (across(a, b), through(x)), in the netlist's expression language.
const twoTerminal = z.strictObject({
  name,
  kind: z.enum(["resistor", "conductance", "capacitor", "inductor", "voltage", "current"]),
  nodes: nodePair,
  value,
});

const opamp = z.strictObject({
  name,
  kind: z.literal("opamp"),
  inputs: nodePair,
  output: node,
});

const element = z.discriminatedUnion("kind", [twoTerminal, opamp]);

// Cells (an extension): instances are parts with named terminals, expanded before solving (circuit/cells.ts).
const cellId = z.string().regex(/^[\p{L}\p{N}_-]+$/u, "a cell id is letters, digits, underscore and hyphen");
const cellInstance = z.strictObject({
  name,
  cell: cellId,
  terminals: z.record(name, node),
  symbols: z.record(name, z.string().trim().min(1, "a symbol's new name cannot be empty")).optional(),
  with: z.array(name).optional(),
});
const cellDefinition = z.strictObject({
  id: cellId,
  title: z.string(),
  terminals: z.array(node).min(2, "a cell has at least two terminals"),
  symbols: z.array(name),
  elements: z.array(element).min(1, "a cell has at least one element"),
  optional: z.array(name).optional(),
});

export const networkSchema = z.strictObject({
  ground: node.optional(),
  port: z.strictObject({ plus: node, minus: node }),
  elements: z.array(element),
  // Symbol names as the netlist's `quantity` line spells them, so both forms accept the same names.
  quantities: z.record(name, z.enum(QUANTITIES)).optional(),
  // The drawing belongs to the client; the engine only keeps it with the network.
  layout: z.record(z.string(), z.unknown()).optional(),
  cells: z.array(cellInstance).optional(),
  cellDefinitions: z.array(cellDefinition).optional(),
  assumptions: z.array(z.string().trim().min(1).max(200)).max(20).optional(),
});

/** Check a parsed JSON value against the interchange format. */
export function validateNetworkJson(input: unknown): { network: Network | null; diagnostics: Diagnostic[] } {
  const kindProblems = [...renamedWords(input), ...unknownKinds(input)];
  if (kindProblems.length > 0) return { network: null, diagnostics: kindProblems };
  const parsed = networkSchema.safeParse(input);
  if (!parsed.success) {
    return {
      network: null,
      diagnostics: parsed.error.issues.map((issue) => {
        const path = issue.path.map((p) => (typeof p === "number" ? p : String(p)));
        const elementName = elementNameAt(input, path);
        return diagnostic("schema-invalid", `${formatPath(path)}: ${issue.message}`, {
          path,
          elements: elementName ? [elementName] : [],
        });
      }),
    };
  }
  return { network: normalizeNetwork(parsed.data as NetworkInput), diagnostics: [] };
}

/** Fill in defaults so later stages see one shape. */
export function normalizeNetwork(input: NetworkInput): Network {
  const network: Network = {
    ground: input.ground ?? "0",
    port: { plus: input.port.plus, minus: input.port.minus },
    elements: input.elements.map((e) => ({ ...e }) as typeof e),
  };
  if (input.quantities && Object.keys(input.quantities).length > 0) {
    network.quantities = { ...input.quantities } as Record<string, Quantity>;
  }
  if (input.layout !== undefined) network.layout = input.layout;
  if (input.cells && input.cells.length > 0) network.cells = input.cells.map((c) => ({ ...c }));
  if (input.cellDefinitions && input.cellDefinitions.length > 0) network.cellDefinitions = input.cellDefinitions;
  if (input.assumptions && input.assumptions.length > 0) network.assumptions = [...input.assumptions];
  return network;
}

/** Every element array of a network value, with its JSON path: the elements and each cell definition's. */
function elementArrays(input: unknown): { path: (string | number)[]; elements: unknown[] }[] {
  if (typeof input !== "object" || input === null) return [];
  const out: { path: (string | number)[]; elements: unknown[] }[] = [];
  const elements = (input as { elements?: unknown }).elements;
  if (Array.isArray(elements)) out.push({ path: ["elements"], elements });
  const definitions = (input as { cellDefinitions?: unknown }).cellDefinitions;
  if (Array.isArray(definitions)) {
    definitions.forEach((d, k) => {
      const inner = typeof d === "object" && d !== null ? (d as { elements?: unknown }).elements : undefined;
      if (Array.isArray(inner)) out.push({ path: ["cellDefinitions", k, "elements"], elements: inner });
    });
  }
  return out;
}

function eachElement(input: unknown, visit: (e: Record<string, unknown>, path: (string | number)[], names: string[]) => void): void {
  for (const { path, elements } of elementArrays(input)) {
    elements.forEach((e, i) => {
      if (typeof e !== "object" || e === null) return;
      const n = (e as { name?: unknown }).name;
      visit(e as Record<string, unknown>, [...path, i], typeof n === "string" ? [n] : []);
    });
  }
}

// Words of the earlier format are refused with the word that replaced each.
function renamedWords(input: unknown): Diagnostic[] {
  const out: Diagnostic[] = [];
  eachElement(input, (e, path, elements) => {
    const renamed = typeof e.kind === "string" ? renamedKind(e.kind) : null;
    if (renamed) out.push(diagnostic("format-renamed", `${formatPath([...path, "kind"])}: ${renamed}`, { path: [...path, "kind"], elements }));
    if ("control" in e) out.push(diagnostic("format-renamed", `${formatPath([...path, "control"])}: ${RENAMED_CONTROL}`, { path: [...path, "control"], elements }));
  });
  const cells = typeof input === "object" && input !== null ? (input as { cells?: unknown }).cells : undefined;
  if (Array.isArray(cells)) {
    cells.forEach((c, i) => {
      if (typeof c === "object" && c !== null && "include" in c) {
        const n = (c as { name?: unknown }).name;
        out.push(diagnostic("format-renamed", `cells[${i}].include: ${RENAMED_INCLUDE}`, { path: ["cells", i, "include"], elements: typeof n === "string" ? [n] : [] }));
      }
    });
  }
  return out;
}

// zod's message for an unknown discriminator is generic; name the kinds we accept instead.
function unknownKinds(input: unknown): Diagnostic[] {
  const out: Diagnostic[] = [];
  eachElement(input, (e, path, elements) => {
    const kind = e.kind;
    if (typeof kind === "string" && !(ELEMENT_KINDS as readonly string[]).includes(kind) && !renamedKind(kind)) {
      out.push(
        diagnostic("schema-invalid", `${formatPath([...path, "kind"])}: unknown element kind "${kind}" (one of ${ELEMENT_KINDS.join(", ")})`, {
          path: [...path, "kind"],
          elements,
        }),
      );
    }
  });
  return out;
}

function elementNameAt(input: unknown, path: (string | number)[]): string | null {
  if (path[0] !== "elements" || typeof path[1] !== "number") return null;
  const elements = (input as { elements?: unknown[] }).elements;
  const e = Array.isArray(elements) ? elements[path[1]] : undefined;
  const n = e && typeof e === "object" ? (e as { name?: unknown }).name : undefined;
  return typeof n === "string" ? n : null;
}

function formatPath(path: (string | number)[]): string {
  if (path.length === 0) return "network";
  return path.map((p, i) => (typeof p === "number" ? `[${p}]` : i === 0 ? p : `.${p}`)).join("");
}
