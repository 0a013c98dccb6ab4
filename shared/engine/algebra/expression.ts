// Value expressions: identifiers, exact decimal numbers with an optional SI prefix written
// right after the digits, + - * / ^ (integer exponents), parentheses, unary minus, and the two
// controls a source value may name: across(<node>, <node>) and through(<element>).
// One recursive-descent grammar, so every syntax error carries its column; what it builds is
// a Reading: exact Poly / RationalFunction values here (readExpression, for the engine's own
// printed results), or text for nerdamer's parser (parseValue in element-value.ts).

import { Rational } from "./rational";
import { Poly } from "./polynomial";
import { fieldsFromMonomials, type SparseMonomial } from "./polynomial-build";
import { MAX_EXPONENT } from "./monomial-layout";
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
const SI_PREFIX_EXPONENT: Readonly<Record<string, number>> = {
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
const isIdentStartCode = (k: number) => (k >= 65 && k <= 90) || (k >= 97 && k <= 122) || k === 95;
const isIdentCode = (k: number) => isIdentStartCode(k) || (k >= 48 && k <= 57);
const SPACE = 32;
const TAB = 9;
/** The operator characters + - * / ^ ( ) by code. */
const OPERATOR_CODES = new Set([..."+-*/^()"].map((c) => c.charCodeAt(0)));

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

function isIntegerText(text: string): boolean {
  for (let i = 0; i < text.length; i++) {
    const k = text.charCodeAt(i);
    if (k < 48 || k > 57) return false;
  }
  return true;
}

/**
 * Tokens one at a time, as the parser asks for them: a long text's tokens are garbage as soon as
 * they are read instead of living on (in an array) until the end.
 */
class Lexer {
  private i = 0;
  private done = false;
  constructor(private readonly text: string) {}

  next(): Token {
    const text = this.text;
    const length = text.length;
    let i = this.i;
    let k = text.charCodeAt(i);
    while (k === SPACE || k === TAB) k = text.charCodeAt(++i);
    const column = i + 1;
    if (i >= length) {
      this.i = i;
      this.done = true;
      return { kind: "end", column: length + 1 };
    }
    if (isIdentStartCode(k)) {
      let j = i + 1;
      while (j < length && isIdentCode(text.charCodeAt(j))) j++;
      const name = text.slice(i, j);
      if (name === "across" || name === "through") {
        let after = j;
        while (text[after] === " " || text[after] === "\t") after++;
        if (text[after] === "(") {
          const control = scanControl(text, name, column, after);
          this.i = control.end;
          return control.token;
        }
      }
      this.i = j;
      return { kind: "ident", name, column };
    }
    if (OPERATOR_CODES.has(k)) {
      this.i = i + 1;
      return { kind: "op", op: text[i] as "+", column };
    }
    const c = text[i];
    if (isDigit(c) || (c === "." && isDigit(text[i + 1] ?? ""))) {
      const end = scanDecimal(text, i);
      const digits = text.slice(i, end);
      // Plain integers (most numbers in a long text) skip the decimal grammar.
      let value = end - i <= 15 && isIntegerText(digits) ? Rational.of(Number(digits)) : Rational.parseDecimal(digits);
      let j = end;
      const next = text[j] ?? "";
      if (next in SI_PREFIX_EXPONENT && !isIdentChar(text[j + 1] ?? "")) {
        value = value.mul(prefixFactor(next));
        j++;
      } else if (isIdentChar(next) || next === ".") {
        throw new ValueSyntaxError(`unexpected "${next}" after the number ${digits}; write a * between a number and a name`, j + 1, text);
      }
      this.i = j;
      return { kind: "number", value, column, text: text.slice(i, j) };
    }
    throw new ValueSyntaxError(`unexpected character "${c}"`, column, text);
  }

  /** Every token to the end (end included). */
  all(): Token[] {
    const tokens: Token[] = [];
    while (!this.done) tokens.push(this.next());
    return tokens;
  }
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
function sumPairwise(terms: RationalFunction[]): RationalFunction {
  for (let width = 1; width < terms.length; width *= 2)
    for (let i = 0; i + width < terms.length; i += 2 * width) terms[i] = terms[i].add(terms[i + width]);
  return terms[0];
}

/** The exact meaning of each production, on values that are not (or no longer) sums of monomials. */
function exactReading(text: string): Reading<RationalFunction> {
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
 * A value being read fast: a bare name by its number (no allocation for the commonest token),
 * a sum of monomials (repeats allowed) while the text stays polynomial, or else the exact value.
 */
export type Partial = number | Terms | RationalFunction;
type Terms = { terms: SparseMonomial[] };

/** a := a * b for two monomials, unless an exponent would leave the range (then false and a unchanged). */
function multiplyInto(a: SparseMonomial, b: SparseMonomial): boolean {
  const f = b.factors;
  for (let j = 0; j < f.length; j += 2) {
    const at = indexOfName(a, f[j]);
    if (at >= 0 && a.factors[at + 1] + f[j + 1] > MAX_EXPONENT) return false;
  }
  for (let j = 0; j < f.length; j += 2) multiplyByName(a, f[j], f[j + 1]);
  if (!b.coef.isOne()) a.coef = a.coef.mul(b.coef);
  return true;
}

function indexOfName(a: SparseMonomial, name: number): number {
  const f = a.factors;
  for (let j = 0; j < f.length; j += 2) if (f[j] === name) return j;
  return -1;
}

/** a := a * name^power, unless the exponent would leave the range (then false and a unchanged). */
function multiplyByName(a: SparseMonomial, name: number, power: number): boolean {
  const at = indexOfName(a, name);
  if (at < 0) {
    a.factors.push(name, power);
    return true;
  }
  if (a.factors[at + 1] + power > MAX_EXPONENT) return false;
  a.factors[at + 1] += power;
  return true;
}

/**
 * The same meaning as exactReading, built faster for long polynomial text (engine output of
 * tens of thousands of terms): products and positive powers of monomials stay monomials and a
 * sum of them is built once (fieldsFromMonomials), so reading is near-linear in the text. Anything
 * else (a quotient by a non-constant, a product of sums, a negative power) is handed to
 * exactReading, faults included, so both give the same value and the same errors. Each reading
 * is consumed once, so monomials and term lists are grown in place. finish gives the value.
 */
export function monomialReading(text: string): { reading: Reading<Partial> & Required<Pick<Reading<Partial>, "sum">>; finish(p: Partial): RationalFunction } {
  const exact = exactReading(text);
  // Names are numbered as they first occur.
  const numbers = new Map<string, number>();
  const names: string[] = [];
  const nameTerms = (name: number): Terms => ({ terms: [{ coef: Rational.ONE, factors: [name, 1] }] });
  const asExact = (p: Partial): RationalFunction =>
    p instanceof RationalFunction ? p : typeof p === "number" ? RationalFunction.variable(names[p]) : RationalFunction.fromPoly(Poly.fromFields(fieldsFromMonomials(names, p.terms)));
  /** The value as terms (a name becomes one), or null for a rational function. */
  const termsOf = (p: Partial): Terms | null => (p instanceof RationalFunction ? null : typeof p === "number" ? nameTerms(p) : p);
  /** The value's one monomial, or null. */
  const monomialOf = (p: Terms | null): SparseMonomial | null => (p && p.terms.length === 1 ? p.terms[0] : null);
  const numbered = (name: string): number => {
    let n = numbers.get(name);
    if (n === undefined) {
      n = names.length;
      numbers.set(name, n);
      names.push(name);
    }
    return n;
  };
  const negate = (p: Partial): Partial => {
    const terms = termsOf(p);
    if (!terms) return (p as RationalFunction).neg();
    for (const t of terms.terms) t.coef = t.coef.neg();
    return terms;
  };
  const product = (left: Partial, right: Partial): Terms | null => {
    const l = termsOf(left);
    const a = monomialOf(l);
    if (!a) return null;
    if (typeof right === "number") return multiplyByName(a, right, 1) ? l : null;
    const b = monomialOf(termsOf(right));
    return b && multiplyInto(a, b) ? l : null;
  };
  const reading: Reading<Partial> & Required<Pick<Reading<Partial>, "sum">> = {
    number: (value) => ({ terms: [{ coef: value, factors: [] }] }),
    name: numbered,
    control: (word, args) => numbered(controlSymbol(word, args)),
    group: (inner) => inner,
    binary(op, left, right, column) {
      if (op === "*") {
        const p = product(left, right);
        if (p) return p;
      } else if (op === "/") {
        const l = termsOf(left);
        const b = monomialOf(termsOf(right));
        if (l && b && b.factors.length === 0 && !b.coef.isZero()) {
          const inverse = b.coef.inverse();
          for (const t of l.terms) t.coef = t.coef.mul(inverse);
          return l;
        }
      }
      return exact.binary(op, asExact(left), asExact(right), column);
    },
    sign: (op, operand) => (op === "-" ? negate(operand) : operand),
    sum(first, rest) {
      const others: RationalFunction[] = [];
      let terms: SparseMonomial[] = [];
      const take = (p: Partial) => {
        if (p instanceof RationalFunction) others.push(p);
        else if (typeof p === "number") terms.push({ coef: Rational.ONE, factors: [p, 1] });
        else if (terms.length === 0) terms = p.terms;
        else for (const t of p.terms) terms.push(t);
      };
      take(first);
      for (const r of rest) take(r.op === "-" ? negate(r.value) : r.value);
      if (others.length === 0) return { terms };
      return sumPairwise([asExact({ terms }), ...others]);
    },
    power(base, exponent, caretColumn, exponentColumn) {
      const b = termsOf(base);
      const m = monomialOf(b);
      const e = monomialOf(termsOf(exponent));
      if (m && e && e.factors.length === 0 && e.coef.isInteger()) {
        const n = Number(e.coef.num);
        const f = m.factors;
        let fits = n >= 1 && n <= MAX_EXPONENT_MAGNITUDE;
        for (let j = 1; j < f.length && fits; j += 2) fits = f[j] * n <= MAX_EXPONENT;
        if (fits) {
          for (let j = 1; j < f.length; j += 2) f[j] *= n;
          m.coef = m.coef.pow(n);
          return b!;
        }
      }
      return exact.power(asExact(base), asExact(exponent), caretColumn, exponentColumn);
    },
  };
  return { reading, finish: asExact };
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
  private current: Token;
  constructor(private readonly lexer: Lexer, private readonly text: string, private readonly reading: Reading<T>) {
    this.current = lexer.next();
  }

  private peek(): Token {
    return this.current;
  }

  /** The current token, moving on to the next. */
  private take(): Token {
    const t = this.current;
    this.current = this.lexer.next();
    return t;
  }

  private isOp(op: string): boolean {
    const t = this.current;
    return t.kind === "op" && t.op === op;
  }

  private fail(message: string, column: number): never {
    throw new ValueSyntaxError(message, column, this.text);
  }

  parse(): T {
    try {
      if (this.peek().kind === "end") this.fail("empty value", 1);
      const value = this.expression();
      const t = this.peek();
      if (t.kind !== "end") {
        this.fail(t.kind === "op" && t.op === ")" ? "unmatched )" : "expected an operator", t.column);
      }
      return value;
    } catch (fault) {
      // A fault of the characters anywhere in the text comes first (the reader takes tokens as
      // it goes, but reports as if the whole text had been split into tokens before reading).
      this.lexer.all();
      throw fault;
    }
  }

  private expression(): T {
    let value = this.term();
    const sum = this.reading.sum;
    const rest: Array<{ op: SignOp; value: T }> = [];
    while (this.isOp("+") || this.isOp("-")) {
      const t = this.take() as { op: SignOp; column: number };
      if (sum) rest.push({ op: t.op, value: this.term() });
      else value = this.reading.binary(t.op, value, this.term(), t.column);
    }
    return sum && rest.length > 0 ? sum(value, rest) : value;
  }

  private term(): T {
    let value = this.unary();
    while (this.isOp("*") || this.isOp("/")) {
      const t = this.take() as { op: BinaryOp; column: number };
      value = this.reading.binary(t.op, value, this.unary(), t.column);
    }
    return value;
  }

  private unary(): T {
    if (this.isOp("-") || this.isOp("+")) {
      const t = this.take() as { op: SignOp; column: number };
      return this.reading.sign(t.op, this.unary(), t.column);
    }
    return this.power();
  }

  private power(): T {
    const base = this.primary();
    if (!this.isOp("^")) return base;
    const caret = this.take();
    const exponentColumn = this.peek().column;
    return this.reading.power(base, this.unary(), caret.column, exponentColumn);
  }

  private primary(): T {
    const t = this.peek();
    if (t.kind === "number") {
      this.take();
      return this.reading.number(t.value, t.column);
    }
    if (t.kind === "ident") {
      this.take();
      if (this.isOp("(")) this.fail(`"${t.name}(" is not a value: functions are not part of value expressions (a source may name across(<node>, <node>) or through(<element>))`, this.peek().column);
      return this.reading.name(t.name, t.column);
    }
    if (t.kind === "control") {
      this.take();
      return this.reading.control(t.word, t.args, t.column);
    }
    if (t.kind === "op" && t.op === "(") {
      this.take();
      const inner = this.expression();
      if (!this.isOp(")")) this.fail("expected )", this.peek().column);
      this.take();
      return this.reading.group(inner);
    }
    if (t.kind === "end") this.fail("unexpected end of the value", t.column);
    this.fail(`unexpected "${(t as { op: string }).op}"`, t.column);
  }
}

/** Every control a value names, in text order, without reading the rest of it (a structural look). */
export function controlsIn(text: string): { word: ControlWord; args: string[]; column: number }[] {
  return new Lexer(text).all().flatMap((t) => (t.kind === "control" ? [{ word: t.word, args: t.args, column: t.column }] : []));
}

/** Check text against the value grammar (columns in every error) and build it with reading. */
export function readWith<T>(text: string, reading: Reading<T>): T {
  return new Parser(new Lexer(text), text, reading).parse();
}

/**
 * Our own reader, for text the engine printed itself (toInfix of results, up to tens of
 * thousands of terms), where nerdamer would be slow. Same grammar and the same exact value as
 * parseValue on every input both accept; user-typed element values go through parseValue.
 */
export function readExpression(text: string): RationalFunction {
  const { reading, finish } = monomialReading(text);
  return finish(readWith(text, reading));
}

/** Builds nothing: the grammar's syntax check alone. */
const GRAMMAR_ONLY: Reading<null> = { number: () => null, name: () => null, control: () => null, group: () => null, binary: () => null, sign: () => null, power: () => null };

/**
 * Check text against the grammar first (every syntax fault before any fault of meaning, as
 * parseValue reports them), then read it with our own reader: parseValue for texts too long
 * for nerdamer's parser to be cheap.
 */
export function readCheckedExpression(text: string): RationalFunction {
  new Parser<null>(new Lexer(text), text, GRAMMAR_ONLY).parse();
  const { reading, finish } = monomialReading(text);
  return finish(new Parser(new Lexer(text), text, reading).parse());
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
