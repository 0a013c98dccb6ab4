import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { Poly, Rational, parseValue, reciprocalSubstitute } from "../../shared/engine/algebra/index";
import { nonZeroRational, polyArb, smallRational } from "./algebra-arbitraries";
import { askSympy, type SympyQuestion } from "./algebra-sympy";
import { evalMod, invMod, mulMod, residue } from "../../shared/engine/algebra/modular";
import { CHAIN_MIN_TERMS } from "../../shared/engine/algebra/polynomial-calculus";
import { TermTable } from "../../shared/engine/algebra/term-table";

const runs = { numRuns: 150 };
const p = polyArb(4);

describe("Poly: commutative ring axioms (common practice)", () => {
  it("addition is commutative and associative with identity 0 and inverses", () => {
    fc.assert(
      fc.property(p, p, p, (a, b, c) => {
        expect(a.add(b).equals(b.add(a))).toBe(true);
        expect(a.add(b).add(c).equals(a.add(b.add(c)))).toBe(true);
        expect(a.add(Poly.zero()).equals(a)).toBe(true);
        expect(a.sub(a).isZero()).toBe(true);
        expect(a.add(a.neg()).isZero()).toBe(true);
      }),
      runs,
    );
  });

  it("multiplication is commutative and associative with identity 1", () => {
    fc.assert(
      fc.property(p, p, p, (a, b, c) => {
        expect(a.mul(b).equals(b.mul(a))).toBe(true);
        expect(a.mul(b).mul(c).equals(a.mul(b.mul(c)))).toBe(true);
        expect(a.mul(Poly.one()).equals(a)).toBe(true);
        expect(a.mul(Poly.zero()).isZero()).toBe(true);
      }),
      runs,
    );
  });

  it("multiplication distributes over addition: a(b + c) = ab + ac", () => {
    fc.assert(
      fc.property(p, p, p, (a, b, c) => {
        expect(a.mul(b.add(c)).equals(a.mul(b).add(a.mul(c)))).toBe(true);
      }),
      runs,
    );
  });

  it("scale and pow agree with repeated multiplication", () => {
    fc.assert(
      fc.property(p, smallRational, fc.integer({ min: 0, max: 4 }), (a, r, n) => {
        expect(a.scale(r).equals(a.mul(Poly.constant(r)))).toBe(true);
        let q = Poly.one();
        for (let i = 0; i < n; i++) q = q.mul(a);
        expect(a.pow(n).equals(q)).toBe(true);
      }),
      runs,
    );
  });

  it("evaluation is a ring homomorphism (exact at rational points)", () => {
    fc.assert(
      fc.property(p, p, smallRational, smallRational, smallRational, (a, b, x, y, z) => {
        const at = { x, y, z };
        const v = (q: Poly) => q.substitute(at).constantValue()!;
        expect(v(a.add(b)).equals(v(a).add(v(b)))).toBe(true);
        expect(v(a.mul(b)).equals(v(a).mul(v(b)))).toBe(true);
        const fl = { x: x.toNumber(), y: y.toNumber(), z: z.toNumber() };
        expect(Math.abs(a.evaluate(fl) - v(a).toNumber())).toBeLessThan(1e-9 * (1 + Math.abs(v(a).toNumber())));
      }),
      runs,
    );
  });

  it("a long expansion (evaluated by running products over shared prefixes) has the value of its closed form, in floats and modulo the prime", () => {
    // (1 + x + 2y² − 3z + xyz/2)^6 expanded has far more terms than CHAIN_MIN_TERMS; its value at a
    // point is the base's value to the sixth (the multinomial theorem, common practice).
    const base = Poly.fromTerms([
      { coefficient: 1, monomial: {} },
      { coefficient: 1, monomial: { x: 1 } },
      { coefficient: 2, monomial: { y: 2 } },
      { coefficient: -3, monomial: { z: 1 } },
      { coefficient: Rational.of(1, 2), monomial: { x: 1, y: 1, z: 1 } },
    ]);
    const long = base.pow(6);
    expect(long.termCount()).toBeGreaterThan(CHAIN_MIN_TERMS);
    fc.assert(
      fc.property(nonZeroRational, nonZeroRational, nonZeroRational, (x, y, z) => {
        const exact = base.substitute({ x, y, z }).constantValue()!.pow(6);
        const { value, error } = long.evaluateWithError({ x: x.toNumber(), y: y.toNumber(), z: z.toNumber() });
        expect(Math.abs(value - exact.toNumber())).toBeLessThanOrEqual(error);
        const at = new Map([x, y, z].map((r, i) => ["xyz"[i], mulMod(residue(r.num), invMod(residue(r.den)))]));
        expect(evalMod(long, at)).toBe(mulMod(residue(exact.num), invMod(residue(exact.den))));
      }),
      { numRuns: 60 },
    );
  });

  it("residues agree with BigInt remainders on both sides of 2^53 (where a double stops being exact)", () => {
    const prime = 67108859n;
    for (const c of [0n, 1n, -1n, 2n ** 53n - 1n, 2n ** 53n, 2n ** 53n + 1n, -(2n ** 53n) - 3n, 3n ** 40n, -(7n ** 30n)]) {
      expect(residue(c)).toBe(Number(((c % prime) + prime) % prime));
    }
  });

  it("derivative: product rule and linearity", () => {
    fc.assert(
      fc.property(p, p, fc.constantFrom("x", "y", "z"), (a, b, v) => {
        expect(a.mul(b).derivative(v).equals(a.derivative(v).mul(b).add(a.mul(b.derivative(v))))).toBe(true);
        expect(a.add(b).derivative(v).equals(a.derivative(v).add(b.derivative(v)))).toBe(true);
      }),
      runs,
    );
  });

  it("coefficientIn reassembles the polynomial: p = sum_k coeff_k v^k", () => {
    fc.assert(
      fc.property(p, fc.constantFrom("x", "y", "z"), (a, v) => {
        const deg = Math.max(0, a.degreeIn(v));
        let sum = Poly.zero();
        for (let k = 0; k <= deg; k++) sum = sum.add(a.coefficientIn(v, k).mul(Poly.variable(v).pow(k)));
        expect(sum.equals(a)).toBe(true);
        if (!a.isZero()) expect(a.lowDegreeIn(v)).toBeLessThanOrEqual(a.degreeIn(v));
      }),
      runs,
    );
  });

  it("content times primitive part gives back p, with integer coefficients of gcd 1", () => {
    fc.assert(
      fc.property(p.filter((q) => !q.isZero()), (a) => {
        const c = a.content();
        expect(c.sign()).toBe(1);
        const prim = a.scale(c.inverse());
        expect(prim.den).toBe(1n);
        expect(prim.content().isOne()).toBe(true);
      }),
      runs,
    );
  });

  it("equal values have identical canonical printing, whatever the construction order", () => {
    fc.assert(
      fc.property(p, p, (a, b) => {
        expect(a.add(b).toInfix()).toBe(b.add(a).toInfix());
        expect(Poly.fromTerms(a.terms().reverse()).toInfix()).toBe(a.toInfix());
      }),
      runs,
    );
  });
});

describe("Poly: structure and printing", () => {
  const R0 = Poly.variable("R0");
  const mu = Poly.variable("mu");
  const gm = Poly.variable("gm");

  it("prints graded-lexicographic canonical order", () => {
    expect(R0.mul(mu).add(R0).toInfix()).toBe("R0*mu + R0");
    expect(gm.pow(2).scale(Rational.of(-2)).add(R0).toInfix()).toBe("-2*gm^2 + R0");
    expect(Poly.constant(Rational.of(3, 2)).mul(R0).sub(Poly.one()).toInfix()).toBe("3*R0/2 - 1");
    expect(Poly.zero().toInfix()).toBe("0");
  });

  it("large products and reciprocal substitutions come out in graded-lexicographic order (checked term by term)", () => {
    // Twelve variables of degree 7: 36 bits of exponents, past one 32-bit word; 4096 terms, past one radix digit.
    const names = Array.from({ length: 12 }, (_, i) => `a_${i + 1}`);
    let q = Poly.one();
    for (const name of names) q = q.mul(Poly.one().add(Poly.variable(name).pow(7)));
    // Twenty multilinear variables, every one replaced by its reciprocal: the order reverses wholesale.
    const gs = Array.from({ length: 20 }, (_, i) => `g_${i + 1}`);
    let m = Poly.one();
    for (let i = 0; i < gs.length; i += 2) m = m.mul(Poly.variable(gs[i]).add(Poly.variable(gs[i + 1])).add(Poly.one()));
    const { poly: r } = reciprocalSubstitute(m, Object.fromEntries(gs.map((g, i) => [g, `R_${i + 1}`])));
    for (const [poly, vars] of [[q, names], [r, gs.map((_, i) => `R_${i + 1}`)]] as const) {
      const rows = poly.terms().map((t) => vars.map((v) => t.monomial[v] ?? 0));
      expect(rows.length).toBeGreaterThan(2048);
      for (let t = 1; t < rows.length; t++) {
        const [a, b] = [rows[t - 1], rows[t]];
        const [da, db] = [a.reduce((x, y) => x + y, 0), b.reduce((x, y) => x + y, 0)];
        const first = a.findIndex((x, v) => x !== b[v]);
        // Higher total degree first, then the larger exponent at the first variable where they differ.
        expect(da > db || (da === db && first >= 0 && a[first] > b[first])).toBe(true);
      }
    }
  });

  it("natural order of names: Ra_2 before Ra_10", () => {
    const q = Poly.variable("Ra_10").add(Poly.variable("Ra_2"));
    expect(q.variables()).toEqual(["Ra_2", "Ra_10"]);
    expect(q.toInfix()).toBe("Ra_2 + Ra_10");
  });

  it("TeX: Greek names and subscripts", () => {
    expect(R0.mul(mu).add(R0).toTex()).toBe("R_{0}\\,\\mu + R_{0}");
    expect(Poly.variable("beta_1").toTex()).toBe("\\beta_{1}");
    expect(Poly.variable("r_pi").pow(2).toTex()).toBe("r_{\\pi}^{2}");
  });

  it("degrees of the zero polynomial", () => {
    expect(Poly.zero().degreeIn("x")).toBe(-Infinity);
    expect(Poly.zero().isConstant()).toBe(true);
    expect(Poly.zero().constantValue()!.isZero()).toBe(true);
  });

  it("evaluate needs every variable", () => {
    expect(() => R0.add(mu).evaluate({ R0: 1 })).toThrow();
  });

  it("keeps exactness with huge coefficients (beyond 2^53)", () => {
    const big = Poly.constant(2n ** 80n + 1n).mul(Poly.variable("x")).add(Poly.one());
    const sq = big.mul(big);
    expect(sq.coefficientIn("x", 2).constantValue()!.num).toBe((2n ** 80n + 1n) ** 2n);
  });

  it("products and sums whose coefficients pass 2^53 stay exact (double fast path falls back to BigInt)", () => {
    fc.assert(
      fc.property(fc.array(fc.bigInt(-(2n ** 31n), 2n ** 31n), { minLength: 4, maxLength: 4 }), ([a, b, c, d]) => {
        const x = Poly.variable("x");
        const y = Poly.variable("y");
        const p = x.scale(Rational.of(a)).add(y.scale(Rational.of(b))).add(Poly.constant(c));
        const q = x.scale(Rational.of(d)).add(y.scale(Rational.of(a))).add(Poly.constant(b));
        const pq = p.mul(q);
        // (a x + b y + c)(d x + a y + b): coefficients by hand
        expect(pq.coefficientIn("x", 2).constantValue()!.num).toBe(a * d);
        expect(pq.coefficientIn("x", 1).coefficientIn("y", 1).constantValue()!.num).toBe(a * a + b * d);
        expect(pq.coefficientIn("x", 0).coefficientIn("y", 0).constantValue()!.num).toBe(c * b);
        expect(pq.mul(pq).sub(pq.pow(2)).isZero()).toBe(true);
      }),
      { numRuns: 50 },
    );
  });

  it("works with many variables (packed keys beyond 53 bits fall back to BigInt keys)", () => {
    // 40 variables of degree up to 3 need 80 bits of key.
    const vs = Array.from({ length: 40 }, (_, i) => Poly.variable(`v${i}`));
    const s = vs.reduce((acc, v) => acc.add(v), Poly.zero());
    const cube = s.mul(s).mul(s);
    expect(cube.termCount()).toBe(11480); // C(42, 3) monomials of degree 3 in 40 variables
    const at: Record<string, number> = {};
    vs.forEach((_, i) => (at[`v${i}`] = 1));
    expect(cube.evaluate(at)).toBe(64000);
  });
});

describe("Poly.toInfix is read back by sympy as the same polynomial", () => {
  it("random polynomials", () => {
    const samples = fc.sample(fc.tuple(polyArb(5), polyArb(3)), { numRuns: 40, seed: 7 });
    const questions: SympyQuestion[] = samples.map(([a, b]) => ({
      kind: "equal",
      a: a.mul(b).toInfix(),
      b: `(${a.toInfix()})*(${b.toInfix()})`,
    }));
    // Also a few with names sympy knows as functions or constants, which must stay symbols.
    const named = parseValue("beta*gamma + S*E - 3*N/2").num;
    questions.push({ kind: "equal", a: named.toInfix(), b: "beta*gamma + S*E - 3*N/2" });
    expect(askSympy(questions).every((ok) => ok === true)).toBe(true);
  });

  it("a long polynomial (printed as bytes) reads back in sympy, and its first terms print as the short polynomial of those terms", () => {
    // (3/2 − x + y²z − 5z/3 + 2xyz)^6: rational coefficients of both signs, powers, 200-odd terms.
    const base = parseValue("3/2 - x + y^2*z - 5*z/3 + 2*x*y*z").num;
    const long = base.pow(6);
    expect(long.termCount()).toBeGreaterThan(CHAIN_MIN_TERMS);
    const head = Poly.fromTerms(long.terms().slice(0, CHAIN_MIN_TERMS - 1));
    for (const [whole, part] of [[long.toInfix(), head.toInfix()], [long.toTex(), head.toTex()]]) {
      expect(whole.startsWith(part)).toBe(true);
      expect(whole[part.length]).toBe(" "); // the next term follows, whole
    }
    expect(askSympy([{ kind: "equal", a: long.toInfix(), b: `(${base.toInfix()})^6` }])).toEqual([true]);
  });
});

describe("reciprocalSubstitute: admittance to impedance", () => {
  it("G1*G2 + G1 + G2 with G -> 1/R, times R1*R2, is 1 + R2 + R1", () => {
    const g = parseValue("G1*G2 + G1 + G2").num;
    const { poly, multiplier } = reciprocalSubstitute(g, { G1: "R1", G2: "R2" });
    expect(poly.toInfix()).toBe("R1 + R2 + 1");
    expect(multiplier.toInfix()).toBe("R1*R2");
  });

  it("agrees with exact substitution at random points: poly/multiplier = p(1/r)", () => {
    fc.assert(
      fc.property(polyArb(5), nonZeroRational, nonZeroRational, (a, rx, ry) => {
        const { poly, multiplier } = reciprocalSubstitute(a, { x: "rx", y: "ry" });
        const direct = a.substitute({ x: rx.inverse(), y: ry.inverse() });
        const at = { rx, ry };
        const lhs = poly.substitute(at);
        const m = multiplier.substitute(at).constantValue()!;
        expect(lhs.equals(direct.scale(m))).toBe(true);
      }),
      runs,
    );
  });

  it("a target that already occurs merges terms exactly", () => {
    const q = parseValue("g*r + 1").num; // (1/r)*r + 1 = 2, times r
    const { poly, multiplier } = reciprocalSubstitute(q, { g: "r" });
    expect(poly.toInfix()).toBe("2*r");
    expect(multiplier.toInfix()).toBe("r");
  });
});

describe("TermTable: tables reuse their arrays, and a reused table starts empty", () => {
  it("interleaved, abandoned and reused tables each sum their own terms (against a Map of sums)", () => {
    fc.assert(
      fc.property(fc.array(fc.tuple(fc.integer({ min: 0, max: 5000 }), fc.integer({ min: -9, max: 9 })), { maxLength: 3000 }), fc.integer({ min: 1, max: 4000 }), (terms, expected) => {
        const reference = new Map<number, number>();
        for (const [k, c] of terms) reference.set(k, (reference.get(k) ?? 0) + c);
        // A table abandoned half-way (as after an overflow), then two in use at once.
        const abandoned = new TermTable(expected);
        for (const [k, c] of terms.slice(0, terms.length >> 1)) abandoned.add(k, c + 1);
        const outer = new TermTable(expected);
        const inner = new TermTable(expected >> 1);
        for (const [k, c] of terms) {
          outer.add(k, c);
          inner.add(k + 7, 2 * c);
        }
        const innerSums = inner.result();
        const fresh = new TermTable(expected); // takes the arrays inner gave back
        for (const [k, c] of terms) fresh.add(k, c);
        for (const table of [outer.result(), fresh.result()]) {
          const got = new Map(Array.from(table.keys, (k, i) => [k, table.coefs[i]]));
          expect(got).toEqual(new Map([...reference].filter(([, c]) => c !== 0)));
        }
        expect(new Map(Array.from(innerSums.keys, (k, i) => [k - 7, innerSums.coefs[i] / 2]))).toEqual(new Map([...reference].filter(([, c]) => c !== 0)));
      }),
      { numRuns: 60 },
    );
  });
});
