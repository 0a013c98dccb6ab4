// The client's door into the shared engine's exact algebra, for Values, Limits and Sweep.
// Imported only by lazily loaded screens (it carries the expression parser).
export { Rational, RationalFunction, formatSI, parseSI, readExpression } from "../../shared/engine/algebra/index";
export type { Limit } from "../../shared/engine/algebra/index";
export { boundedApproximation } from "../../shared/engine/circuit/error-bound";
export type { BoundedApproximation } from "../../shared/engine/circuit/error-bound";
