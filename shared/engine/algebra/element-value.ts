// User-typed element values, read by nerdamer's parser (tokenize, precedence, parse tree) and
// built exactly with our own Poly / RationalFunction. Our grammar checks the text first so
// every error keeps its column; nerdamer never evaluates anything (no simplify, expand,
// matrix or limit), and numbers reach it as integer literals, so nothing becomes a float.

import nerdamer from "nerdamer";
import { Rational } from "./rational";
import { RationalFunction } from "./rational-function";
import { monomialReading, readCheckedExpression, readWith, type BinaryOp, type ControlWord, type Reading, type SignOp } from "./expression";

/** A node of nerdamer's parse tree (nerdamer.tree): operators carry left/right, leaves a literal or name. */
interface NerdamerNode {
  type: string;
  value: string;
  left?: NerdamerNode;
  right?: NerdamerNode;
}

/** One token of the text handed to nerdamer, in order, with the column it came from. */
type Item =
  | { kind: "leaf"; text: string; value: Rational | null; column: number; control?: { word: ControlWord; args: string[] } }
  | { kind: "binary"; op: BinaryOp; column: number }
  | { kind: "sign"; op: SignOp; column: number }
  | { kind: "power"; caretColumn: number; exponentColumn: number };

interface Spelled {
  text: string;
  items: Item[];
}

// Numbers become integer literals or (p/q); each sign's operand is bracketed because nerdamer
// gives a prefix sign a different reach (it reads x^-y*z as x^(-(y*z))).
const spelling: Reading<Spelled> = {
  number(value, column) {
    const num: Item = { kind: "leaf", text: value.num.toString(), value: Rational.of(value.num), column };
    if (value.den === 1n) return { text: num.text, items: [num] };
    const den: Item = { kind: "leaf", text: value.den.toString(), value: Rational.of(value.den), column };
    return { text: `(${num.text}/${den.text})`, items: [num, { kind: "binary", op: "/", column }, den] };
  },
  name: (name, column) => ({ text: name, items: [{ kind: "leaf", text: name, value: null, column }] }),
  // nerdamer sees a plain name in a control's place; the walk below puts the control back by position.
  control: (word, args, column) => ({ text: "pfcontrol", items: [{ kind: "leaf", text: "pfcontrol", value: null, column, control: { word, args } }] }),
  group: (inner) => ({ text: `(${inner.text})`, items: inner.items }),
  // Each reading is consumed once, so the left one's items grow in place: long sums stay linear.
  binary: (op, left, right, column) => ({ text: `${left.text}${op}${right.text}`, items: append(append(left.items, [{ kind: "binary", op, column }]), right.items) }),
  sign: (op, operand, column) => ({ text: `(${op}(${operand.text}))`, items: [{ kind: "sign", op, column }, ...operand.items] }),
  power: (base, exponent, caretColumn, exponentColumn) => ({
    text: `${base.text}^${exponent.text}`,
    items: [...base.items, { kind: "power", caretColumn, exponentColumn }, ...exponent.items],
  }),
};

function append(to: Item[], more: readonly Item[]): Item[] {
  for (const item of more) to.push(item);
  return to;
}

// Looked up per call, not captured, so a test can watch that values go through it.
const nerdamerTree = (text: string): NerdamerNode => (nerdamer as unknown as { tree(expression: string): NerdamerNode }).tree(text);

class TreeMismatch extends Error {
  constructor(text: string, detail: string) {
    super(`nerdamer read "${text}" differently from the value grammar (${detail})`);
    this.name = "TreeMismatch";
  }
}

/**
 * Walk nerdamer's tree in order: any parse tree of an infix text lists its tokens in text order,
 * so each node must meet the next item we handed over; this both finds each operator's column
 * and checks that nerdamer read exactly our tokens.
 */
function buildFromTree<T>(root: NerdamerNode, spelled: Spelled, reading: Reading<T> & Required<Pick<Reading<T>, "sum">>): T {
  let next = 0;
  const take = (node: NerdamerNode): Item => {
    const item = spelled.items[next++];
    if (!item) throw new TreeMismatch(spelled.text, `extra "${node.value}"`);
    return item;
  };
  const walk = (node: NerdamerNode): T => {
    // A name that is also an Object.prototype key (toString, constructor) is typed UNIT by nerdamer's tokenizer; still a leaf.
    if ((node.type === "VARIABLE_OR_LITERAL" || node.type === "UNIT") && !node.left && !node.right) {
      const item = take(node);
      if (item.kind !== "leaf" || item.text !== node.value) throw new TreeMismatch(spelled.text, `"${node.value}" where our text has another token`);
      if (item.control) return reading.control(item.control.word, item.control.args, item.column);
      return item.value ? reading.number(item.value, item.column) : reading.name(item.text, item.column);
    }
    if (node.type !== "OPERATOR") throw new TreeMismatch(spelled.text, `a ${node.type} node`);
    if (node.left && !node.right) {
      const item = take(node);
      if (item.kind !== "sign" || item.op !== node.value) throw new TreeMismatch(spelled.text, `prefix "${node.value}"`);
      return reading.sign(item.op, walk(node.left), item.column);
    }
    if (!node.left || !node.right) throw new TreeMismatch(spelled.text, `postfix "${node.value}"`);
    if (isSum(node)) return walkSum(node);
    const left = walk(node.left);
    const item = take(node);
    if (item.kind === "power" && node.value === "^") return reading.power(left, walk(node.right), item.caretColumn, item.exponentColumn);
    if (item.kind === "binary" && item.op === node.value) return reading.binary(item.op, left, walk(node.right), item.column);
    throw new TreeMismatch(spelled.text, `operator "${node.value}"`);
  };
  const isSum = (node: NerdamerNode) => node.type === "OPERATOR" && !!node.left && !!node.right && (node.value === "+" || node.value === "-");
  // A long sum is a deep left spine: walked in a loop and handed to the reading's sum at once
  // (no deep recursion, and no polynomial addition per term).
  const walkSum = (top: NerdamerNode): T => {
    const spine: NerdamerNode[] = [];
    let node = top;
    for (; isSum(node); node = node.left!) spine.push(node);
    const first = walk(node);
    const rest: { op: SignOp; value: T }[] = [];
    for (let i = spine.length - 1; i >= 0; i--) {
      const item = take(spine[i]);
      if (item.kind !== "binary" || item.op !== spine[i].value) throw new TreeMismatch(spelled.text, `operator "${spine[i].value}"`);
      rest.push({ op: item.op as SignOp, value: walk(spine[i].right!) });
    }
    return reading.sum(first, rest);
  };
  const value = walk(root);
  if (next !== spelled.items.length) throw new TreeMismatch(spelled.text, "tokens left over");
  return value;
}

/**
 * Texts longer than this (a pasted result, not a typed value: about 150 terms) are read by our
 * grammar alone, syntax checked before meaning as here. nerdamer's tokenizer and tree grow to
 * about 0.2 s at 600,000 characters, past what a long value may cost to read.
 */
export const NERDAMER_TEXT_LIMIT = 10_000;

/**
 * Parse an element value such as "R0", "10k", "4.7u", "gm*R0/(1 + gm*Rs)", "2^-3", exactly, through
 * nerdamer's parser. A control (across(a, b), through(x)) becomes its control symbol (controlSymbol).
 */
export function parseValue(text: string): RationalFunction {
  if (text.length > NERDAMER_TEXT_LIMIT) return readCheckedExpression(text);
  const spelled = readWith(text, spelling);
  const { reading, finish } = monomialReading(text);
  return finish(buildFromTree(nerdamerTree(spelled.text), spelled, reading));
}
