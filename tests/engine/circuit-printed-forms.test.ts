// Every printed form of every result and every ledger formula, read back by an independent float
// reader (tests/support/printed-forms.ts, no engine parser) and compared at random points with the
// exact result evaluated in exact rationals.

import { describe, expect, it } from "vitest";
import { solveNetwork, solveNetworkExact, type NetworkInput, type SolveResult } from "../../shared/engine";
import { Rational, type RationalFunction } from "../../shared/engine/algebra";
import { closeTo, evaluatePrintedInfix, evaluatePrintedTex, randomPoints } from "../support/printed-forms";
import { fixtureNetworks, generatedCorpus, mulberry32, randomNetwork } from "./circuit-generators";

/** The exact value of f at a point of m/16 coordinates, as a float (null where f has a pole). */
function exactAt(f: RationalFunction, point: Record<string, number>): number | null {
  const at: Record<string, Rational> = {};
  for (const [k, v] of Object.entries(point)) at[k] = Rational.of(BigInt(Math.round(v * 16)), 16n);
  const d = f.den.substitute(at).constantValue()!;
  if (d.isZero()) return null;
  return f.substitute(at).constantValue()!.toNumber();
}

describe("a negated sum keeps its brackets in every printed form", () => {
  it("current source into -R1 in series with -R2: Rth = -R1 - R2 in compact TeX and in the ledger", () => {
    // Common practice: series resistances add, whatever their sign.
    const r = solveNetwork("port a 0\nIs current 0 a = Is\nTop resistor a b = -R1\nBottom resistor b 0 = -R2\n");
    const point = { Is: 1.5, R1: 0.75, R2: 2 };
    const expected = -(0.75 + 2);
    for (const form of [r.rth!.infix, r.rth!.compact!]) expect(evaluatePrintedInfix(form, point), form).toBe(expected);
    for (const form of [r.rth!.tex!, r.rth!.compactTex!]) expect(evaluatePrintedTex(form, point), form).toBe(expected);
    for (const id of ["rth.solution", "result.thevenin", "result.norton"]) {
      const tex = r.steps.find((s) => s.id === id)!.tex;
      const rth = /R_\{th\} = (.*)$/.exec(tex)![1];
      expect(evaluatePrintedTex(rth, point), `${id}: ${tex}`).toBe(expected);
    }
  });
});

type ResultKey = "vth" | "isc" | "rth" | "rthFromVocIsc";
const LEFT_SIDES: Record<string, ResultKey> = { "V_{th}": "vth", "R_{th}": "rth", "I_{sc}": "isc", "\\frac{V_{th}}{I_{sc}}": "rthFromVocIsc" };
const IDENTIFIER = /[A-Za-z_][A-Za-z0-9_]*/g;

/** "L = R" split at its first top-level " = ". */
function sides(equation: string): [string, string] {
  const at = equation.indexOf(" = ");
  if (at < 0) throw new Error(`not an equation: ${equation}`);
  return [equation.slice(0, at), equation.slice(at + 3)];
}

/** The bmatrix blocks of a system's TeX, each as rows of cells. */
function bmatrices(tex: string): string[][][] {
  return [...tex.matchAll(/\\begin\{bmatrix\}(.*?)\\end\{bmatrix\}/gs)].map((m) => m[1].split(/\s\\\\\s/).map((row) => row.split(" & ").map((c) => c.trim())));
}

interface Comparison {
  what: string;
  printed: (point: Record<string, number>) => number;
  exact: (point: Record<string, number>) => number | null;
}

/** Every printed form of a solved network, paired with what it must equal. */
function comparisons(r: SolveResult, exact: Record<ResultKey, RationalFunction | null>): Comparison[] {
  const out: Comparison[] = [];
  for (const key of ["vth", "isc", "rth", "rthFromVocIsc"] as const) {
    const printed = r[key];
    const f = exact[key];
    if (printed === null || f === null) {
      expect(printed === null, `${key}: printed and exact results exist alike`).toBe(f === null);
      continue;
    }
    const at = (p: Record<string, number>) => exactAt(f, p);
    out.push({ what: `${key}.infix`, printed: (p) => evaluatePrintedInfix(printed.infix, p), exact: at });
    if (printed.compact !== null) out.push({ what: `${key}.compact`, printed: (p) => evaluatePrintedInfix(printed.compact!, p), exact: at });
    if (printed.tex !== null) out.push({ what: `${key}.tex`, printed: (p) => evaluatePrintedTex(printed.tex!, p), exact: at });
    if (printed.compactTex !== null) out.push({ what: `${key}.compactTex`, printed: (p) => evaluatePrintedTex(printed.compactTex!, p), exact: at });
  }
  for (const step of r.steps) {
    const data = step.data as Record<string, unknown>;
    if (typeof data.equation === "string") {
      // Equations of the nodal system (several for a source with several controls): the TeX against the plain form, both read here.
      const plain = Array.isArray(data.equations) ? (data.equations as string[]) : [data.equation];
      const typeset = step.tex.split(/,\\quad\s*/);
      expect(typeset.length, `${step.id}: one TeX equation per plain one`).toBe(plain.length);
      plain.forEach((equation, k) => {
        const [lt, rt] = sides(typeset[k]);
        const [li, ri] = sides(equation);
        out.push({
          what: `${step.id}: ${typeset[k]}`,
          printed: (p) => evaluatePrintedTex(lt, p) - evaluatePrintedTex(rt, p),
          exact: (p) => evaluatePrintedInfix(li, p) - evaluatePrintedInfix(ri, p),
        });
      });
    }
    if (step.kind === "matrix") {
      const matrix = data.matrix as string[][];
      if (matrix.length === 0) continue; // every unknown merged away: nothing is printed
      const [a, x, b] = bmatrices(step.tex);
      const rhs = data.rhs as string[];
      const unknowns = data.unknowns as string[];
      expect(a.length, `${step.id} rows`).toBe(matrix.length);
      matrix.forEach((row, i) =>
        row.forEach((entry, j) => {
          if (a[i][j] !== "\\ast") out.push({ what: `${step.id}[${i}][${j}]: ${a[i][j]}`, printed: (p) => evaluatePrintedTex(a[i][j], p), exact: (p) => evaluatePrintedInfix(entry, p) });
        }),
      );
      unknowns.forEach((u, i) => out.push({ what: `${step.id} unknown ${u}`, printed: (p) => evaluatePrintedTex(x[i][0], p), exact: (p) => p[u] }));
      rhs.forEach((entry, i) => {
        if (b[i][0] !== "\\ast") out.push({ what: `${step.id} rhs[${i}]: ${b[i][0]}`, printed: (p) => evaluatePrintedTex(b[i][0], p), exact: (p) => evaluatePrintedInfix(entry, p) });
      });
    }
    if (step.kind === "solution" || step.kind === "equivalent" || step.kind === "cross-check") {
      for (const segment of step.tex.split(/,\s*\\qquad\s*/)) {
        if (/\\text|\\infty|\\det/.test(segment) || !segment.includes(" = ")) continue;
        const [left, right] = sides(segment);
        const value = right.replace(/\s*(=|\\neq)\s*R_\{th\}$/, "");
        if (left === "\\Delta") {
          const determinant = data.determinant;
          if (typeof determinant === "string") out.push({ what: `${step.id}: Δ`, printed: (p) => evaluatePrintedTex(value, p), exact: (p) => evaluatePrintedInfix(determinant, p) });
          continue;
        }
        const key = LEFT_SIDES[left];
        expect(key, `${step.id}: a result on the left of ${segment}`).toBeDefined();
        const f = exact[key];
        expect(f, `${step.id}: ${key} exists`).not.toBeNull();
        out.push({ what: `${step.id}: ${segment}`, printed: (p) => evaluatePrintedTex(value, p), exact: (p) => exactAt(f!, p) });
      }
    }
  }
  for (const limit of r.limits) {
    for (const [key, entry] of Object.entries(limit.results)) {
      if (entry?.value && entry.valueTex) out.push({ what: `${limit.key} ${key} value`, printed: (p) => evaluatePrintedTex(entry.valueTex!, p), exact: (p) => evaluatePrintedInfix(entry.value!, p) });
      if (entry?.leading && entry.leadingTex) out.push({ what: `${limit.key} ${key} leading`, printed: (p) => evaluatePrintedTex(entry.leadingTex!, p), exact: (p) => evaluatePrintedInfix(entry.leading!, p) });
    }
  }
  return out;
}

/** Symbols and ledger unknowns named anywhere in the plain forms of a result. */
function symbolsOf(r: SolveResult): Set<string> {
  const out = new Set<string>(["s"]);
  const visit = (v: unknown) => {
    if (typeof v === "string") for (const m of v.matchAll(IDENTIFIER)) out.add(m[0]);
    else if (Array.isArray(v)) v.forEach(visit);
    else if (v && typeof v === "object") Object.values(v).forEach(visit);
  };
  for (const key of ["vth", "isc", "rth", "rthFromVocIsc"] as const) visit(r[key]?.infix);
  for (const step of r.steps) {
    const d = step.data as Record<string, unknown>;
    visit([d.equation, d.matrix, d.rhs, d.unknowns, d.determinant]);
  }
  return out;
}

function corpus(): { id: string; network: string | NetworkInput }[] {
  const rand = mulberry32(7);
  return [
    ...fixtureNetworks().map((f) => ({ id: f.file, network: f.text })),
    ...generatedCorpus(66).map((network, i) => ({ id: `generated ${i}`, network })),
    ...Array.from({ length: 30 }, (_, i) => ({ id: `op-amp ${i}`, network: randomNetwork(rand, { force: "opamp", reactive: i % 2 === 0, numbers: true }) })),
    { id: "negative series resistors", network: "port a 0\nIs current 0 a = Is\nTop resistor a b = -R1\nBottom resistor b 0 = -R2\n" },
  ];
}

describe("every printed form read back independently equals the exact result", () => {
  const cases = corpus();
  it.each(cases.map((c, i) => [c.id, i] as const))("%s", (_id, i) => {
    const { network } = cases[i];
    const exactPort = solveNetworkExact(network).port;
    const firstSymbol = exactPort?.vth?.variables()[0] ?? exactPort?.isc?.variables()[0];
    const r = solveNetwork(network, { limits: firstSymbol ? [{ symbol: firstSymbol, to: "inf" }, { symbol: firstSymbol, to: "zero" }] : [] });
    if (exactPort === null) {
      expect(r.vth, "no exact port, no printed results").toBeNull();
      return;
    }
    const exact = { vth: exactPort.vth, isc: exactPort.isc, rth: exactPort.rth, rthFromVocIsc: exactPort.rthFromVocIsc };
    const points = randomPoints(symbolsOf(r), 3, mulberry32(i + 1));
    let compared = 0;
    for (const c of comparisons(r, exact)) {
      for (const p of points) {
        const want = c.exact(p);
        if (want === null || !Number.isFinite(want)) continue; // a pole of the result at this point
        const got = c.printed(p);
        expect(closeTo(got, want, 1e-8), `${c.what}: printed ${got}, exact ${want} at ${JSON.stringify(p)}`).toBe(true);
        compared++;
      }
    }
    expect(compared, "forms compared").toBeGreaterThan(0);
  });
});
