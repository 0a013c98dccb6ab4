// fast-check generators for the algebra's property tests.

import fc from "fast-check";
import { Poly, Rational } from "../../shared/engine/algebra/index";

export const smallRational = fc
  .tuple(fc.integer({ min: -9, max: 9 }), fc.integer({ min: 1, max: 4 }))
  .map(([n, d]) => Rational.of(n, d));

export const nonZeroRational = smallRational.filter((r) => !r.isZero());

const monomial = fc.record({
  x: fc.integer({ min: 0, max: 2 }),
  y: fc.integer({ min: 0, max: 2 }),
  z: fc.integer({ min: 0, max: 1 }),
});

/** Polynomials in x, y, z with up to `maxTerms` terms of small degree and small rational coefficients. */
export function polyArb(maxTerms = 4, integer = false): fc.Arbitrary<Poly> {
  const coef = integer ? fc.integer({ min: -5, max: 5 }).map((n) => Rational.of(n)) : smallRational;
  return fc
    .array(fc.record({ coefficient: coef, monomial }), { minLength: 0, maxLength: maxTerms })
    .map((terms) => Poly.fromTerms(terms));
}

export const nonZeroPoly = (maxTerms = 4, integer = false) => polyArb(maxTerms, integer).filter((p) => !p.isZero());

/** Square matrices of small polynomials. */
export function matrixArb(n: number, maxTerms = 2): fc.Arbitrary<Poly[][]> {
  return fc.array(fc.array(polyArb(maxTerms, true), { minLength: n, maxLength: n }), { minLength: n, maxLength: n });
}
