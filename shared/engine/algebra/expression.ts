// Element value expressions: identifiers, exact decimal numbers with an optional SI prefix
// written right after the digits, + - * / ^ (integer exponents), parentheses, unary minus.
// Parsed by our own recursive-descent parser so every error carries its column; the value
// is built exactly with Poly / RationalFunction.

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

type Token =
  | { kind: "number"; value: Rational; column: number; text: string }
  | { kind: "ident"; name: string; column: number }
  | { kind: "op"; op: "+" | "-" | "*" | "/" | "^" | "(" | ")"; column: number }
  | { kind: "end"; column: number };

const isIdentStart = (c: string) => /[A-Za-z_]/.test(c);
const isIdentChar = (c: string) => /[A-Za-z0-9_]/.test(c);
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
      tokens.push({ kind: "ident", name: text.slice(i, j), column });
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

class Parser {
  private pos = 0;
  constructor(private readonly tokens: Token[], private readonly text: string) {}

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

  parse(): RationalFunction {
    if (this.peek().kind === "end") this.fail("empty value", 1);
    const value = this.expression();
    const t = this.peek();
    if (t.kind !== "end") {
      this.fail(t.kind === "op" && t.op === ")" ? "unmatched )" : "expected an operator", t.column);
    }
    return value;
  }

  private expression(): RationalFunction {
    let value = this.term();
    while (this.isOp("+") || this.isOp("-")) {
      const op = (this.tokens[this.pos++] as { op: string }).op;
      const rhs = this.term();
      value = op === "+" ? value.add(rhs) : value.sub(rhs);
    }
    return value;
  }

  private term(): RationalFunction {
    let value = this.unary();
    while (this.isOp("*") || this.isOp("/")) {
      const t = this.tokens[this.pos++] as { op: string; column: number };
      const rhs = this.unary();
      if (t.op === "*") value = value.mul(rhs);
      else {
        if (rhs.isZero()) this.fail("division by zero", t.column);
        value = value.div(rhs);
      }
    }
    return value;
  }

  private unary(): RationalFunction {
    if (this.isOp("-")) {
      this.pos++;
      return this.unary().neg();
    }
    if (this.isOp("+")) {
      this.pos++;
      return this.unary();
    }
    return this.power();
  }

  private power(): RationalFunction {
    const base = this.primary();
    if (!this.isOp("^")) return base;
    const caret = this.tokens[this.pos++];
    const expColumn = this.peek().column;
    const exponent = this.unary().constantValue();
    if (exponent === null || !exponent.isInteger()) this.fail("an exponent must be an integer constant", expColumn);
    const n = Number(exponent.num);
    if (Math.abs(n) > MAX_EXPONENT_MAGNITUDE) this.fail(`exponent beyond ±${MAX_EXPONENT_MAGNITUDE}`, expColumn);
    if (n < 0 && base.isZero()) this.fail("division by zero", caret.column);
    return base.pow(n);
  }

  private primary(): RationalFunction {
    const t = this.peek();
    if (t.kind === "number") {
      this.pos++;
      return RationalFunction.constant(t.value);
    }
    if (t.kind === "ident") {
      this.pos++;
      if (this.isOp("(")) this.fail(`"${t.name}(" is not a value: functions are not part of value expressions`, this.peek().column);
      return RationalFunction.fromPoly(Poly.variable(t.name));
    }
    if (t.kind === "op" && t.op === "(") {
      this.pos++;
      const inner = this.expression();
      if (!this.isOp(")")) this.fail("expected )", this.peek().column);
      this.pos++;
      return inner;
    }
    if (t.kind === "end") this.fail("unexpected end of the value", t.column);
    this.fail(`unexpected "${(t as { op: string }).op}"`, t.column);
  }
}

/** Parse an element value such as "R0", "10k", "4.7u", "gm*R0/(1 + gm*Rs)", "2^-3", exactly. */
export function parseValue(text: string): RationalFunction {
  return new Parser(tokenize(text), text).parse();
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
