import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { Poly, Rational, RationalFunction, parseValue, polyGcd } from "../../shared/engine/algebra/index";
import { nonZeroPoly, nonZeroRational, polyArb, smallRational } from "./algebra-arbitraries";
import { askSympy, type SympyQuestion } from "./algebra-sympy";

const runs = { numRuns: 80 };
const F = parseValue;
const rf = fc.tuple(polyArb(3), nonZeroPoly(3)).map(([n, d]) => RationalFunction.from(n, d));
const nonZeroRf = rf.filter((f) => !f.isZero());

describe("RationalFunction: lowest terms and canonical form", () => {
  it("N and D are coprime, D is integer-primitive with a positive leading coefficient", () => {
    fc.assert(
      fc.property(polyArb(3), nonZeroPoly(3), nonZeroPoly(2), (n, d, g) => {
        const f = RationalFunction.from(n.mul(g), d.mul(g));
        expect(polyGcd(f.num, f.den).isOne()).toBe(true);
        expect(f.den.den).toBe(1n);
        expect(f.den.content().isOne()).toBe(true);
        expect(f.den.leadingCoefficient().sign()).toBe(1);
        // the common factor is gone: the same function as n/d
        expect(f.equals(RationalFunction.from(n, d))).toBe(true);
      }),
      runs,
    );
  });

  it("equal functions print equally, however they were built", () => {
    const a = F("(x^2 - y^2)/(x - y)");
    const b = F("x + y");
    expect(a.toInfix()).toBe(b.toInfix());
    expect(F("(2*x + 2)/(4*x*y + 4*y)").toInfix()).toBe("1/(2*y)");
    expect(F("R0/(1 + mu)").toInfix()).toBe("R0/(mu + 1)");
    expect(F("-x/(-y - 1)").toInfix()).toBe("x/(y + 1)");
  });

  it("throws on a zero denominator", () => {
    expect(() => RationalFunction.from(Poly.one(), Poly.zero())).toThrow();
    expect(() => RationalFunction.ZERO.inverse()).toThrow();
  });
});

describe("RationalFunction: one normalized denominator per denominator", () => {
  it("two results over the same det A share the normalized denominator, as the open port's Vth and Rth do", () => {
    // -2*(R1*R2 + R1*R3): content 2 and a negative leading coefficient, so it is normalized.
    const det = F("-2*(R1*R2 + R1*R3 + R2*R3)").num;
    const vth = RationalFunction.from(F("Vs*R2").num, det);
    const rth = RationalFunction.from(F("R1*R2*R3").num, det);
    expect(vth.den.toInfix()).toBe("R1*R2 + R1*R3 + R2*R3");
    expect(vth.num.toInfix()).toBe("-R2*Vs/2");
    expect(rth.den).toBe(vth.den);
  });
});

describe("RationalFunction: field laws (common practice)", () => {
  it("addition and multiplication: commutative, associative, distributive", () => {
    fc.assert(
      fc.property(rf, rf, rf, (a, b, c) => {
        expect(a.add(b).equals(b.add(a))).toBe(true);
        expect(a.mul(b).equals(b.mul(a))).toBe(true);
        expect(a.add(b).add(c).equals(a.add(b.add(c)))).toBe(true);
        expect(a.mul(b.add(c)).equals(a.mul(b).add(a.mul(c)))).toBe(true);
      }),
      { numRuns: 40 },
    );
  });

  it("inverses: a/a = 1, a - a = 0, (a/b)*b = a, pow with negative exponents", () => {
    fc.assert(
      fc.property(rf, nonZeroRf, fc.integer({ min: -3, max: 3 }), (a, b, n) => {
        expect(b.div(b).equals(RationalFunction.ONE)).toBe(true);
        expect(a.sub(a).isZero()).toBe(true);
        expect(a.div(b).mul(b).equals(a)).toBe(true);
        expect(b.pow(n).mul(b.pow(-n)).equals(RationalFunction.ONE)).toBe(true);
      }),
      runs,
    );
  });

  it("exact substitution commutes with arithmetic", () => {
    fc.assert(
      fc.property(rf, rf, smallRational, smallRational, (a, b, x, y) => {
        const at = { x, y };
        let sa: RationalFunction, sb: RationalFunction;
        try {
          sa = a.substitute(at);
          sb = b.substitute(at);
        } catch {
          return; // a denominator vanishes at this point
        }
        expect(a.mul(b).substitute(at).equals(sa.mul(sb))).toBe(true);
      }),
      runs,
    );
  });

  it("substituteExpressions composes: F(G) evaluated equals F evaluated at G's value", () => {
    fc.assert(
      fc.property(rf, rf, nonZeroRational, nonZeroRational, nonZeroRational, (f, g, x, y, z) => {
        let composed: RationalFunction;
        try {
          composed = f.substituteExpressions({ x: g });
        } catch {
          return;
        }
        const at = { x, y, z };
        let direct: RationalFunction, gv: RationalFunction, fv: RationalFunction;
        try {
          gv = g.substitute(at);
          fv = f.substitute({ x: gv.constantValue()!, y, z });
          direct = composed.substitute(at);
        } catch {
          return;
        }
        expect(direct.equals(fv)).toBe(true);
      }),
      runs,
    );
  });
});

describe("calculus", () => {
  it("quotient rule: d(a/b) = (a' b - a b')/b^2 and d(a*b) = a' b + a b'", () => {
    fc.assert(
      fc.property(rf, rf, (a, b) => {
        const lhs = a.mul(b).derivative("x");
        expect(lhs.equals(a.derivative("x").mul(b).add(a.mul(b.derivative("x"))))).toBe(true);
      }),
      { numRuns: 40 },
    );
  });

  it("sensitivity of x^n*y is n; of R0/(1 + mu) to mu is -mu/(1 + mu) (from memory)", () => {
    expect(F("3*x^4*y").sensitivity("x").toInfix()).toBe("4");
    expect(F("R0/(1 + mu)").sensitivity("mu").toInfix()).toBe("-mu/(mu + 1)");
    expect(F("R0/(1 + mu)").sensitivity("R0").toInfix()).toBe("1");
  });
});

describe("limits and leading-order forms (checked against sympy)", () => {
  const cases: Array<[string, string, "inf" | "zero"]> = [
    ["mu*vs/(1 + mu)", "mu", "inf"], // another library gives 0 here; the right answer is vs
    ["R0/(1 + mu)", "mu", "inf"],
    ["R0/(1 + mu)", "mu", "zero"],
    ["(A*R2)/(R1 + R2 + A*R1)", "A", "inf"],
    ["(x^2 + 1)/(x + 3)", "x", "inf"],
    ["-(x^2 + 1)/(x + 3)", "x", "inf"],
    ["(x + 1)/x^2", "x", "zero"],
    ["gm*RL*ro/(ro + RL)", "ro", "inf"],
    ["(s*C*R + 1)/(s*C)", "s", "zero"],
    ["(s*C*R + 1)/(s*C)", "s", "inf"],
    ["(a*x^2 + b)/(c*x + d)", "x", "inf"],
  ];

  it("limits equal sympy's", () => {
    const questions: SympyQuestion[] = [];
    const undetermined: string[] = [];
    for (const [expr, v, to] of cases) {
      const l = F(expr).limit(v, to);
      if (l.kind === "infinite" && l.sign === 0) {
        undetermined.push(expr);
        continue;
      }
      const ours = l.kind === "finite" ? l.value.toInfix() : l.sign > 0 ? "oo" : "-oo";
      questions.push({ kind: "limit", expr, symbol: v, to, ours });
    }
    // Unbounded with a sign that depends on another symbol (C, or a and c).
    expect(undetermined).toEqual(["(s*C*R + 1)/(s*C)", "(a*x^2 + b)/(c*x + d)"]);
    expect(askSympy(questions)).toEqual(questions.map(() => true));
  });

  it("sensitivities equal sympy's (x/F)·dF/dx on random functions, of degree 0 to 3 in the symbol", () => {
    // Degree 2 in x and y exercises the cross terms of unequal powers beyond the multilinear case.
    const questions: SympyQuestion[] = fc.sample(nonZeroRf, { numRuns: 40, seed: 15 }).flatMap((f) =>
      ["x", "y", "z"].map((v): SympyQuestion => ({ kind: "sensitivity", expr: f.toInfix(), symbol: v, ours: f.sensitivity(v).toInfix() })),
    );
    // A multilinear function in many symbols, as the resistances of a network give, and one with large coefficients.
    for (const expr of ["(R1*R2 + R2*R3 + R1*R3)/(R1 + 2*R2 + R3*R4)", "(9007199254740991*a*b + 3*b)/(a^2*b + 123456789012*a + 7)"]) {
      for (const v of F(expr).variables()) questions.push({ kind: "sensitivity", expr, symbol: v, ours: F(expr).sensitivity(v).toInfix() });
    }
    expect(askSympy(questions)).toEqual(questions.map(() => true));
  });

  it("a sum of products in one pass equals the products added (sympy), with rational and with large coefficients", () => {
    const pairs = fc.sample(fc.array(fc.tuple(polyArb(4), polyArb(4)), { minLength: 1, maxLength: 3 }), { numRuns: 40, seed: 15 });
    pairs.push([[F("9007199254740991*x + y").num, F("x*y + 3").num], [F("x - y").num, F("2*x").num]]);
    const questions: SympyQuestion[] = pairs.map((ps) => ({
      kind: "equal",
      a: Poly.sumOfProducts(ps).toInfix(),
      b: ps.map(([x, y]) => `(${x.toInfix()})*(${y.toInfix()})`).join(" + "),
    }));
    expect(askSympy(questions)).toEqual(questions.map(() => true));
  });

  it("mu*vs/(1 + mu) -> vs as mu -> inf", () => {
    const l = F("mu*vs/(1 + mu)").limit("mu", "inf");
    expect(l.kind === "finite" && l.value.toInfix()).toBe("vs");
  });

  it("leading-order forms: R0/(1 + mu) ~ R0/mu; the ratio to the function tends to 1 (sympy)", () => {
    expect(F("R0/(1 + mu)").leadingOrder("mu", "inf").toInfix()).toBe("R0/mu");
    expect(F("R0/(1 + mu)").leadingOrder("mu", "zero").toInfix()).toBe("R0");
    const questions: SympyQuestion[] = cases.slice(0, -1).map(([expr, v, to]) => ({
      kind: "limit",
      expr: `(${F(expr).leadingOrder(v, to).toInfix()})/(${expr})`,
      symbol: v,
      to,
      ours: "1",
    }));
    expect(askSympy(questions)).toEqual(questions.map(() => true));
  });
});

describe("solveFor (linear-fractional)", () => {
  it("solves a voltage divider for the lower resistor (from memory: R2 = R1*k/(1 - k))", () => {
    const k = F("k");
    const r2 = F("R2/(R1 + R2)").solveFor("R2", k);
    expect(r2!.equals(F("R1*k/(1 - k)"))).toBe(true);
  });

  it("the solution satisfies the equation on random linear-fractional functions", () => {
    fc.assert(
      fc.property(polyArb(2), polyArb(2), polyArb(2), polyArb(2), smallRational, (a, b, c, d, t) => {
        const x = Poly.variable("x");
        const yz = (p: Poly) => p.substitute({ x: Rational.ZERO }); // coefficients free of x
        const num = yz(a).mul(x).add(yz(b));
        const den = yz(c).mul(x).add(yz(d));
        if (den.isZero()) return;
        const f = RationalFunction.from(num, den);
        const target = RationalFunction.constant(t);
        const sol = f.solveFor("x", target);
        if (sol === null) return;
        expect(f.substituteExpressions({ x: sol }).equals(target)).toBe(true);
      }),
      runs,
    );
  });

  it("returns null when not linear-fractional, when x is absent, or with no unique solution", () => {
    expect(F("x^2 + 1").solveFor("x", F("3"))).toBeNull();
    expect(F("y + 1").solveFor("x", F("3"))).toBeNull();
    expect(F("(2*x + 2)/(x + 1)").solveFor("x", F("3"))).toBeNull(); // identically 2
  });
});

describe("printing", () => {
  it("toInfix and compactInfix are read back by sympy as the same function", () => {
    const samples = fc.sample(fc.tuple(polyArb(4), nonZeroPoly(3), nonZeroPoly(2)), { numRuns: 30, seed: 3 });
    const questions: SympyQuestion[] = [];
    for (const [n, d, g] of samples) {
      const f = RationalFunction.from(n.mul(g), d.mul(g));
      const original = `(${n.mul(g).toInfix()})/(${d.mul(g).toInfix()})`;
      questions.push({ kind: "equal", a: f.toInfix(), b: original });
      questions.push({ kind: "equal", a: f.compactInfix(), b: original });
    }
    for (const text of ["(Ra + Rb)*(Rc + Rd)*x^2/(3*y)", "-R0*(1 + mu)/(2*mu^2*(Rs + 1))", "gm*R0*RL/(R0 + RL)", "3/4", "-x"]) {
      questions.push({ kind: "equal", a: F(text).compactInfix(), b: text });
    }
    expect(askSympy(questions)).toEqual(questions.map(() => true));
  });

  it("compact form pulls out contents, monomials and grouped factors", () => {
    expect(F("(Ra + Rb)*(Rc + Rd)*x^2/(3*y)").compactInfix()).toBe("x^2*(Ra + Rb)*(Rc + Rd)/(3*y)");
    expect(F("2*R0*mu + 2*R0").compactInfix()).toBe("2*R0*(mu + 1)");
    expect(F("mu + 1").compactInfix()).toBe("mu + 1");
    expect(F("-(mu + 1)").compactInfix()).toBe("-(mu + 1)");
    expect(F("R0*(1 + mu)/mu^2").toTex()).toBe("\\frac{R_{0}\\,\\mu + R_{0}}{\\mu^{2}}");
    expect(F("R0*(1 + mu)/mu^2").compactTex()).toBe("\\frac{R_{0}\\,\\left(\\mu + 1\\right)}{\\mu^{2}}");
  });
});
