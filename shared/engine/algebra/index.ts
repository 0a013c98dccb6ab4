// Portfold's exact algebra: rationals, sparse polynomials, rational functions in lowest
// terms, determinants and Cramer's rule, value expressions.

export { Rational } from "./rational";
export { Poly } from "./polynomial";
export { polyGcd, polyGcdList, polyLcm } from "./gcd";
export { polyDivide, polyDivideExact } from "./division";
export { RationalFunction, type Limit } from "./rational-function";
export { determinant, determinantBareiss, cofactor, cofactorsOf, solveCramer } from "./determinant";
export { matrixRank, matrixMultiply, matrixVector, identityMatrix } from "./matrix";
export { readExpression, parseSI, formatSI, ValueSyntaxError } from "./expression";
export { parseValue } from "./element-value";
export { reciprocalSubstitute } from "./reciprocal";
;
;
