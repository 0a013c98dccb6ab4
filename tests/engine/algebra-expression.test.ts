import { afterEach, describe, expect, it, vi } from "vitest";
import fc from "fast-check";
import nerdamer from "nerdamer";
import { Poly, Rational, RationalFunction, ValueSyntaxError, formatSI, parseSI, parseValue, readExpression } from "../../shared/engine/algebra/index";
import { NERDAMER_TEXT_LIMIT } from "../../shared/engine/algebra/element-value";
import { askSympy } from "./algebra-sympy";

describe("parseValue: SI prefixes (SI Brochure, BIPM, 9th edition, 2019)", () => {
  const table: Array<[string, number]> = [
    ["T", 12], ["G", 9], ["M", 6], ["k", 3], ["m", -3], ["u", -6], ["\u00b5", -6], ["\u03bc", -6], ["n", -9], ["p", -12], ["f", -15],
  ];
  it.each(table)("1%s = 10^%d exactly", (prefix, exp) => {
    const expected = exp >= 0 ? Rational.of(10n ** BigInt(exp)) : Rational.of(1n, 10n ** BigInt(-exp));
    expect(parseValue(`1${prefix}`).constantValue()!.equals(expected)).toBe(true);
  });

  it("keeps decimal values exact: 10k = 10000, 4.7u = 47/10000000, 2.2M, 1e3, 0.5m", () => {
    expect(parseValue("10k").toInfix()).toBe("10000");
    expect(parseValue("4.7u").toInfix()).toBe("47/10000000");
    expect(parseValue("2.2M").toInfix()).toBe("2200000");
    expect(parseValue("1e3").toInfix()).toBe("1000");
    expect(parseValue("0.5m").toInfix()).toBe("1/2000");
    expect(parseValue("1.5e-3k").toInfix()).toBe("3/2");
  });

  it("is case-sensitive as the Brochure is: M is mega, m is milli; K is not a prefix", () => {
    expect(parseValue("1M").constantValue()!.toNumber()).toBe(1e6);
    expect(parseValue("1m").constantValue()!.toNumber()).toBe(1e-3);
    expect(() => parseValue("1K")).toThrow(ValueSyntaxError);
  });

  it("builds exact rational functions from expressions", () => {
    expect(parseValue("gm*R0/(1 + gm*Rs)").toInfix()).toBe("R0*gm/(Rs*gm + 1)");
    expect(parseValue("-x^2").toInfix()).toBe("-x^2");
    expect(parseValue("2^-2").toInfix()).toBe("1/4");
    expect(parseValue("x^(1+1)").toInfix()).toBe("x^2");
    expect(parseValue("2^3^2").toInfix()).toBe("512"); // ^ is right-associative (common practice)
    expect(parseValue("1/(s*C)").toInfix()).toBe("1/(C*s)");
    expect(parseValue("beta_1 * r_pi + 1k").toInfix()).toBe("beta_1*r_pi + 1000");
  });
});

describe.each([
  ["parseValue", parseValue],
  ["readExpression", readExpression],
] as const)("%s: errors name the column", (_, read) => {
  const cases: Array<[string, number]> = [
    ["", 1],
    ["2x", 2],
    ["10kohm", 3],
    ["R0 + * 3", 6],
    ["(R0 + 1", 8],
    ["R0)", 3],
    ["1/0", 2],
    ["x^y", 3],
    ["x^1.5", 3],
    ["R0 $ 1", 4],
    ["sin(x)", 4],
    ["R0 R1", 4],
    ["R0 +", 5],
  ];
  it.each(cases)("%j fails at column %d", (text, column) => {
    let error: unknown;
    try {
      read(text);
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(ValueSyntaxError);
    expect((error as ValueSyntaxError).column).toBe(column);
  });
});

// ---- independent numeric check with nerdamer on random expressions ---------------------

const NAMES = ["R0", "mu", "gm", "beta_1", "Vs", "r_pi"];
const PREFIX_POWER: Record<string, number> = { T: 12, G: 9, M: 6, k: 3, "": 0, m: -3, u: -6, n: -9, p: -12 };

interface Generated {
  ours: string; // with SI prefixes
  plain: string; // the same expression with every number written as mantissa*10^k, for nerdamer
}

const numberArb: fc.Arbitrary<Generated> = fc
  .tuple(fc.integer({ min: 1, max: 999 }), fc.integer({ min: 0, max: 2 }), fc.constantFrom(...Object.keys(PREFIX_POWER)))
  .map(([digits, decimals, prefix]) => {
    const mantissa = decimals === 0 ? `${digits}` : (digits / 10 ** decimals).toFixed(decimals);
    return { ours: `${mantissa}${prefix}`, plain: `(${mantissa}*10^(${PREFIX_POWER[prefix]}))` };
  });

const exprArb: fc.Arbitrary<Generated> = fc.letrec<{ e: Generated }>((tie) => ({
  e: fc.oneof(
    { depthSize: "small", withCrossShrink: true },
    fc.constantFrom(...NAMES).map((n) => ({ ours: n, plain: n })),
    numberArb,
    fc.tuple(tie("e"), fc.constantFrom("+", "-", "*", "/"), tie("e")).map(([a, op, b]) => ({
      ours: `(${a.ours} ${op} ${b.ours})`,
      plain: `(${a.plain} ${op} ${b.plain})`,
    })),
    fc.tuple(tie("e"), fc.integer({ min: -2, max: 3 })).map(([a, k]) => ({ ours: `(${a.ours})^(${k})`, plain: `(${a.plain})^(${k})` })),
    tie("e").map((a) => ({ ours: `-${a.ours}`, plain: `-(${a.plain})` })),
  ),
})).e;

describe("parseValue agrees with nerdamer (an independent parser) on random expressions", () => {
  it("same exact value at random rational points", () => {
    fc.assert(
      fc.property(exprArb, fc.array(fc.integer({ min: 1, max: 12 }), { minLength: NAMES.length, maxLength: NAMES.length }), (g, ks) => {
        let f;
        try {
          f = parseValue(g.ours);
        } catch (e) {
          expect(e).toBeInstanceOf(ValueSyntaxError); // only exact division by zero is refused
          return;
        }
        const at: Record<string, Rational> = {};
        const subs: Record<string, string> = {};
        NAMES.forEach((n, i) => {
          at[n] = Rational.of(ks[i], 4);
          subs[n] = `(${ks[i]}/4)`;
        });
        let ours: Rational;
        try {
          ours = f.substitute(at).constantValue()!;
        } catch {
          return; // a denominator vanishes at this point
        }
        // nerdamer works in exact fractions for rational inputs and prints "p/q".
        const text = nerdamer(g.plain, subs).evaluate().toString();
        const m = /^(-?\d+)(?:\/(\d+))?$/.exec(text);
        expect(m, `nerdamer printed ${text}`).not.toBeNull();
        const theirs = Rational.of(BigInt(m![1]), BigInt(m![2] ?? "1"));
        expect(ours.toString()).toBe(theirs.toString());
      }),
      { numRuns: 150, seed: 42 },
    );
  });
});

describe("parseSI and formatSI", () => {
  it("parseSI reads plain numbers with a prefix, exactly", () => {
    expect(parseSI("4.7k").toString()).toBe("4700");
    expect(parseSI("-1.5m").toString()).toBe("-3/2000");
    expect(parseSI("4.7 k").toString()).toBe("4700");
    expect(parseSI("22").toString()).toBe("22");
    expect(() => parseSI("4.7kk")).toThrow(ValueSyntaxError);
    expect(() => parseSI("k")).toThrow(ValueSyntaxError);
  });

  it("formatSI uses engineering notation with the SI prefix", () => {
    expect(formatSI(4700)).toBe("4.7 k");
    expect(formatSI(4700, "Ω")).toBe("4.7 kΩ");
    expect(formatSI(1.2e-5, "A")).toBe("12 \u00b5A");
    expect(formatSI(12, "Ω")).toBe("12 Ω");
    expect(formatSI(12)).toBe("12");
    expect(formatSI(-3.3e6, "V")).toBe("-3.3 MV");
    expect(formatSI(1e-15, "F")).toBe("1 fF");
    expect(formatSI(0, "V")).toBe("0 V");
    expect(formatSI(0.000999999)).toBe("1 m");
  });

  it("parseSI(formatSI(x)) is x to 4 significant digits", () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-14, max: 1e14, noNaN: true }), fc.boolean(), (x, neg) => {
        const v = neg ? -x : x;
        const back = parseSI(formatSI(v)).toNumber();
        expect(Math.abs(back - v)).toBeLessThanOrEqual(6e-4 * Math.abs(v));
      }),
      { numRuns: 200 },
    );
  });
});

describe("parseValue results read back by sympy", () => {
  it("toInfix of parsed expressions equals sympy's reading of the same text (SI numbers spelled out)", () => {
    const samples = fc.sample(exprArb, { numRuns: 25, seed: 9 });
    const questions = samples.flatMap((g) => {
      try {
        return [{ kind: "equal" as const, a: parseValue(g.ours).toInfix(), b: g.plain }];
      } catch {
        return [];
      }
    });
    expect(questions.length).toBeGreaterThan(15);
    expect(askSympy(questions)).toEqual(questions.map(() => true));
  });
});

// ---- parseValue goes through nerdamer's parser; readExpression is our own ---------------

const treeOf = () => vi.spyOn(nerdamer as unknown as { tree(text: string): unknown }, "tree");

describe("parseValue reads element values with nerdamer's parser", () => {
  afterEach(() => vi.restoreAllMocks());

  it("hands nerdamer the text with SI numbers as exact rational literals; readExpression does not use nerdamer", () => {
    const tree = treeOf();
    parseValue("4.7u*R0 + 10k");
    expect(tree).toHaveBeenCalledTimes(1);
    expect(tree.mock.calls[0][0]).toBe("(47/10000000)*R0+10000");
    readExpression("4.7u*R0 + 10k");
    expect(tree).toHaveBeenCalledTimes(1);
  });

  it("checks the grammar before nerdamer sees the text, so faults keep our columns", () => {
    const tree = treeOf();
    expect(() => parseValue("R0 + * 3")).toThrow(ValueSyntaxError);
    expect(tree).not.toHaveBeenCalled();
  });

  // SI Brochure (BIPM, 9th edition, 2019), table 7: the prefix multiplies by a power of ten, exactly.
  const mantissas = ["1", "4.7", "0.33", "15", "2.2", "1.5e3", "680"];
  const prefixes: Array<[string, number]> = [["T", 12], ["G", 9], ["M", 6], ["k", 3], ["m", -3], ["u", -6], ["\u00b5", -6], ["n", -9], ["p", -12], ["f", -15]];
  it.each(mantissas.flatMap((m) => prefixes.map(([p, e]) => [m, p, e] as const)))("%s%s = %s × 10^%d exactly, times a symbol", (mantissa, prefix, exp) => {
    // Expected value from the digits alone: 4.7 = 47 × 10^-1, 1.5e3 = 15 × 10^2.
    const [body, e10 = "0"] = mantissa.split("e");
    const [whole, frac = ""] = body.split(".");
    const power = exp + Number(e10) - frac.length;
    const digits = BigInt(whole + frac);
    const expected = power >= 0 ? Rational.of(digits * 10n ** BigInt(power)) : Rational.of(digits, 10n ** BigInt(-power));
    const value = parseValue(`${mantissa}${prefix} * Rs`);
    expect(value.equals(RationalFunction.fromPoly(Poly.variable("Rs").scale(expected)))).toBe(true);
  });

  it("keeps numbers exact where floats would not: 0.1 + 0.2 = 3/10 (binary floating point gives 0.30000000000000004, common practice)", () => {
    expect(0.1 + 0.2).not.toBe(0.3);
    expect(parseValue("0.1 + 0.2").constantValue()!.equals(Rational.of(3, 10))).toBe(true);
  });

  it("keeps literals beyond 2^53 and tiny exponents exact", () => {
    const big = 123456789012345678901234567890n;
    expect(parseValue(`${big}*x + 1e-30`).equals(readExpression(`${big}*x + 1e-30`))).toBe(true);
    expect(parseValue(`${big}*x + 1e-30`).toInfix()).toBe(`${big}*x + 1/${10n ** 30n}`);
    expect(parseValue("(2^70 + 1)/3").constantValue()!.equals(Rational.of(2n ** 70n + 1n, 3n))).toBe(true);
  });

  it("reads R1*R2/(R1+R2) as the parallel combination, exactly (product over sum, common practice)", () => {
    const parallel = parseValue("R1*R2/(R1+R2)");
    expect(parallel.num.equals(Poly.variable("R1").mul(Poly.variable("R2")))).toBe(true);
    expect(parallel.den.equals(Poly.variable("R1").add(Poly.variable("R2")))).toBe(true);
    expect(parallel.equals(parseValue("1/(1/R1 + 1/R2)"))).toBe(true);
    const at = (r1: string, r2: string) => parallel.substitute({ R1: parseSI(r1), R2: parseSI(r2) }).constantValue()!.toString();
    expect(at("10k", "10k")).toBe("5000"); // equal resistors: half
    expect(at("1k", "4k")).toBe("800");
    expect(at("1k", "2k")).toBe("2000/3");
  });

  it("negative and integer powers, unary minus and nested parentheses", () => {
    const y = RationalFunction.fromPoly(Poly.variable("y"));
    const x = RationalFunction.fromPoly(Poly.variable("x"));
    expect(parseValue("x^-2*y").equals(y.div(x.mul(x)))).toBe(true);
    expect(parseValue("2^-2*x").equals(x.scale(Rational.of(1, 4)))).toBe(true);
    expect(parseValue("-(-(-(R0)))").toInfix()).toBe("-R0");
    expect(parseValue("((R0 + (mu*(R0))))^2").equals(readExpression("(R0 + mu*R0)^2"))).toBe(true);
    expect(parseValue("(gm*ro)^(-1)").toInfix()).toBe("1/(gm*ro)");
  });

  // Each is read by sympy (parse_expr with ^ as **) as well; nerdamer alone gives a prefix sign
  // another reach (x^-y*z is x^(-(y*z)) there), which parseValue must not inherit.
  it("sign and precedence cases mean what sympy reads", () => {
    const texts = ["x^-2*y", "a/-b/c", "a*-b^2", "2^-2*x", "-a^2", "a - -b*c", "-(a+b)^-1", "2^3^2", "a/b*c", "a-b+c", "-a/b/c", "+a*-b", "x^-2^2*y", "((R0))*(-(-mu))"];
    const questions = texts.map((t) => ({ kind: "equal" as const, a: parseValue(t).toInfix(), b: t }));
    expect(askSympy(questions)).toEqual(texts.map(() => true));
    for (const t of texts) expect(parseValue(t).equals(readExpression(t)), t).toBe(true);
  });
});

// Expressions written without forced brackets, so precedence, associativity and signs matter.
const SPACES = fc.constantFrom("", "", " ", "  ");
const NAMES_AGREE = ["R0", "mu", "gm", "beta_1", "r_pi", "e", "pi", "s", "toString"];
const atomArb: fc.Arbitrary<string> = fc.oneof(
  fc.constantFrom(...NAMES_AGREE),
  fc.tuple(fc.integer({ min: 0, max: 9999 }), fc.constantFrom("", ".5", ".25", "e3", "e-2"), fc.constantFrom("", "", "k", "m", "u", "\u00b5", "M", "n", "p", "f", "T", "G")).map(([d, tail, p]) => `${d}${tail}${p}`),
);
const looseArb: fc.Arbitrary<string> = fc.letrec<{ e: string }>((tie) => ({
  e: fc.oneof(
    { depthSize: "small", withCrossShrink: true },
    atomArb,
    fc.tuple(tie("e"), SPACES, fc.constantFrom("+", "-", "*", "/"), SPACES, tie("e")).map((p) => p.join("")),
    fc.tuple(tie("e"), fc.constantFrom("^", " ^ "), fc.constantFrom("2", "-1", "-2", "3", "(1+1)", "-(2)", "0", "2^-1")).map((p) => p.join("")),
    fc.tuple(fc.constantFrom("-", "+", "- "), tie("e")).map((p) => p.join("")),
    tie("e").map((a) => `(${a})`),
  ),
})).e;

type Outcome = { ok: RationalFunction } | { error: ValueSyntaxError };
const outcome = (read: (t: string) => RationalFunction, text: string): Outcome => {
  try {
    return { ok: read(text) };
  } catch (e) {
    if (!(e instanceof ValueSyntaxError)) throw e;
    return { error: e };
  }
};
const SEMANTIC = /division by zero|exponent/;

/** The two readers accept the same texts with the same value; refusals name the same fault, except that readExpression may meet a semantic fault (1/0) before a later syntax fault. */
function expectAgreement(text: string): void {
  const ours = outcome(readExpression, text);
  const viaNerdamer = outcome(parseValue, text);
  if ("ok" in ours && "ok" in viaNerdamer) {
    expect(viaNerdamer.ok.equals(ours.ok), text).toBe(true);
    expect(viaNerdamer.ok.toInfix(), text).toBe(ours.ok.toInfix());
    return;
  }
  expect("error" in ours && "error" in viaNerdamer, `${text}: one reader accepted it`).toBe(true);
  const [a, b] = [(ours as { error: ValueSyntaxError }).error, (viaNerdamer as { error: ValueSyntaxError }).error];
  if (a.message === b.message) return;
  expect(SEMANTIC.test(a.message) && !SEMANTIC.test(b.message) && a.column < b.column, `${text}: "${a.message}" vs "${b.message}"`).toBe(true);
}

describe("readExpression (our reader, for engine output) and parseValue (nerdamer's parser) agree", () => {
  it("on random expressions without forced brackets", () => {
    fc.assert(fc.property(looseArb, expectAgreement), { numRuns: 400, seed: 7 });
  });

  it("on random bracketed expressions (the generator of the nerdamer check above)", () => {
    fc.assert(fc.property(exprArb, (g) => expectAgreement(g.ours)), { numRuns: 200, seed: 11 });
  });

  it("on random token soup, faults included", () => {
    const piece = fc.constantFrom("R0", "mu", "2", "4.7k", "0", "+", "-", "*", "/", "^", "(", ")", " ", "x(", "1K", "$", "2x", ".", "1e", "^-");
    fc.assert(fc.property(fc.array(piece, { minLength: 0, maxLength: 12 }).map((a) => a.join("")), expectAgreement), { numRuns: 1500, seed: 3 });
  });

  it("on engine output read back: toInfix of a parsed value reads the same both ways", () => {
    fc.assert(
      fc.property(looseArb, (text) => {
        const r = outcome(readExpression, text);
        if ("ok" in r) expectAgreement(r.ok.toInfix());
      }),
      { numRuns: 200, seed: 5 },
    );
  });
});

// ---- long values: past NERDAMER_TEXT_LIMIT our grammar reads them alone ------------------

/** n terms in the shape of printed results, with the productions that leave the fast path mixed in. */
function longTerms(n: number): string[] {
  const names = Array.from({ length: 12 }, (_, i) => (i % 2 ? `Ra_${i}` : `Rb_${i}`));
  const terms: string[] = [];
  for (let i = 0; i < n; i++) {
    const picked = names.filter((_, j) => (i * 7 + j * 3) % 5 < 2);
    const body = picked.map((v, j) => ((i + j) % 4 === 0 ? `${v}^2` : v)).join("*");
    const shape = i % 9;
    if (shape === 0) terms.push(`${i + 1}*${body}/3`);
    else if (shape === 1) terms.push(`-(${body} - 2.5*${names[i % 12]})`);
    else if (shape === 2) terms.push(`(${names[i % 12]} + 1)*${body}`);
    else if (shape === 3) terms.push(`${body}/(${names[i % 2]} + 2)`);
    else terms.push(`${(i % 7) + 1}*${body}`);
  }
  return terms;
}
const longText = (n: number) => longTerms(n).join(" + ");

describe("parseValue on texts longer than nerdamer reads cheaply", () => {
  afterEach(() => vi.restoreAllMocks());
  const text = longText(300);

  it("reads them with our grammar alone, to the value nerdamer's path gives term by term", () => {
    expect(text.length).toBeGreaterThan(NERDAMER_TEXT_LIMIT);
    const tree = treeOf();
    const whole = parseValue(text);
    expect(tree).not.toHaveBeenCalled();
    // Each term alone is short, so it goes through nerdamer's parser.
    const pieces = longTerms(300).map((t) => parseValue(t));
    expect(tree).toHaveBeenCalledTimes(pieces.length);
    expect(whole.equals(pieces.reduce((a, b) => a.add(b)))).toBe(true);
    expect(whole.equals(readExpression(text))).toBe(true);
  });

  it("to what sympy reads", () => {
    expect(askSympy([{ kind: "equal", a: parseValue(text).toInfix(), b: text }])).toEqual([true]);
  });

  it("reads a printed result of 3000 terms back to the same polynomial", () => {
    const printed = parseValue(longText(3000)).num;
    const again = parseValue(printed.toInfix());
    expect(again.num.equals(printed)).toBe(true);
    expect(again.den.isOne()).toBe(true);
  });

  it("names a syntax fault first and with its column, as for a short text", () => {
    const tail = " + 1/0 + R0 + * 3";
    const short = outcome(parseValue, `R1${tail}`);
    const long = outcome(parseValue, `${text}${tail}`);
    expect("error" in short && "error" in long).toBe(true);
    const [a, b] = [(short as { error: ValueSyntaxError }).error, (long as { error: ValueSyntaxError }).error];
    expect(b.message.replace(/\(column \d+\)/, "")).toBe(a.message.replace(/\(column \d+\)/, ""));
    expect(b.column - a.column).toBe(text.length - 2);
    // A bad character anywhere comes before a fault of the grammar or of meaning.
    expect(() => parseValue(`1/0 + ${text} + $`)).toThrow(`unexpected character "$" (column ${text.length + 10})`);
    expect(() => readExpression(`1/0 + ${text} + $`)).toThrow(`unexpected character "$"`);
    expect(() => parseValue(`${text} + 1/0`)).toThrow("division by zero");
  });
});

describe("faults of the characters come before faults of the grammar or of meaning (short texts)", () => {
  it.each([["1/0 + $", 7], ["R0 + * 3 #", 10], ["(a + b $", 8], ["x^y + 1e", 8]])("%s", (text, column) => {
    for (const read of [parseValue, readExpression]) {
      const r = outcome(read, text);
      expect("error" in r && r.error.column, `${read.name} ${text}`).toBe(column);
    }
  });
});
