// The Portfold netlist: a line-oriented text form of a network, read and printed.
//
//   # comment (anywhere on a line)
//   ground 0
//   port out 0
//   quantity mu dimensionless
//   Vsens voltage in 0 = Vs
//   Rout resistor x out = R0
//   Amp voltage x 0 = mu * across(in, out)           (a source whose value names a control is controlled)
//   Gain current a b = beta * through(Rout)
//   Body current d s = gm*across(g, s) + gmb*across(b, s)
//   Buf opamp p n -> o          (non-inverting input, inverting input, -> output)
//   assume gm*ro >> 1          (a design assumption: each result also with its dominant terms)
//
// The kind is always the word in the second column; element names are free.

import { ValueSyntaxError } from "../algebra";
import { controlsIn } from "../algebra/expression";
import type { CellInstance, Diagnostic, Element, ElementKind, Network, ParseResult, Quantity } from "../types";
import { ELEMENT_KINDS, QUANTITIES } from "../types";
import { CellLineError, printCellLine, readCellLine } from "./cells";
import { diagnostic } from "./diagnostics";
import { renamedKind } from "./renamed";
import { NAME_PATTERN } from "./schema";

/** File extension of the Portfold netlist (ours: "Portfold network"). */
export const NETLIST_EXTENSION = ".pfn";

const DIRECTIVES: ReadonlySet<string> = new Set(["ground", "port", "quantity"]);

interface Token {
  text: string;
  column: number; // 1-based
}

class NetlistSyntaxError extends Error {
  constructor(
    message: string,
    readonly column: number,
  ) {
    super(message);
  }
}

/** Read a Portfold netlist. Every syntax problem is a parse-error diagnostic with line and column. */
export function parseNetlistText(text: string): ParseResult {
  const diagnostics: Diagnostic[] = [];
  const elements: Element[] = [];
  const cells: CellInstance[] = [];
  const positions: Record<string, { line: number; valueColumn: number | null }> = {};
  const quantities: Record<string, Quantity> = {};
  let ground: string | null = null;
  let port: { plus: string; minus: string } | null = null;
  const assumptions: string[] = [];

  const lines = text.split(/\r\n|\n|\r/);
  lines.forEach((rawLine, index) => {
    const line = index + 1;
    const hash = rawLine.indexOf("#");
    const content = hash >= 0 ? rawLine.slice(0, hash) : rawLine;
    if (content.trim() === "") return;
    // "assume gm*ro >> 1": the rest of the line is a design assumption, read by the approximations.
    const assumption = /^\s*assume(\s+|$)(.*)$/.exec(content);
    if (assumption) {
      const what = assumption[2].trim();
      const column = content.indexOf("assume") + 1;
      if (what === "") diagnostics.push(diagnostic("parse-error", `line ${line}, column ${column}: "assume" needs what is assumed, e.g. "assume gm*ro >> 1"`, { line, column }));
      else assumptions.push(what);
      return;
    }
    try {
      const eq = content.indexOf("=");
      const head = eq >= 0 ? content.slice(0, eq) : content;
      const tokens = tokenize(head);
      const first = tokens[0];
      if (!first) throw new NetlistSyntaxError('a line starts with its name, e.g. "Rload resistor out 0 = RL"', eq + 1);
      // A cell instance: "<name> cell <cell> <terminal>=<node> ..." (see cells.ts).
      if (tokens[1]?.text === "cell" && !DIRECTIVES.has(first.text)) {
        const instance = readCellLine(tokenize(content));
        if (positions[instance.name] === undefined) positions[instance.name] = { line, valueColumn: null };
        cells.push(instance);
        return;
      }
      if (DIRECTIVES.has(first.text)) {
        if (eq >= 0) throw new NetlistSyntaxError(`"${first.text}" takes no "=": write "${directiveUsage(first.text)}"`, eq + 1);
        if (first.text === "ground") {
          expectCount(tokens, 2, directiveUsage("ground"), content);
          if (ground !== null) throw new NetlistSyntaxError("the ground is already named on an earlier line", first.column);
          ground = expectName(tokens[1], "node");
        } else if (first.text === "port") {
          expectCount(tokens, 3, directiveUsage("port"), content);
          if (port !== null) throw new NetlistSyntaxError("a network has one port; it is already named on an earlier line", first.column);
          port = { plus: expectName(tokens[1], "node"), minus: expectName(tokens[2], "node") };
        } else {
          expectCount(tokens, 3, directiveUsage("quantity"), content);
          const symbol = expectName(tokens[1], "symbol");
          const q = tokens[2].text;
          if (!(QUANTITIES as readonly string[]).includes(q)) {
            throw new NetlistSyntaxError(`unknown quantity "${q}" (one of ${QUANTITIES.join(", ")})`, tokens[2].column);
          }
          quantities[symbol] = q as Quantity;
        }
        return;
      }
      const element = parseElementLine(tokens, content, eq);
      if (positions[element.element.name] === undefined) {
        positions[element.element.name] = { line, valueColumn: element.valueColumn };
      }
      elements.push(element.element);
    } catch (e) {
      if (!(e instanceof NetlistSyntaxError) && !(e instanceof CellLineError)) throw e;
      diagnostics.push(diagnostic("parse-error", `line ${line}, column ${e.column}: ${e.message}`, { line, column: e.column }));
    }
  });

  if (port === null && diagnostics.length === 0) {
    diagnostics.push(
      diagnostic("parse-error", `line ${lines.length}, column 1: the netlist names no port; add a line "port <plus> <minus>"`, {
        line: lines.length,
        column: 1,
      }),
    );
  }
  if (diagnostics.length > 0 || port === null) return { network: null, diagnostics, format: "text", positions };
  const network: Network = { ground: ground ?? "0", port, elements };
  if (Object.keys(quantities).length > 0) network.quantities = quantities;
  if (cells.length > 0) network.cells = cells;
  if (assumptions.length > 0) network.assumptions = assumptions;
  return { network, diagnostics, format: "text", positions };
}

function directiveUsage(word: string): string {
  if (word === "ground") return "ground <node>";
  if (word === "port") return "port <plus> <minus>";
  return "quantity <symbol> <quantity>";
}

function tokenize(head: string): Token[] {
  const tokens: Token[] = [];
  const re = /\S+/g;
  let m: RegExpExecArray | null;
  while ((m = re.exec(head)) !== null) tokens.push({ text: m[0], column: m.index + 1 });
  return tokens;
}

function expectCount(tokens: Token[], n: number, usage: string, content: string): void {
  if (tokens.length > n) throw new NetlistSyntaxError(`unexpected "${tokens[n].text}"; write "${usage}"`, tokens[n].column);
  if (tokens.length < n) throw new NetlistSyntaxError(`missing ${tokens.length === 1 ? "a name" : "a node"}; write "${usage}"`, content.trimEnd().length + 1);
}

function expectName(token: Token, what: string): string {
  if (!NAME_PATTERN.test(token.text)) {
    throw new NetlistSyntaxError(`"${token.text}" is not a valid ${what} name (letters, digits and underscore)`, token.column);
  }
  return token.text;
}

function parseElementLine(
  tokens: Token[],
  content: string,
  eq: number,
): { element: Element; valueColumn: number | null } {
  const name = expectName(tokens[0], "element");
  if (tokens.length < 2) throw new NetlistSyntaxError(`element "${name}" needs a kind (${ELEMENT_KINDS.join(", ")})`, content.trimEnd().length + 1);
  const kindToken = tokens[1];
  const renamed = renamedKind(kindToken.text);
  if (renamed) throw new NetlistSyntaxError(renamed, kindToken.column);
  if (!(ELEMENT_KINDS as readonly string[]).includes(kindToken.text)) {
    throw new NetlistSyntaxError(`unknown element kind "${kindToken.text}" (one of ${ELEMENT_KINDS.join(", ")})`, kindToken.column);
  }
  const kind = kindToken.text as ElementKind;

  if (kind === "opamp") {
    const usage = `${name} opamp <non-inverting> <inverting> -> <output>`;
    if (eq >= 0) throw new NetlistSyntaxError(`an op-amp has no value; write "${usage}"`, eq + 1);
    if (tokens.length !== 6 || tokens[4].text !== "->") {
      const bad = tokens.length > 6 ? tokens[6] : tokens.find((t, i) => i === 4 && t.text !== "->");
      throw new NetlistSyntaxError(`write "${usage}"`, bad ? bad.column : content.trimEnd().length + 1);
    }
    return {
      element: { name, kind, inputs: [expectName(tokens[2], "node"), expectName(tokens[3], "node")], output: expectName(tokens[5], "node") },
      valueColumn: null,
    };
  }

  const usage =
    kind === "voltage" || kind === "current"
      ? `${name} ${kind} <node> <node> = <value>, e.g. = A * across(in, out) or = rm * through(Rsense)`
      : `${name} ${kind} <node> <node> = <value>`;
  if (tokens.length > 4) throw new NetlistSyntaxError(`unexpected "${tokens[4].text}"; write "${usage}"`, tokens[4].column);
  if (tokens.length < 4) throw new NetlistSyntaxError(`${kind} "${name}" needs two nodes; write "${usage}"`, eq >= 0 ? eq + 1 : content.trimEnd().length + 1);
  const nodes: [string, string] = [expectName(tokens[2], "node"), expectName(tokens[3], "node")];
  if (eq < 0) throw new NetlistSyntaxError(`missing "= <value>"; write "${usage}"`, content.trimEnd().length + 1);

  const valueRaw = content.slice(eq + 1);
  const lead = valueRaw.length - valueRaw.trimStart().length;
  const valueText = valueRaw.trim();
  const valueColumn = eq + 2 + lead;
  if (valueText === "") throw new NetlistSyntaxError(`missing value after "="; write "${usage}"`, eq + 2);
  if (kind !== "voltage" && kind !== "current") {
    const named = namedControl(valueText);
    if (named) throw new NetlistSyntaxError(`${named.word}(...) belongs in the value of a voltage or current source, not a ${kind}`, valueColumn + named.column - 1);
  }
  return { element: { name, kind, nodes, value: valueText }, valueColumn };
}

// The first control a value names; a value that does not scan is reported when values are read.
function namedControl(value: string): { word: string; column: number } | null {
  try {
    return controlsIn(value)[0] ?? null;
  } catch (e) {
    if (e instanceof ValueSyntaxError) return null;
    throw e;
  }
}

/** Print a network as a Portfold netlist; parseNetlistText(printNetlistText(n)) gives n back. */
export function printNetlistText(network: Network, title?: string): string {
  const lines: string[] = [];
  if (title) for (const t of title.split("\n")) lines.push(`# ${t}`);
  lines.push(`ground ${network.ground}`);
  lines.push(`port ${network.port.plus} ${network.port.minus}`);
  for (const [symbol, q] of Object.entries(network.quantities ?? {})) lines.push(`quantity ${symbol} ${q}`);
  for (const e of network.elements) lines.push(printElementLine(e));
  for (const c of network.cells ?? []) lines.push(printCellLine(c));
  for (const a of network.assumptions ?? []) lines.push(`assume ${a}`);
  return lines.join("\n") + "\n";
}

export function printElementLine(e: Element): string {
  if (e.kind === "opamp") return `${e.name} opamp ${e.inputs[0]} ${e.inputs[1]} -> ${e.output}`;
  return `${e.name} ${e.kind} ${e.nodes[0]} ${e.nodes[1]} = ${e.value}`;
}
