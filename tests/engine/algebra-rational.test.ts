import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { Rational } from "../../shared/engine/algebra/index";
import { nonZeroRational, smallRational } from "./algebra-arbitraries";

const runs = { numRuns: 200 };

describe("Rational: field laws (common practice)", () => {
  it("addition and multiplication are commutative and associative", () => {
    fc.assert(
      fc.property(smallRational, smallRational, smallRational, (a, b, c) => {
        expect(a.add(b).equals(b.add(a))).toBe(true);
        expect(a.mul(b).equals(b.mul(a))).toBe(true);
        expect(a.add(b).add(c).equals(a.add(b.add(c)))).toBe(true);
        expect(a.mul(b).mul(c).equals(a.mul(b.mul(c)))).toBe(true);
      }),
      runs,
    );
  });

  it("multiplication distributes over addition; inverses cancel", () => {
    fc.assert(
      fc.property(smallRational, smallRational, nonZeroRational, (a, b, c) => {
        expect(c.mul(a.add(b)).equals(c.mul(a).add(c.mul(b)))).toBe(true);
        expect(c.mul(c.inverse()).isOne()).toBe(true);
        expect(a.sub(a).isZero()).toBe(true);
        expect(a.div(c).mul(c).equals(a)).toBe(true);
      }),
      runs,
    );
  });

  it("is always normalized: gcd(num, den) = 1, den > 0", () => {
    fc.assert(
      fc.property(fc.bigInt(-(10n ** 20n), 10n ** 20n), fc.bigInt(1n, 10n ** 12n), fc.boolean(), (n, d, negDen) => {
        const r = Rational.of(n, negDen ? -d : d);
        expect(r.den > 0n).toBe(true);
        const g = (a: bigint, b: bigint): bigint => (b === 0n ? (a < 0n ? -a : a) : g(b, a % b));
        expect(g(r.num, r.den)).toBe(1n);
        // same value: n/d = r.num/r.den
        expect(r.num * (negDen ? -d : d)).toBe(n * r.den);
      }),
      runs,
    );
  });

  it("compare agrees with floating-point order on small values", () => {
    fc.assert(
      fc.property(smallRational, smallRational, (a, b) => {
        expect(a.compare(b)).toBe(Math.sign(a.toNumber() - b.toNumber()));
      }),
      runs,
    );
  });
});

describe("Rational.parseDecimal is exact", () => {
  it.each([
    ["4.7", "47/10"],
    ["1e-3", "1/1000"],
    ["2.2E6", "2200000"],
    ["-0.125", "-1/8"],
    [".5", "1/2"],
    ["3.", "3"],
    ["0.1", "1/10"],
  ])("%s = %s", (text, expected) => {
    expect(Rational.parseDecimal(text).toString()).toBe(expected);
  });

  it("0.1 + 0.2 is exactly 3/10 (unlike binary floating point, common practice)", () => {
    expect(Rational.parseDecimal("0.1").add(Rational.parseDecimal("0.2")).toString()).toBe("3/10");
  });

  it("rejects malformed numbers", () => {
    for (const bad of ["", "1.2.3", "e5", "1e", "--1", "abc"]) expect(() => Rational.parseDecimal(bad)).toThrow();
  });

  it("of() refuses non-integer numbers and zero denominators", () => {
    expect(() => Rational.of(1.5)).toThrow();
    expect(() => Rational.of(1, 0)).toThrow();
    expect(() => Rational.ZERO.inverse()).toThrow();
  });
});
