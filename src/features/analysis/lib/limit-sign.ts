import type { Limit, RationalFunction } from "@/lib/engine";

// Quantities that are positive by their nature: a symbol standing for one is taken as > 0.
const POSITIVE_QUANTITIES = new Set(["resistance", "conductance", "capacitance", "inductance"]);

export function positiveSymbols(quantities: Record<string, string | null>): Set<string> {
  return new Set(Object.entries(quantities).flatMap(([symbol, q]) => (q && POSITIVE_QUANTITIES.has(q) ? [symbol] : [])));
}

// +1 or −1 when every term has that sign and every symbol in it is positive; 0 when the sign is open.
function definiteSign(poly: RationalFunction["num"], positive: Set<string>): 1 | -1 | 0 {
  if (!poly.variables().every((v) => positive.has(v))) return 0;
  const signs = new Set(poly.terms().map((t) => t.coefficient.sign()));
  return signs.size === 1 ? ([...signs][0] as 1 | -1) : 0;
}

/**
 * The engine's limit with the signs that quantities imply: an unbounded result whose sign the
 * engine leaves open (it depends on other symbols) gets it when those symbols are all positive
 * quantities. The symbol itself goes to +∞ or to 0 from above, so it is positive too.
 */
export function limitWithSigns(rf: RationalFunction, symbol: string, to: "inf" | "zero", positive: Set<string>): Limit {
  const limit = rf.limit(symbol, to);
  if (limit.kind !== "infinite" || limit.sign !== 0) return limit;
  const leading = rf.leadingOrder(symbol, to);
  const known = new Set([...positive, symbol]);
  const sign = definiteSign(leading.num, known) * definiteSign(leading.den, known);
  return { kind: "infinite", sign: sign as 1 | -1 | 0 };
}
