// An independent reader of the engine's printed forms (plain infix and TeX), evaluating in floats.
// It shares no code with the engine's parsers or printers, so a printer bug (a lost sign, a
// dropped bracket) shows up as a different number, not as the same mistake read back twice.

/** How TeX shows an infix name: a trailing digit run becomes a subscript ("R1" and "R_1" both read R_{1}). */
function symbolKey(name: string): string {
  if (name.includes("_")) return name;
  const m = /^(\D+)(\d+)$/.exec(name);
  return m ? `${m[1]}_${m[2]}` : name;
}

/** The name a TeX symbol stands for: \mathit{Rs} -> Rs, r_{\pi} -> r_pi, V_{\mathrm{out}} -> V_out, R_{1} -> R_1. */
function texSymbolKey(tex: string): string {
  const plain = (t: string) =>
    t
      .replace(/\\(?:mathit|mathrm)\{((?:[^{}\\]|\\_)*)\}/g, "$1")
      .replace(/\\_/g, "_")
      .replace(/\\([A-Za-z]+)/g, "$1")
      .replace(/[{}]/g, "");
  const us = /^(\\(?:mathit|mathrm)\{(?:[^{}\\]|\\_)+\}|\\[A-Za-z]+|[A-Za-z])_(.*)$/s.exec(tex);
  return us ? `${plain(us[1])}_${plain(us[2])}` : plain(tex);
}

type Values = ReadonlyMap<string, number>;

class Reader {
  private i = 0;
  constructor(private readonly text: string, private readonly values: Values, private readonly tex: boolean) {}

  read(): number {
    const v = this.sum();
    this.skip();
    if (this.i < this.text.length) this.fail("unexpected text");
    return v;
  }

  private fail(what: string): never {
    throw new Error(`${what} at ${this.i} in ${this.text.slice(0, 200)}${this.text.length > 200 ? "…" : ""}`);
  }

  /** Spaces, and in TeX the spacing commands, which only separate factors. */
  private skip(): void {
    for (;;) {
      const rest = this.text.slice(this.i);
      const m = this.tex ? /^(\s+|\\[,;:! ]|\\quad\b|\\qquad\b)/.exec(rest) : /^\s+/.exec(rest);
      if (!m) return;
      this.i += m[0].length;
    }
  }

  private peek(): string {
    this.skip();
    return this.text[this.i] ?? "";
  }

  private take(s: string): boolean {
    this.skip();
    if (!this.text.startsWith(s, this.i)) return false;
    this.i += s.length;
    return true;
  }

  private expect(s: string): void {
    if (!this.take(s)) this.fail(`expected ${s}`);
  }

  private sum(): number {
    let v = this.signed();
    for (;;) {
      if (this.take("+")) v += this.signed();
      else if (this.take("-")) v -= this.signed();
      else return v;
    }
  }

  private signed(): number {
    if (this.take("-")) return -this.signed();
    if (this.take("+")) return this.signed();
    return this.product();
  }

  private product(): number {
    let v = this.power();
    for (;;) {
      // A sign may follow * or / (a*-b), as in most languages and in sympy.
      if (this.take("*") || (this.tex && (this.take("\\cdot") || this.take("\\times")))) v *= this.signedFactor();
      else if (this.take("/")) v /= this.signedFactor();
      else if (this.tex && this.startsFactor()) v *= this.power(); // TeX writes a product by juxtaposition
      else return v;
    }
  }

  private signedFactor(): number {
    if (this.take("-")) return -this.signedFactor();
    return this.power();
  }

  private startsFactor(): boolean {
    const c = this.peek();
    if (c === "" || "+-*/)}=,&^".includes(c)) return false;
    if (this.text.startsWith("\\right", this.i) || this.text.startsWith("\\end", this.i)) return false;
    return true;
  }

  private power(): number {
    const base = this.atom();
    if (!this.take("^")) return base;
    if (this.take("{")) {
      const e = this.sum();
      this.expect("}");
      return base ** e;
    }
    if (this.tex) {
      // A TeX exponent without braces is a single character.
      const c = this.text[this.i++];
      if (!/[0-9]/.test(c)) this.fail("expected a digit exponent");
      return base ** Number(c);
    }
    return base ** this.signedAtom();
  }

  private signedAtom(): number {
    if (this.take("-")) return -this.signedAtom();
    return this.atom();
  }

  private atom(): number {
    const c = this.peek();
    if (this.take("(")) {
      const v = this.sum();
      this.expect(")");
      return v;
    }
    if (this.tex) {
      if (this.take("\\left(")) {
        const v = this.sum();
        this.expect("\\right)");
        return v;
      }
      if (this.take("\\frac")) {
        this.expect("{");
        const n = this.sum();
        this.expect("}");
        this.expect("{");
        const d = this.sum();
        this.expect("}");
        return n / d;
      }
      if (this.take("{")) {
        const v = this.sum();
        this.expect("}");
        return v;
      }
    }
    if (/[0-9.]/.test(c)) {
      const m = /^(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?/.exec(this.text.slice(this.i))!;
      this.i += m[0].length;
      return Number(m[0]);
    }
    return this.symbol();
  }

  private symbol(): number {
    const start = this.i;
    const rest = this.text.slice(this.i);
    const m = this.tex
      ? /^(\\(?:mathit|mathrm)\{(?:[^{}\\]|\\_)+\}|\\[A-Za-z]+|[A-Za-z])(_(\{(?:[^{}]|\{[^{}]*\})*\}|[A-Za-z0-9]))?/.exec(rest)
      : /^[A-Za-z_][A-Za-z0-9_]*/.exec(rest);
    if (!m) this.fail("expected a number or a symbol");
    this.i += m[0].length;
    const spelled = this.text.slice(start, this.i);
    const key = this.tex ? texSymbolKey(spelled) : spelled;
    const v = this.values.get(key);
    if (v === undefined) this.fail(`no value for the symbol ${this.text.slice(start, this.i)}`);
    return v;
  }
}

/** Values by symbolKey; throws when two names of one network share a key (the TeX would be ambiguous). */
function valuesByKey(point: Readonly<Record<string, number>>): Map<string, number> {
  const out = new Map<string, number>();
  const owner = new Map<string, string>();
  for (const [name, v] of Object.entries(point)) {
    const key = symbolKey(name);
    if (owner.has(key) && owner.get(key) !== name) throw new Error(`symbols ${owner.get(key)} and ${name} print alike`);
    owner.set(key, name);
    out.set(key, v);
  }
  return out;
}

/** A plain infix form (+ - * / ^, parentheses, symbols, decimal numbers) evaluated at a point. */
export function evaluatePrintedInfix(text: string, point: Readonly<Record<string, number>>): number {
  return new Reader(text, new Map(Object.entries(point)), false).read();
}

/** A TeX form (\frac, \left( \right), juxtaposed factors, ^{…}, subscripted names) evaluated at a point. */
export function evaluatePrintedTex(text: string, point: Readonly<Record<string, number>>): number {
  return new Reader(text, valuesByKey(point), true).read();
}

/** Relative agreement of two floats, with an absolute floor for values near zero. */
export function closeTo(x: number, y: number, tolerance = 1e-9): boolean {
  if (!Number.isFinite(x) || !Number.isFinite(y)) return false;
  return Math.abs(x - y) <= tolerance * Math.max(1, Math.abs(x), Math.abs(y));
}

/** Random points whose coordinates are exact in binary (m/16, m in 8..40), so floats add no error of their own. */
export function randomPoints(symbols: Iterable<string>, count: number, rand: () => number): Record<string, number>[] {
  const names = [...new Set(symbols)].sort();
  return Array.from({ length: count }, () => Object.fromEntries(names.map((n) => [n, (8 + Math.floor(rand() * 33)) / 16])));
}
