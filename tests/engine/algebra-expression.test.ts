import { describe, expect, it } from "vitest";
import fc from "fast-check";
import nerdamer from "nerdamer";
import { Rational, ValueSyntaxError, formatSI, parseSI, parseValue } from "../../shared/engine/algebra/index";
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

describe("parseValue: errors name the column", () => {
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
      parseValue(text);
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
