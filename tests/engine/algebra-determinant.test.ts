import { describe, expect, it } from "vitest";
import fc from "fast-check";
import {
  Poly, cofactor, cofactorsOf, determinant, determinantBareiss, identityMatrix, matrixMultiply, matrixRank, matrixVector, parseValue, solveCramer,
} from "../../shared/engine/algebra/index";
import { matrixArb, polyArb } from "./algebra-arbitraries";
import { askSympy, type SympyQuestion } from "./algebra-sympy";

const P = (s: string) => parseValue(s).num;
const size = fc.integer({ min: 1, max: 4 });
const squarePair = size.chain((n) => fc.tuple(matrixArb(n), matrixArb(n)));

describe("determinant: laws (common practice)", () => {
  it("product rule det(AB) = det(A) det(B) on small random matrices", () => {
    fc.assert(
      fc.property(squarePair, ([a, b]) => {
        expect(determinant(matrixMultiply(a, b)).equals(determinant(a).mul(determinant(b)))).toBe(true);
      }),
      { numRuns: 60 },
    );
  });

  it("a triangular matrix has the product of its diagonal as determinant", () => {
    fc.assert(
      fc.property(size.chain((n) => fc.tuple(fc.constant(n), matrixArb(n))), ([n, m]) => {
        const upper = m.map((row, i) => row.map((e, j) => (j < i ? Poly.zero() : e)));
        const lower = m.map((row, i) => row.map((e, j) => (j > i ? Poly.zero() : e)));
        const diag = m.reduce((acc, row, i) => acc.mul(row[i]), Poly.one());
        expect(determinant(upper).equals(diag)).toBe(true);
        expect(determinant(lower).equals(diag)).toBe(true);
        expect(n).toBe(m.length);
      }),
      { numRuns: 60 },
    );
  });

  it("agrees with Bareiss elimination; swapping two rows flips the sign", () => {
    fc.assert(
      fc.property(fc.integer({ min: 2, max: 5 }).chain((n) => matrixArb(n)), (m) => {
        const d = determinant(m);
        expect(d.equals(determinantBareiss(m))).toBe(true);
        const swapped = [m[1], m[0], ...m.slice(2)];
        expect(determinant(swapped).equals(d.neg())).toBe(true);
      }),
      { numRuns: 60 },
    );
  });

  it("rational entries: det of the scaled matrix scales by c^n", () => {
    const m = [[P("x/2"), P("1/3")], [P("y"), P("x + 1/4")]];
    expect(determinant(m).toInfix()).toBe(P("x/2*(x + 1/4) - y/3").toInfix());
  });

  it("A adj(A) = det(A) I (cofactors)", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 4 }).chain((n) => matrixArb(n)), (m) => {
        const n = m.length;
        const table = cofactorsOf(m);
        const adj = Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => table.cofactor(j, i)));
        const prod = matrixMultiply(m, adj);
        const d = table.determinant();
        const expected = identityMatrix(n).map((row) => row.map((e) => e.mul(d)));
        expect(prod.every((row, i) => row.every((e, j) => e.equals(expected[i][j])))).toBe(true);
      }),
      { numRuns: 50 },
    );
  });
});

describe("solveCramer", () => {
  it("A x = b: A * numerators = det * b", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 4 }).chain((n) => fc.tuple(matrixArb(n), fc.array(polyArb(2, true), { minLength: n, maxLength: n }))),
        ([a, b]) => {
          const { det, numerators } = solveCramer(a, b);
          const lhs = matrixVector(a, numerators);
          expect(lhs.every((e, i) => e.equals(b[i].mul(det)))).toBe(true);
        },
      ),
      { numRuns: 60 },
    );
  });

  it("a voltage divider's node equations: x = G1 Vs/(G1 + G2)", () => {
    // One node between G1 (to a source Vs) and G2 (to ground): (G1 + G2) v = G1 Vs.
    const { det, numerators } = solveCramer([[P("G1 + G2")]], [P("G1*Vs")]);
    expect(`${numerators[0].toInfix()} / ${det.toInfix()}`).toBe("G1*Vs / G1 + G2");
  });

  it("a singular system gives det = 0", () => {
    expect(solveCramer([[P("x"), P("y")], [P("2*x"), P("2*y")]], [P("1"), P("0")]).det.isZero()).toBe(true);
  });

  it("cofactor C_ij carries the sign (-1)^(i+j)", () => {
    const m = [[P("a"), P("b")], [P("c"), P("d")]];
    expect(cofactor(m, 0, 1).toInfix()).toBe("-c");
    expect(cofactor(m, 1, 0).toInfix()).toBe("-b");
  });
});

describe("determinant agrees with sympy (Berkowitz) on symbolic matrices", () => {
  it("tridiagonal nodal matrices and random dense ones", () => {
    const tri = (n: number) =>
      Array.from({ length: n }, (_, i) =>
        Array.from({ length: n }, (_, j) => {
          if (i === j) return P(i < n - 1 ? `Ga_${i + 1} + Gb_${i + 1} + Ga_${i + 2}` : `Ga_${i + 1} + Gb_${i + 1}`);
          if (j === i + 1) return P(`-Ga_${i + 2}`);
          if (j === i - 1) return P(`-Ga_${i + 1}`);
          return Poly.zero();
        }),
      );
    const mats = [tri(3), tri(5), ...fc.sample(fc.integer({ min: 2, max: 4 }).chain((n) => matrixArb(n, 3)), { numRuns: 10, seed: 5 })];
    const questions: SympyQuestion[] = mats.map((m) => ({
      kind: "det",
      rows: m.map((row) => row.map((e) => e.toInfix())),
      ours: determinant(m).toInfix(),
    }));
    expect(askSympy(questions)).toEqual(questions.map(() => true));
  });

  it("the ladder determinant counts spanning trees: 2 sections 3 terms, 5 sections 89 terms (Fibonacci, from memory)", () => {
    const m = (n: number) =>
      Array.from({ length: n }, (_, i) =>
        Array.from({ length: n }, (_, j) => {
          if (i === j) return P(i < n - 1 ? `Ga_${i + 1} + Gb_${i + 1} + Ga_${i + 2}` : `Ga_${i + 1} + Gb_${i + 1}`);
          if (Math.abs(i - j) === 1) return P(`-Ga_${Math.max(i, j) + 1}`);
          return Poly.zero();
        }),
      );
    expect(determinant(m(2)).termCount()).toBe(5); // F(5)
    expect(determinant(m(5)).termCount()).toBe(89); // F(11)
  });
});

describe("matrixRank", () => {
  it("exact rank of symbolic matrices", () => {
    expect(matrixRank([[P("x"), P("y")], [P("2*x"), P("2*y")]])).toBe(1);
    expect(matrixRank([[P("x"), P("y")], [P("y"), P("x")]])).toBe(2);
    expect(matrixRank([[P("0"), P("0")], [P("0"), P("0")]])).toBe(0);
    expect(matrixRank([[P("a"), P("b"), P("a + b")], [P("c"), P("d"), P("c + d")], [P("1"), P("1"), P("2")]])).toBe(2);
  });

  it("rank is full exactly when the determinant is nonzero", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 4 }).chain((n) => matrixArb(n, 1)), (m) => {
        expect(matrixRank(m) === m.length).toBe(!determinant(m).isZero());
      }),
      { numRuns: 60 },
    );
  });

  it("rank of a product never exceeds the rank of a factor", () => {
    fc.assert(
      fc.property(squarePair, ([a, b]) => {
        expect(matrixRank(matrixMultiply(a, b))).toBeLessThanOrEqual(Math.min(matrixRank(a), matrixRank(b)));
      }),
      { numRuns: 40 },
    );
  });
});
