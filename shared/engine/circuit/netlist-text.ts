// The Portfold netlist: a line-oriented text form of a network, read and printed.
//
//   # comment (anywhere on a line)
//   ground 0
//   port out 0
//   quantity mu dimensionless
//   Vin vsource in 0 = Vs
//   Ro resistor x out = R0
//   A1 vcvs x 0 = mu * across(in, out)
//   B1 cccs a b = beta * through(Ro)
//   U1 opamp p n -> o          (non-inverting input, inverting input, -> output)
//   assume gm*ro >> 1          (a design assumption: each result also with its dominant terms)
//
// The kind is always the word in the second column; element names are free.

import type {
  CellInstance,
  Control,
  ControlledSourceKind,
  Diagnostic,
  Element,
  ElementKind,
  Network,
  ParseResult,
  Quantity,
} from "../types";
import { ELEMENT_KINDS, QUANTITIES } from "../types";
import { CellLineError, printCellLine, readCellLine } from "./cells";
import { diagnostic } from "./diagnostics";
import { NAME_PATTERN } from "./schema";

/** File extension of the Portfold netlist (ours: "Portfold network"). */
export const NETLIST_EXTENSION = ".pfn";

const CONTROLLED: ReadonlySet<string> = new Set(["vcvs", "vccs", "ccvs", "cccs"]);
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

  const usage = CONTROLLED.has(kind)
    ? `${name} ${kind} <node> <node> = <gain> * ${kind === "vcvs" || kind === "vccs" ? "across(<node>, <node>)" : "through(<element>)"}`
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

  if (!CONTROLLED.has(kind)) {
    const call = findControlCall(valueText);
    if (call) {
      throw new NetlistSyntaxError(`${call.word}(...) belongs in a vcvs, vccs, ccvs or cccs value, not a ${kind}`, valueColumn + call.start);
    }
    return {
      element: { name, kind: kind as "resistor", nodes, value: valueText },
      valueColumn,
    };
  }
  const { control, gain, gainOffset } = splitControlledValue(valueText, valueColumn, usage);
  return {
    element: { name, kind: kind as ControlledSourceKind, nodes, control, value: gain },
    valueColumn: valueColumn + gainOffset,
  };
}

interface ControlCall {
  word: "across" | "through";
  start: number; // offset of the word in the value
  end: number; // offset just past ")"
  args: { text: string; offset: number }[];
}

function findControlCall(value: string): ControlCall | null {
  const calls = findControlCalls(value);
  return calls.length > 0 ? calls[0] : null;
}

function findControlCalls(value: string): ControlCall[] {
  const calls: ControlCall[] = [];
  const re = /(?<![\p{L}\p{N}_])(across|through)\s*\(/gu;
  let m: RegExpExecArray | null;
  while ((m = re.exec(value)) !== null) {
    const open = m.index + m[0].length - 1;
    const close = value.indexOf(")", open);
    if (close < 0) throw new NetlistSyntaxError(`"${m[1]}(" is not closed`, 0 + m.index + 1);
    const inner = value.slice(open + 1, close);
    const args: { text: string; offset: number }[] = [];
    let offset = open + 1;
    for (const part of inner.split(",")) {
      const lead = part.length - part.trimStart().length;
      args.push({ text: part.trim(), offset: offset + lead });
      offset += part.length + 1;
    }
    calls.push({ word: m[1] as "across" | "through", start: m.index, end: close + 1, args });
    re.lastIndex = close + 1;
  }
  return calls;
}

// The value of a dependent source is gain × control; the control is written once, as a factor.
function splitControlledValue(
  value: string,
  valueColumn: number,
  usage: string,
): { control: Control; gain: string; gainOffset: number } {
  let calls: ControlCall[];
  try {
    calls = findControlCalls(value);
  } catch (e) {
    if (e instanceof NetlistSyntaxError) throw new NetlistSyntaxError(e.message, valueColumn + e.column - 1);
    throw e;
  }
  if (calls.length === 0) throw new NetlistSyntaxError(`a dependent source names its control; write "${usage}"`, valueColumn);
  if (calls.length > 1) throw new NetlistSyntaxError("a dependent source has exactly one control", valueColumn + calls[1].start);
  const call = calls[0];
  const at = (offset: number) => valueColumn + offset;

  let control: Control;
  if (call.word === "across") {
    if (call.args.length !== 2) throw new NetlistSyntaxError("across(...) takes two nodes: across(<node>, <node>)", at(call.start));
    for (const a of call.args) {
      if (!NAME_PATTERN.test(a.text)) throw new NetlistSyntaxError(`"${a.text}" is not a valid node name`, at(a.offset));
    }
    control = { nodes: [call.args[0].text, call.args[1].text] };
  } else {
    if (call.args.length !== 1) throw new NetlistSyntaxError("through(...) takes one element: through(<element>)", at(call.start));
    const a = call.args[0];
    if (!NAME_PATTERN.test(a.text)) throw new NetlistSyntaxError(`"${a.text}" is not a valid element name`, at(a.offset));
    control = { element: a.text };
  }

  const prefix = value.slice(0, call.start);
  const suffix = value.slice(call.end);
  const p = prefix.trim();
  const s = suffix.trim();
  const suffixOffset = call.end + (suffix.length - suffix.trimStart().length);
  if (p === "" && s === "") return { control, gain: "1", gainOffset: call.start };
  if (p === "-" && s === "") return { control, gain: "-1", gainOffset: 0 };
  if (p.endsWith("*") && s === "") {
    const gain = p.slice(0, -1).trim();
    if (gain === "") throw new NetlistSyntaxError("missing gain before \"*\"", valueColumn);
    if (hasTopLevelSum(gain)) {
      throw new NetlistSyntaxError(`the gain is a sum; put it in parentheses: (${gain}) * ${call.word}(...)`, valueColumn);
    }
    return { control, gain: stripOuterParentheses(gain), gainOffset: 0 };
  }
  if (p === "" && (s.startsWith("*") || s.startsWith("/"))) {
    const rest = s.slice(1).trim();
    const restOffset = suffixOffset + 1 + (s.slice(1).length - s.slice(1).trimStart().length);
    if (rest === "") throw new NetlistSyntaxError(`missing gain after "${s[0]}"`, at(suffixOffset));
    if (hasTopLevelSum(rest)) {
      throw new NetlistSyntaxError(`the gain is a sum; put it in parentheses: ${call.word}(...) ${s[0]} (${rest})`, at(restOffset));
    }
    const gain = s[0] === "*" ? stripOuterParentheses(rest) : `1/(${stripOuterParentheses(rest)})`;
    return { control, gain, gainOffset: restOffset };
  }
  throw new NetlistSyntaxError(`write the value as a gain times the control: "${usage.split("= ")[1]}"`, valueColumn);
}

// A binary + or - outside parentheses means the control would not be a common factor.
function hasTopLevelSum(expr: string): boolean {
  const tokens = expr.match(/\d+(?:\.\d*)?(?:[eE][+-]?\d+)?[TGMkmuµnpf]?|\.\d+(?:[eE][+-]?\d+)?[TGMkmuµnpf]?|[\p{L}_][\p{L}\p{N}_]*|\S/gu) ?? [];
  let depth = 0;
  let prev: string | null = null;
  for (const t of tokens) {
    if (t === "(") depth++;
    else if (t === ")") depth--;
    else if ((t === "+" || t === "-") && depth === 0 && prev !== null && !"*/^(+-".includes(prev)) return true;
    prev = t;
  }
  return false;
}

function stripOuterParentheses(expr: string): string {
  let e = expr.trim();
  while (e.startsWith("(") && e.endsWith(")") && matchingClose(e, 0) === e.length - 1) e = e.slice(1, -1).trim();
  return e;
}

function matchingClose(e: string, open: number): number {
  let depth = 0;
  for (let i = open; i < e.length; i++) {
    if (e[i] === "(") depth++;
    else if (e[i] === ")") {
      depth--;
      if (depth === 0) return i;
    }
  }
  return -1;
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
  const head = `${e.name} ${e.kind} ${e.nodes[0]} ${e.nodes[1]} = `;
  if (!("control" in e)) return head + e.value;
  const control = "element" in e.control ? `through(${e.control.element})` : `across(${e.control.nodes[0]}, ${e.control.nodes[1]})`;
  const gain = e.value.trim();
  if (gain === "1") return head + control;
  return head + (hasTopLevelSum(gain) ? `(${gain})` : gain) + " * " + control;
}
