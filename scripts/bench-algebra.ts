// Times the exact algebra on the Thevenin resistance of resistive ladders (series Ra_i,
// shunt Rb_i, input shorted): nodal matrix in conductances, determinant and the output
// cofactor, conversion to resistances, lowest terms. Prints figures per ladder size.
// Usage: npx tsx scripts/bench-algebra.ts [maxSections=12] [runsPerSize=3]

import { Poly, RationalFunction, cofactorsOf, polyGcd, reciprocalSubstitute } from "../shared/engine/algebra/index";

function ladderNodalMatrix(n: number): Poly[][] {
  const ga = (k: number) => Poly.variable(`Ga_${k}`);
  const gb = (k: number) => Poly.variable(`Gb_${k}`);
  return Array.from({ length: n }, (_, i) =>
    Array.from({ length: n }, (_, j) => {
      const k = i + 1;
      if (i === j) return k < n ? ga(k).add(gb(k)).add(ga(k + 1)) : ga(k).add(gb(k));
      if (j === i + 1) return ga(k + 1).neg();
      if (j === i - 1) return ga(k).neg();
      return Poly.zero();
    }),
  );
}

/** CPU milliseconds of this process (user + system): steadier than wall time on a shared machine. */
function cpuMs(): number {
  const u = process.cpuUsage();
  return (u.user + u.system) / 1000;
}

function time<T>(f: () => T): [T, number] {
  const t0 = cpuMs();
  const r = f();
  return [r, cpuMs() - t0];
}

interface Figures {
  det: number;
  cof: number;
  conv: number;
  low: number;
  total: number;
  wall: number;
  denTerms: number;
  numTerms: number;
}

function thevenin(n: number): Figures {
  const m = ladderNodalMatrix(n);
  const pairs: Record<string, string> = {};
  for (let k = 1; k <= n; k++) {
    pairs[`Ga_${k}`] = `Ra_${k}`;
    pairs[`Gb_${k}`] = `Rb_${k}`;
  }
  const w0 = performance.now();
  const t0 = cpuMs();
  const table = cofactorsOf(m);
  const [det, tDet] = time(() => table.determinant());
  const [cof, tCof] = time(() => table.cofactor(n - 1, n - 1));
  const [[num, den], tConv] = time(() => {
    // Rth = C/det in conductances; in resistances each side gets a monomial multiplier.
    const c = reciprocalSubstitute(cof, pairs);
    const d = reciprocalSubstitute(det, pairs);
    return [c.poly.mul(d.multiplier), d.poly.mul(c.multiplier)];
  });
  const [rth, tLow] = time(() => RationalFunction.from(num, den));
  return {
    det: tDet, cof: tCof, conv: tConv, low: tLow, total: cpuMs() - t0, wall: performance.now() - w0,
    denTerms: rth.den.termCount(), numTerms: rth.num.termCount(),
  };
}

const median = (xs: number[]) => xs.slice().sort((a, b) => a - b)[Math.floor(xs.length / 2)];

const maxN = Number(process.argv[2] ?? 12);
const reps = Number(process.argv[3] ?? 3);
const rows: string[][] = [["sections", "det", "cofactor", "to R", "lowest terms", "total", "wall", "den terms", "num terms", "heap MB"]];
for (let n = 3; n <= maxN; n++) {
  const runs = Array.from({ length: reps }, () => thevenin(n));
  const pick = (f: (r: Figures) => number) => median(runs.map(f)).toFixed(1);
  rows.push([
    String(n), pick((r) => r.det), pick((r) => r.cof), pick((r) => r.conv), pick((r) => r.low), pick((r) => r.total), pick((r) => r.wall),
    String(runs[0].denTerms), String(runs[0].numTerms), (process.memoryUsage().heapUsed / 2 ** 20).toFixed(0),
  ]);
}
{
  // Reference figure in the same run: a gcd that is not trivial, of comparable size.
  const n = maxN;
  const m = ladderNodalMatrix(n);
  const pairs: Record<string, string> = {};
  for (let k = 1; k <= n; k++) {
    pairs[`Ga_${k}`] = `Ra_${k}`;
    pairs[`Gb_${k}`] = `Rb_${k}`;
  }
  const table = cofactorsOf(m);
  const d = reciprocalSubstitute(table.determinant(), pairs).poly;
  const c = reciprocalSubstitute(table.cofactor(n - 1, n - 1), pairs).poly;
  const g = Poly.variable("Ra_1").add(Poly.variable("Rb_2"));
  const a = d.mul(g);
  const b = c.mul(g);
  const [, tGcd] = time(() => polyGcd(a, b));
  rows.push([`gcd, planted factor (ladder-${n})`, "", "", "", tGcd.toFixed(1), "", "", "", "", ""]);
}
const widths = rows[0].map((_, c) => Math.max(...rows.map((r) => r[c].length)));
console.log(`Rth of a resistive ladder: cofactor/det of the nodal matrix (conductances), then in resistances, in lowest terms.`);
console.log(`CPU milliseconds of this process per step (GC threads included), median of ${reps} runs; wall = elapsed.`);
for (const r of rows) console.log(r.map((s, c) => s.padStart(widths[c])).join("  "));
