// The add-a-cell form read into the engine's cell definition: elements from netlist lines, lists from commas.
import { CELL_GROUND, parseNetlistText, type CellDefinition, type Element } from "@/lib/engine-netlist";
import type { Diagnostic } from "@/lib/api-contract";

export interface CellFormInput {
  id: string;
  title: string;
  /** Comma-separated terminal names. */
  terminals: string;
  /** Comma-separated symbols; empty to take them from the element values. */
  symbols: string;
  /** Element lines of the Portfold netlist. */
  elements: string;
}

export interface ReadCellForm {
  /** Null while the element lines have errors or there are none. */
  definition: CellDefinition | null;
  /** Problems in the element lines, each with its line. */
  diagnostics: Diagnostic[];
  /** Element name -> its line in the element text, to place the server's diagnostics. */
  lines: ReadonlyMap<string, number>;
  /** The symbols the definition carries (as listed, or as found in the values). */
  symbols: string[];
}

const DIRECTIVES = new Set(["ground", "port", "quantity"]);

/** "a, b  c" -> ["a", "b", "c"]: commas or spaces between names. */
function listOf(text: string): string[] {
  return [...new Set(text.split(/[\s,]+/).filter((s) => s !== ""))];
}

// Numbers (with an SI prefix right after the digits) are skipped so "1k" is not read as the symbol k.
const VALUE_TOKEN = /(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?(?:[TGMkmunpf\u00b5\u03bc](?![A-Za-z0-9_]))?|([A-Za-z_][A-Za-z0-9_]*)/g;

/** The identifiers the element values use, in first-use order (a controlled source's value is its gain alone). */
function valueSymbols(elements: readonly Element[]): string[] {
  const found = new Set<string>();
  for (const e of elements) {
    if (!("value" in e)) continue;
    for (const m of e.value.matchAll(VALUE_TOKEN)) if (m[1]) found.add(m[1]);
  }
  return [...found];
}

function lineProblem(line: number, message: string): Diagnostic {
  return { code: "parse-error", severity: "error", message: `line ${line}, column 1: ${message}`, elements: [], nodes: [], line, column: 1 };
}

export function readCellForm(form: CellFormInput): ReadCellForm {
  const diagnostics: Diagnostic[] = [];
  // A cell has no port or ground of its own: those lines are refused here and blanked so the line numbers stay.
  const lines = form.elements.split(/\r\n|\n|\r/).map((raw, i) => {
    const word = raw.replace(/#.*/, "").trim().split(/\s+/)[0];
    if (!DIRECTIVES.has(word)) return raw;
    diagnostics.push(lineProblem(i + 1, `a cell has no "${word}" line: its ground is node ${CELL_GROUND} and its terminals are listed above`));
    return "";
  });
  // The reader wants a port; this one, after the last line, leaves every line number as typed.
  const parsed = parseNetlistText(`${lines.join("\n")}\nport ${CELL_GROUND} ${CELL_GROUND}`);
  diagnostics.push(...parsed.diagnostics);
  const positions = new Map(Object.entries(parsed.positions ?? {}).map(([name, p]) => [name, p.line]));
  for (const c of parsed.network?.cells ?? []) diagnostics.push(lineProblem(positions.get(c.name) ?? 1, `"${c.name}" places a cell; a cell's lines are elements only`));

  const elements = parsed.network?.elements ?? [];
  const symbols = form.symbols.trim() === "" ? valueSymbols(elements) : listOf(form.symbols);
  const ok = diagnostics.length === 0 && elements.length > 0;
  const definition: CellDefinition | null = ok ? { id: form.id.trim(), title: form.title.trim(), terminals: listOf(form.terminals), symbols, elements } : null;
  return { definition, diagnostics, lines: positions, symbols };
}

/** The line a server diagnostic is about, from its path (definition.elements[i]) or the elements it names. */
export function lineOfDiagnostic(d: Diagnostic, definition: CellDefinition | undefined, lines: ReadonlyMap<string, number>): number | undefined {
  const path = d.path ?? [];
  const at = path[0] === "definition" && path[1] === "elements" && typeof path[2] === "number" ? definition?.elements[path[2]]?.name : undefined;
  const name = at ?? d.elements.find((e) => lines.has(e));
  return name === undefined ? undefined : lines.get(name);
}
