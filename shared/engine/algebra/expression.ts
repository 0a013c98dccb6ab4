// Value expressions: identifiers, exact decimal numbers with an optional SI prefix written
// right after the digits, + - * / ^ (integer exponents), parentheses, unary minus, and the two
// controls a source value may name: across(<node>, <node>) and through(<element>).
// One recursive-descent grammar, so every syntax error carries its column; what it builds is
// a Reading: exact Poly / RationalFunction values here (readExpression, for the engine's own
// printed results), or text for nerdamer's parser (parseValue in element-value.ts).

import { Rational } from "./rational";
import { Poly } from "./polynomial";
import { RationalFunction } from "./rational-function";

export class ValueSyntaxError extends Error {
  /** 1-based column within the text. */
  readonly column: number;
  readonly text: string;
  constructor(message: string, column: number, text: string) {
    super(`${message} (column ${column})`);
    this.name = "ValueSyntaxError";
    this.column = column;
    this.text = text;
  }
}

/** SI prefixes, SI Brochure (BIPM, 9th edition, 2019), case-sensitive; u and the micro sign both mean 10^-6. */
export const SI_PREFIX_EXPONENT: Readonly<Record<string, number>> = {
  T: 12, G: 9, M: 6, k: 3, m: -3, u: -6, "\u00b5": -6, "\u03bc": -6, n: -9, p: -12, f: -15,
};

const MAX_EXPONENT_MAGNITUDE = 1000;

/** A control named in a source value: the voltage across two nodes, or the current through an element. */
export type ControlWord = "across" | "through";

/** Node and element names inside a control: letters, digits and underscore (as everywhere in a network). */
const CONTROL_ARGUMENT = /^[\p{L}\p{N}_]+$/u;

const CONTROL_ARITY: Record<ControlWord, { count: number; usage: string }> = {
  across: { count: 2, usage: "across(<node>, <node>)" },
  through: { count: 1, usage: "through(<element>)" },
};

type Token =
  | { kind: "number"; value: Rational; column: number; text: string }
  | { kind: "control"; word: ControlWord; args: string[]; column: number }
  | { kind: "ident"; name: string; column: number }
  | { kind: "op"; op: "+" | "-" | "*" | "/" | "^" | "(" | ")"; column: number }
  | { kind: "end"; column: number };

// Character-code tests, not a regular expression per character: texts run to hundreds of thousands of characters.
const isIdentStart = (c: string) => {
  const k = c.charCodeAt(0);
  return (k >= 65 && k <= 90) || (k >= 97 && k <= 122) || k === 95;
};
const isIdentChar = (c: string) => isIdentStart(c) || (c >= "0" && c <= "9");
const isDigit = (c: string) => c >= "0" && c <= "9";

function prefixFactor(prefix: string): Rational {
  const e = SI_PREFIX_EXPONENT[prefix];
  return e >= 0 ? Rational.of(10n ** BigInt(e)) : Rational.of(1n, 10n ** BigInt(-e));
}

/** Scan a number with optional exponent at i; returns its end, or -1 when there is none. */
function scanDecimal(text: string, i: number): number {
  let j = i;
  while (j < text.length && isDigit(text[j])) j++;
  let digits = j - i;
  if (text[j] === ".") {
    j++;
    const f = j;
    while (j < text.length && isDigit(text[j])) j++;
    digits += j - f;
  }
  if (digits === 0) return -1;
  if (text[j] === "e" || text[j] === "E") {
    let k = j + 1;
    if (text[k] === "+" || text[k] === "-") k++;
    if (isDigit(text[k] ?? "")) {
      while (k < text.length && isDigit(text[k])) k++;
      j = k;
    }
  }
  return j;
}

function tokenize(text: string): Token[] {
  const tokens: Token[] = [];
  let i = 0;
  while (i < text.length) {
    const c = text[i];
    const column = i + 1;
    if (c === " " || c === "\t") {
      i++;
      continue;
    }
    if (isDigit(c) || (c === "." && isDigit(text[i + 1] ?? ""))) {
      const end = scanDecimal(text, i);
      let value = Rational.parseDecimal(text.slice(i, end));
      let j = end;
      const next = text[j] ?? "";
      if (next in SI_PREFIX_EXPONENT && !isIdentChar(text[j + 1] ?? "")) {
        value = value.mul(prefixFactor(next));
        j++;
      } else if (isIdentChar(next) || next === ".") {
        throw new ValueSyntaxError(`unexpected "${next}" after the number ${text.slice(i, end)}; write a * between a number and a name`, j + 1, text);
      }
      tokens.push({ kind: "number", value, column, text: text.slice(i, j) });
      i = j;
      continue;
    }
    if (isIdentStart(c)) {
      let j = i + 1;
      while (j < text.length && isIdentChar(text[j])) j++;
      const name = text.slice(i, j);
      let k = j;
      while (text[k] === " " || text[k] === "\t") k++;
      if ((name === "across" || name === "through") && text[k] === "(") {
        const control = scanControl(text, name, column, k);
        tokens.push(control.token);
        i = control.end;
        continue;
      }
      tokens.push({ kind: "ident", name, column });
      i = j;
      continue;
    }
    if ("+-*/^()".includes(c)) {
      tokens.push({ kind: "op", op: c as "+", column });
      i++;
      continue;
    }
    throw new ValueSyntaxError(`unexpected character "${c}"`, column, text);
  }
  tokens.push({ kind: "end", column: text.length + 1 });
  return tokens;
}

/** across(a, b) / through(x) starting at column, its "(" at open; names are checked here so every error has its column. */
function scanControl(text: string, word: ControlWord, column: number, open: number): { token: Token; end: number } {
  const close = text.indexOf(")", open);
  if (close < 0) throw new ValueSyntaxError(`"${word}(" is not closed; write ${CONTROL_ARITY[word].usage}`, column, text);
  const args: string[] = [];
  let offset = open + 1;
  for (const part of text.slice(open + 1, close).split(",")) {
    const lead = part.length - part.trimStart().length;
    const arg = part.trim();
    const what = word === "across" ? "node" : "element";
    if (!CONTROL_ARGUMENT.test(arg)) {
      const shown = arg === "" ? `an empty ${what} name` : `"${arg}" is not a valid ${what} name (letters, digits and underscore)`;
      throw new ValueSyntaxError(`${shown} in ${word}(...)`, offset + lead + 1, text);
    }
    args.push(arg);
    offset += part.length + 1;
  }
  const { count, usage } = CONTROL_ARITY[word];
  if (args.length !== count) throw new ValueSyntaxError(`${word}(...) takes ${count === 1 ? "one element" : "two nodes"}: ${usage}`, column, text);
  return { token: { kind: "control", word, args, column }, end: close + 1 };
}

export type BinaryOp = "+" | "-" | "*" | "/";
export type SignOp = "+" | "-";

/** What the grammar builds at each production; columns are 1-based, for the error messages. */
export interface Reading<T> {
  number(value: Rational, column: number): T;
  name(name: string, column: number): T;
  /** across(a, b) or through(x); the arguments are already checked names. */
  control(word: ControlWord, args: string[], column: number): T;
  group(inner: T): T;
  binary(op: BinaryOp, left: T, right: T, column: number): T;
  sign(op: SignOp, operand: T, column: number): T;
  power(base: T, exponent: T, caretColumn: number, exponentColumn: number): T;
  /** A whole sum t0 op1 t1 op2 t2 ... at once (optional; otherwise binary folds from the left). */
  sum?(first: T, rest: ReadonlyArray<{ op: SignOp; value: T }>): T;
}

/** Add many terms pairwise: n log n term operations for a long sum where a left fold costs n^2. */
export function sumPairwise(terms: RationalFunction[]): RationalFunction {
  for (let width = 1; width < terms.length; width *= 2)
    for (let i = 0; i + width < terms.length; i += 2 * width) terms[i] = terms[i].add(terms[i + width]);
  return terms[0];
}

/** The exact meaning of each production; the nerdamer path applies the same one, so both readers agree. */
export function exactReading(text: string): Reading<RationalFunction> {
  const fail = (message: string, column: number): never => {
    throw new ValueSyntaxError(message, column, text);
  };
  return {
    number: (value) => RationalFunction.constant(value),
    name: (name) => RationalFunction.fromPoly(Poly.variable(name)),
    control: (word, args) => RationalFunction.variable(controlSymbol(word, args)),
    group: (inner) => inner,
    binary(op, left, right, column) {
      if (op === "+") return left.add(right);
      if (op === "-") return left.sub(right);
      if (op === "*") return left.mul(right);
      if (right.isZero()) fail("division by zero", column);
      return left.div(right);
    },
    sign: (op, operand) => (op === "-" ? operand.neg() : operand),
    sum: (first, rest) => sumPairwise([first, ...rest.map((t) => (t.op === "-" ? t.value.neg() : t.value))]),
    power(base, exponent, caretColumn, exponentColumn) {
      const e = exponent.constantValue();
      if (e === null || !e.isInteger()) fail("an exponent must be an integer constant", exponentColumn);
      const n = Number(e!.num);
      if (Math.abs(n) > MAX_EXPONENT_MAGNITUDE) fail(`exponent beyond ±${MAX_EXPONENT_MAGNITUDE}`, exponentColumn);
      if (n < 0 && base.isZero()) fail("division by zero", caretColumn);
      return base.pow(n);
    },
  };
}

/**
 * The symbol a control stands for while a value is read: "$across(a,b)" or "$through(x)". It
 * starts with "$", which no user symbol can contain, and the source stamp splits it out again.
 */
export function controlSymbol(word: ControlWord, args: readonly string[]): string {
  return `$${word}(${args.join(",")})`;
}

/** The control a control symbol stands for, or null for any other symbol. */
export function controlOfSymbol(symbol: string): { word: ControlWord; args: string[] } | null {
  const m = /^\$(across|through)\((.*)\)$/.exec(symbol);
  return m ? { word: m[1] as ControlWord, args: m[2].split(",") } : null;
}

/** A value read with its controls as symbols, printed back as value text: "$across(a,b)" becomes "across(a,b)". */
export function printValue(f: RationalFunction): string {
  return f.toInfix().replace(/\$(across|through)\(/g, "$1(");
}

class Parser<T> {
  private pos = 0;
  constructor(private readonly tokens: Token[], private readonly text: string, private readonly reading: Reading<T>) {}

  private peek(): Token {
    return this.tokens[this.pos];
  }

  private isOp(op: string): boolean {
    const t = this.peek();
    return t.kind === "op" && t.op === op;
  }

  private fail(message: string, column: number): never {
    throw new ValueSyntaxError(message, column, this.text);
  }

  parse(): T {
    if (this.peek().kind === "end") this.fail("empty value", 1);
    const value = this.expression();
    const t = this.peek();
    if (t.kind !== "end") {
      this.fail(t.kind === "op" && t.op === ")" ? "unmatched )" : "expected an operator", t.column);
    }
    return value;
  }

  private expression(): T {
    let value = this.term();
    const sum = this.reading.sum;
    const rest: Array<{ op: SignOp; value: T }> = [];
    while (this.isOp("+") || this.isOp("-")) {
      const t = this.tokens[this.pos++] as { op: SignOp; column: number };
      if (sum) rest.push({ op: t.op, value: this.term() });
      else value = this.reading.binary(t.op, value, this.term(), t.column);
    }
    return sum && rest.length > 0 ? sum(value, rest) : value;
  }

  private term(): T {
    let value = this.unary();
    while (this.isOp("*") || this.isOp("/")) {
      const t = this.tokens[this.pos++] as { op: BinaryOp; column: number };
      value = this.reading.binary(t.op, value, this.unary(), t.column);
    }
    return value;
  }

  private unary(): T {
    if (this.isOp("-") || this.isOp("+")) {
      const t = this.tokens[this.pos++] as { op: SignOp; column: number };
      return this.reading.sign(t.op, this.unary(), t.column);
    }
    return this.power();
  }

  private power(): T {
    const base = this.primary();
    if (!this.isOp("^")) return base;
    const caret = this.tokens[this.pos++];
    const exponentColumn = this.peek().column;
    return this.reading.power(base, this.unary(), caret.column, exponentColumn);
  }

  private primary(): T {
    const t = this.peek();
    if (t.kind === "number") {
      this.pos++;
      return this.reading.number(t.value, t.column);
    }
    if (t.kind === "ident") {
      this.pos++;
      if (this.isOp("(")) this.fail(`"${t.name}(" is not a value: functions are not part of value expressions (a source may name across(<node>, <node>) or through(<element>))`, this.peek().column);
      return this.reading.name(t.name, t.column);
    }
    if (t.kind === "control") {
      this.pos++;
      return this.reading.control(t.word, t.args, t.column);
    }
    if (t.kind === "op" && t.op === "(") {
      this.pos++;
      const inner = this.expression();
      if (!this.isOp(")")) this.fail("expected )", this.peek().column);
      this.pos++;
      return this.reading.group(inner);
    }
    if (t.kind === "end") this.fail("unexpected end of the value", t.column);
    this.fail(`unexpected "${(t as { op: string }).op}"`, t.column);
  }
}

/** Every control a value names, in text order, without reading the rest of it (a structural look). */
export function controlsIn(text: string): { word: ControlWord; args: string[]; column: number }[] {
  return tokenize(text).flatMap((t) => (t.kind === "control" ? [{ word: t.word, args: t.args, column: t.column }] : []));
}

/** Check text against the value grammar (columns in every error) and build it with reading. */
export function readWith<T>(text: string, reading: Reading<T>): T {
  return new Parser(tokenize(text), text, reading).parse();
}

/**
 * Our own reader, for text the engine printed itself (toInfix of results, up to tens of
 * thousands of terms), where nerdamer would be slow. Same grammar and the same exact value as
 * parseValue on every input both accept; user-typed element values go through parseValue.
 */
export function readExpression(text: string): RationalFunction {
  return readWith(text, exactReading(text));
}

/** A plain number with optional SI prefix (a space before the prefix is allowed): "4.7k" -> 4700 exactly. */
export function parseSI(text: string): Rational {
  let i = 0;
  while (text[i] === " " || text[i] === "\t") i++;
  const start = i;
  if (text[i] === "+" || text[i] === "-") i++;
  const end = scanDecimal(text, i);
  if (end < 0) throw new ValueSyntaxError("expected a number", i + 1, text);
  let value = Rational.parseDecimal(text.slice(start, end));
  let j = end;
  while (text[j] === " ") j++;
  const c = text[j];
  if (c !== undefined && c in SI_PREFIX_EXPONENT) {
    value = value.mul(prefixFactor(c));
    j++;
  }
  while (text[j] === " " || text[j] === "\t") j++;
  if (j < text.length) throw new ValueSyntaxError(`unexpected "${text[j]}" in a number`, j + 1, text);
  return value;
}

const FORMAT_PREFIXES: Record<number, string> = { 4: "T", 3: "G", 2: "M", 1: "k", 0: "", [-1]: "m", [-2]: "\u00b5", [-3]: "n", [-4]: "p", [-5]: "f" };

/** Engineering notation with an SI prefix and 4 significant digits: 4700 -> "4.7 k"; 1.2e-5 with "A" -> "12 µA". */
export function formatSI(x: number, unit = ""): string {
  const withUnit = (s: string, prefix: string) => (prefix || unit ? `${s} ${prefix}${unit}` : s);
  if (!Number.isFinite(x)) return withUnit(Number.isNaN(x) ? "NaN" : x > 0 ? "∞" : "-∞", "");
  if (x === 0) return withUnit("0", "");
  let e3 = Math.floor(Math.log10(Math.abs(x)) / 3);
  let mant = Number((x / 10 ** (3 * e3)).toPrecision(4));
  if (Math.abs(mant) >= 1000) {
    e3++;
    mant = Number((x / 10 ** (3 * e3)).toPrecision(4));
  } else if (Math.abs(mant) < 1) {
    e3--;
    mant = Number((x / 10 ** (3 * e3)).toPrecision(4));
  }
  if (e3 > 4 || e3 < -5) {
    const [m, e] = x.toExponential(3).split("e");
    return withUnit(`${Number(m)}e${Number(e)}`, "");
  }
  return withUnit(String(mant), FORMAT_PREFIXES[e3]);
}
