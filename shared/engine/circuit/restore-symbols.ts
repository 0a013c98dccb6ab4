// Convert polynomials in internal variables (y = 1/R, k = A/(1+s*tau), ...) back to the user's
// symbols. Every polynomial of one group is multiplied by the same factor, so their ratios are
// unchanged: this is the multilinear conversion of ENGINE-NOTES (no GCD needed for this step).

import { Poly, reciprocalSubstitute } from "../algebra";
import { simpleReciprocalOf, type InternalSymbol } from "./values";

/**
 * Replace each internal variable y = a/b in every polynomial of the group by clearing b:
 * p = Σ p_k y^k  ->  Σ p_k a^k b^(d−k), with d the largest degree of y over the group.
 */
export function restoreUserSymbols(group: readonly Poly[], internals: readonly InternalSymbol[]): Poly[] {
  let polys = group.slice();
  const present = internals.filter((s) => polys.some((p) => p.degreeIn(s.name) > 0));
  const simple = present.filter((s) => simpleReciprocalOf(s.value) !== null);
  const composite = present.filter((s) => simpleReciprocalOf(s.value) === null);

  for (const s of composite) {
    const a = s.value.num;
    const b = s.value.den;
    const d = Math.max(...polys.map((p) => Math.max(0, p.degreeIn(s.name))));
    polys = polys.map((p) => {
      let out = Poly.zero();
      for (let k = 0; k <= d; k++) {
        const pk = p.coefficientIn(s.name, k);
        if (pk.isZero()) continue;
        out = out.add(pk.mul(a.pow(k)).mul(b.pow(d - k)));
      }
      return out;
    });
  }

  // y = 1/R with R a single symbol: a term-wise exponent remap. Batches keep the targets distinct.
  for (const batch of distinctTargetBatches(simple)) {
    const pairs: Record<string, string> = {};
    for (const s of batch) pairs[s.name] = simpleReciprocalOf(s.value)!;
    const degrees = batch.map((s) => polys.map((p) => Math.max(0, p.degreeIn(s.name))));
    const top = degrees.map((ds) => Math.max(...ds));
    polys = polys.map((p, i) => {
      const { poly } = reciprocalSubstitute(p, pairs);
      // Bring every polynomial to the same multiplier: the product of R^(largest degree).
      const extra: Record<string, number> = {};
      batch.forEach((s, j) => {
        const k = top[j] - degrees[j][i];
        if (k > 0) extra[pairs[s.name]] = (extra[pairs[s.name]] ?? 0) + k;
      });
      return Object.keys(extra).length > 0 ? poly.mul(Poly.monomial(1, extra)) : poly;
    });
  }
  return polys;
}

function distinctTargetBatches(symbols: InternalSymbol[]): InternalSymbol[][] {
  const batches: { targets: Set<string>; members: InternalSymbol[] }[] = [];
  for (const s of symbols) {
    const t = simpleReciprocalOf(s.value)!;
    let batch = batches.find((b) => !b.targets.has(t));
    if (!batch) {
      batch = { targets: new Set(), members: [] };
      batches.push(batch);
    }
    batch.targets.add(t);
    batch.members.push(s);
  }
  return batches.map((b) => b.members);
}
