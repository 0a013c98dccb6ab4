// The check badge: each mark is a test the exact results can fail. The network is written again
// here in another formulation, the sparse tableau (every element current an unknown, one branch
// equation per element), and solved by its own elimination at random points: in floating point
// for the test-source and numeric marks, in exact rationals for the exact-point mark. Nothing
// here uses the nodal stamps, the determinants or the port set-ups the results came from.

import { Rational, type Poly, type RationalFunction } from "../algebra";
import { PRIME, evalMod, invMod, residue } from "../algebra/modular";
import { onceEach } from "../algebra/memo";
import type { CheckDetail, Element, Network, NumericCheck, SolveChecks } from "../types";
import { elementNodes, isOpamp, networkNodes } from "./elements";
import { seededRandom } from "./numeric";
import { LAPLACE, type SourceTerms } from "./values";

/** Arithmetic the elimination needs; `pivotScore` says which nonzero entry makes the better pivot. */
interface Field<T> {
  zero: T;
  one: T;
  of(x: RationalFunction): T | null;
  add(a: T, b: T): T;
  sub(a: T, b: T): T;
  mul(a: T, b: T): T;
  div(a: T, b: T): T;
  neg(a: T): T;
  isZero(a: T, scale: number): boolean;
  magnitude(a: T): number;
  pivotScore(a: T, rowEntries: number): number;
  /** Floats only: a times a power of two, to equilibrate rows and columns before eliminating. */
  scaleBy?(a: T, k: number): T;
}

function floatField(point: Record<string, number>): Field<number> {
  return {
    zero: 0,
    one: 1,
    of: (x) => {
      const v = x.evaluate(point);
      return Number.isFinite(v) ? v : null;
    },
    add: (a, b) => a + b,
    sub: (a, b) => a - b,
    mul: (a, b) => a * b,
    div: (a, b) => a / b,
    neg: (a) => -a,
    // Entries below this fraction of the largest one are rounding left-overs of exact zeros.
    isZero: (a, scale) => Math.abs(a) <= 1e-11 * scale,
    magnitude: Math.abs,
    pivotScore: (a) => Math.abs(a), // partial pivoting
    scaleBy: (a, k) => a * k,
  };
}

/** p at a point in floats; null when its rounding bound is not below 1e-9 of the value (cancellation ate the digits). */
function accurateInFloats(p: Poly, point: Record<string, number>): number | null {
  const { value, error } = p.evaluateWithError(point);
  return Number.isFinite(value) && error <= 1e-9 * Math.abs(value) ? value : null;
}

/**
 * Whether f at the point m_v / q equals the exact value: decided modulo PRIME when that can tell
 * (f's residues there against the value's), else by evaluating f exactly. Residues that differ prove
 * the two differ; residues that agree leave a chance of about 1/PRIME that they differ still.
 * Returns the exact value of f when it was computed (for the message), null when f has a pole there.
 */
function sameAtPoint(f: RationalFunction, value: Rational, residues: (p: Poly) => number | null, F: Field<Rational>): { same: boolean; exact?: Rational } | null {
  const num = residues(f.num);
  const den = residues(f.den);
  const valueDen = residue(value.den);
  if (num !== null && den !== null && den !== 0 && valueDen !== 0) {
    if ((num * valueDen) % PRIME === (den * residue(value.num)) % PRIME) return { same: true };
  }
  const exact = F.of(f);
  return exact === null ? null : { same: exact.equals(value), exact };
}

/** p at the point m_v / q (one denominator for every symbol), exactly, in one pass over the terms. */
function evaluateOverCommonDenominator(p: Poly, numerators: Readonly<Record<string, bigint>>, q: bigint): Rational {
  const nv = p.vars.length;
  const m = p.vars.map((v) => numerators[v]);
  if (m.some((x) => x === undefined)) throw new Error("a symbol has no value at the check point");
  const degrees: number[] = [];
  let top = 0;
  for (let t = 0; t < p.coefs.length; t++) {
    let d = 0;
    for (let v = 0; v < nv; v++) d += p.exps[t * nv + v];
    degrees.push(d);
    top = Math.max(top, d);
  }
  // Powers by exponent, each computed once: qPowers[e] = q^e, varPowers[v][e] = m_v^e.
  const qPowers: bigint[] = [1n];
  const varPowers: bigint[][] = m.map(() => [1n]);
  const power = (table: bigint[], base: bigint, e: number): bigint => {
    for (let k = table.length; k <= e; k++) table.push(table[k - 1] * base);
    return table[e];
  };
  let sum = 0n;
  for (let t = 0; t < p.coefs.length; t++) {
    let term = p.coefs[t] * power(qPowers, q, top - degrees[t]);
    for (let v = 0; v < nv; v++) {
      const e = p.exps[t * nv + v];
      if (e > 0) term *= power(varPowers[v], m[v]!, e);
    }
    sum += term;
  }
  return Rational.of(sum, p.den * q ** BigInt(top));
}

/** Exact arithmetic at the point m_v / q. */
function rationalField(numerators: Readonly<Record<string, bigint>>, q: bigint): Field<Rational> {
  return {
    zero: Rational.ZERO,
    one: Rational.ONE,
    of: (x) => {
      const d = evaluateOverCommonDenominator(x.den, numerators, q);
      if (d.isZero()) return null;
      return evaluateOverCommonDenominator(x.num, numerators, q).div(d);
    },
    add: (a, b) => a.add(b),
    sub: (a, b) => a.sub(b),
    mul: (a, b) => a.mul(b),
    div: (a, b) => a.div(b),
    neg: (a) => a.neg(),
    isZero: (a) => a.isZero(),
    magnitude: (a) => Math.abs(a.toNumber()),
    pivotScore: (_a, rowEntries) => -rowEntries, // fewest entries: least fill-in
  };
}

type Row<T> = Map<number, T>;

/** Gauss–Jordan on sparse rows; the solution, or a null vector (A z = 0, z ≠ 0) when A is singular. */
function eliminate<T>(a: Row<T>[], b: T[], n: number, F: Field<T>): { x: T[] } | { nullVectors: T[][] } {
  const rows = a.map((r, i) => {
    const row = new Map(r);
    if (!F.isZero(b[i], 0)) row.set(n, b[i]);
    return row;
  });
  // Values such as 2.2 MΩ beside 100 nF·s make the raw tableau badly scaled: scale each row, then
  // each column, by a power of two so its largest entry is near 1 (exact in binary), and undo it after.
  const columnScale = new Array<number>(n).fill(1);
  const scaleBy = F.scaleBy;
  if (scaleBy) {
    const powerOfTwo = (m: number) => (m > 0 ? 2 ** -Math.round(Math.log2(m)) : 1);
    for (const r of rows) {
      let m = 0;
      for (const [c, v] of r) if (c < n) m = Math.max(m, F.magnitude(v));
      const k = powerOfTwo(m);
      for (const [c, v] of r) r.set(c, scaleBy(v, k));
    }
    const colMax = new Array<number>(n).fill(0);
    for (const r of rows) for (const [c, v] of r) if (c < n) colMax[c] = Math.max(colMax[c], F.magnitude(v));
    colMax.forEach((m, c) => (columnScale[c] = powerOfTwo(m)));
    for (const r of rows) for (const [c, v] of r) if (c < n) r.set(c, scaleBy(v, columnScale[c]));
  }
  let scale = 0;
  for (const r of rows) for (const [c, v] of r) if (c < n) scale = Math.max(scale, F.magnitude(v));
  const pivotRowOf = new Array<number>(n).fill(-1);
  const used = new Set<number>();
  for (let c = 0; c < n; c++) {
    let best = -1;
    let bestScore = -Infinity;
    for (let i = 0; i < rows.length; i++) {
      if (used.has(i)) continue;
      const v = rows[i].get(c);
      if (v === undefined || F.isZero(v, scale)) continue;
      const score = F.pivotScore(v, rows[i].size);
      if (score > bestScore) {
        best = i;
        bestScore = score;
      }
    }
    if (best < 0) continue;
    used.add(best);
    pivotRowOf[c] = best;
    const pivot = rows[best];
    const inv = F.div(F.one, pivot.get(c)!);
    for (const [k, v] of pivot) pivot.set(k, F.mul(v, inv));
    for (let i = 0; i < rows.length; i++) {
      if (i === best) continue;
      const f = rows[i].get(c);
      if (f === undefined) continue;
      const row = rows[i];
      for (const [k, v] of pivot) {
        const next = F.sub(row.get(k) ?? F.zero, F.mul(f, v));
        if (F.isZero(next, 0)) row.delete(k);
        else row.set(k, next);
      }
      row.delete(c);
    }
  }
  // One null vector per free column: together they span every way the unknowns can move freely.
  const free = pivotRowOf.flatMap((r, c) => (r < 0 ? [c] : []));
  if (free.length > 0) {
    const nullVectors = free.map((f) => {
      const z = new Array<T>(n).fill(F.zero);
      z[f] = F.one;
      pivotRowOf.forEach((r, c) => {
        if (r >= 0) z[c] = F.neg(rows[r].get(f) ?? F.zero);
      });
      return scaleBy ? z.map((v, c) => scaleBy(v, columnScale[c])) : z;
    });
    return { nullVectors };
  }
  const y = pivotRowOf.map((r) => rows[r].get(n) ?? F.zero);
  return { x: scaleBy ? y.map((v, c) => scaleBy(v, columnScale[c])) : y };
}

type TableauMode = "open" | "test" | "short";

interface Tableau<T> {
  a: Row<T>[];
  b: T[];
  n: number;
  nodes: string[];
  /** Column of each element's current; the port's test source or short is "(port)". */
  current: Map<string, number>;
  voltage: (node: string) => number;
}

const PORT = "(port)";

/**
 * The sparse tableau of the network in one port set-up: node voltages and element currents as
 * unknowns, KCL per node, one branch equation per element. null when a value has a pole at the point.
 */
function buildTableau<T>(
  network: Network,
  values: ReadonlyMap<string, RationalFunction>,
  terms: SourceTerms,
  mode: TableauMode,
  F: Field<T>,
  s: T,
): Tableau<T> | null {
  const ground = network.ground;
  const nodes = networkNodes(network);
  const nodeIndex = new Map(nodes.map((n, i) => [n, i]));
  const elements: (Element | { name: string; kind: "port" })[] = [...network.elements];
  if (mode !== "open") elements.push({ name: PORT, kind: "port" });
  const current = new Map(elements.map((e, i) => [e.name, nodes.length + i]));
  const n = nodes.length + elements.length;
  const a: Row<T>[] = Array.from({ length: n }, () => new Map());
  const b: T[] = new Array<T>(n).fill(F.zero);
  const voltage = (node: string) => (node === ground ? -1 : nodeIndex.get(node) ?? -1);
  const put = (row: number, col: number, c: T) => {
    if (col < 0) return;
    const next = F.add(a[row].get(col) ?? F.zero, c);
    a[row].set(col, next);
  };
  // KCL rows: the current of an element leaves its first node and enters its second.
  const kcl = (node: string, col: number, sign: T) => {
    const r = voltage(node);
    if (r >= 0) put(r, col, sign);
  };
  const across = (row: number, p: string, q: string, k: T) => {
    put(row, voltage(p), k);
    put(row, voltage(q), F.neg(k));
  };
  const minusOne = F.neg(F.one);
  for (let k = 0; k < elements.length; k++) {
    const e = elements[k];
    const row = nodes.length + k;
    const i = nodes.length + k;
    if (e.kind === "port") {
      const [p, q] = [network.port.plus, network.port.minus];
      // Test: 1 A driven from minus through the source into plus. Short: 0 V from plus to minus.
      kcl(p, i, F.one);
      kcl(q, i, minusOne);
      if (mode === "test") {
        put(row, i, F.one);
        b[row] = minusOne;
      } else across(row, p, q, F.one);
      continue;
    }
    if (isOpamp(e)) {
      // Nullor: the inputs sit at one voltage; the output delivers whatever current it must.
      kcl(e.output, i, minusOne);
      across(row, e.inputs[0], e.inputs[1], F.one);
      continue;
    }
    const [p, q] = elementNodes(e);
    kcl(p, i, F.one);
    kcl(q, i, minusOne);
    const rf = values.get(e.name);
    if (!rf) return null;
    const v = F.of(rf);
    if (v === null) return null;
    switch (e.kind) {
      case "resistor": // V = R I
        across(row, p, q, F.one);
        put(row, i, F.neg(v));
        break;
      case "inductor": // V = sL I
        across(row, p, q, F.one);
        put(row, i, F.neg(F.mul(s, v)));
        break;
      case "conductance": // I = G V
        put(row, i, F.one);
        across(row, p, q, F.neg(v));
        break;
      case "capacitor": // I = sC V
        put(row, i, F.one);
        across(row, p, q, F.neg(F.mul(s, v)));
        break;
      case "voltage": // V(p) − V(q) − Σ gain·control = independent part
      case "current": {
        if (e.kind === "voltage") across(row, p, q, F.one);
        else put(row, i, F.one);
        for (const term of terms.get(e.name) ?? []) {
          const g = F.of(term.gain);
          if (g === null) return null;
          if ("nodes" in term.control) across(row, term.control.nodes[0], term.control.nodes[1], F.neg(g));
          else put(row, current.get(term.control.element)!, F.neg(g));
        }
        // The test source sees the network with every independent part zeroed; controls stay.
        b[row] = mode === "test" ? F.zero : v;
        break;
      }
    }
  }
  return { a, b, n, nodes, current, voltage };
}

/** The port quantity of one set-up: V(plus) − V(minus) open or under test, the short's current shorted. */
function portValue<T>(t: Tableau<T>, x: T[], network: Network, mode: TableauMode, F: Field<T>): T {
  if (mode === "short") return x[t.current.get(PORT)!];
  const v = (node: string) => (t.voltage(node) >= 0 ? x[t.voltage(node)] : F.zero);
  return F.sub(v(network.port.plus), v(network.port.minus));
}

type Solved<T> = { kind: "value"; value: T; scale: number } | { kind: "singular" } | { kind: "pole" };

function tableauPortValue<T>(network: Network, values: ReadonlyMap<string, RationalFunction>, terms: SourceTerms, mode: TableauMode, F: Field<T>, s: T): Solved<T> {
  const t = buildTableau(network, values, terms, mode, F, s);
  if (t === null) return { kind: "pole" };
  const solved = eliminate(t.a, t.b, t.n, F);
  if ("nullVectors" in solved) return { kind: "singular" };
  // The largest unknown sets the size of a rounding error, so that an exact 0 can be compared.
  const scale = solved.x.reduce((m, v) => Math.max(m, F.magnitude(v)), 0);
  return { kind: "value", value: portValue(t, solved.x, network, mode, F), scale };
}

export interface CheckInput {
  network: Network;
  /** Independent parts of the element values, and the controlled parts of each controlled source. */
  values: ReadonlyMap<string, RationalFunction>;
  terms: SourceTerms;
  vth: RationalFunction | null;
  isc: RationalFunction | null;
  rth: RationalFunction | null;
  /** Whether Voc/Isc equals Rth exactly (vocIscAgreement, decided once by the solve). */
  agree: boolean | null;
  seed: number;
}

const MODE_OF = { vth: "open", rth: "test", isc: "short" } as const;
const LABEL = { vth: "Vth", rth: "Rth", isc: "Isc" } as const;
type Checked = keyof typeof MODE_OF;

/** Symbols of the element values and gains, plus s. */
function symbolsOf(values: ReadonlyMap<string, RationalFunction>, terms: SourceTerms): string[] {
  const out = new Set<string>([LAPLACE]);
  for (const v of values.values()) for (const name of v.variables()) out.add(name);
  for (const list of terms.values()) for (const t of list) for (const name of t.gain.variables()) out.add(name);
  return [...out].sort();
}

const FLOAT_POINTS = 3;
const EXACT_POINTS = 2;
/** A point is tried again elsewhere when it is a pole of a value or of a result; this many tries at most. */
const TRIES = 4;

interface Tally {
  points: number;
  compared: number;
  worst: number;
  disagree: string[];
  firstPoint: Record<string, number> | null;
}

/**
 * Float tableau solves at random points against the exact results evaluated there: the tally of
 * every result (the numeric mark) and of Rth alone (the test-source mark, the same solves of the
 * test-source tableau). A polynomial shared by two results (det A under Vth and Rth) is evaluated
 * once per point.
 */
function floatCompare(input: CheckInput, random: () => number): { numeric: Tally; testSource: Tally } {
  const symbols = symbolsOf(input.values, input.terms);
  const empty = (): Tally => ({ points: 0, compared: 0, worst: 0, disagree: [], firstPoint: null });
  const numeric = empty();
  const testSource = empty();
  for (let k = 0; k < FLOAT_POINTS; k++) {
    for (let attempt = 0; attempt < TRIES; attempt++) {
      // Values m/64 in [0.5, 2]: exact in binary, and cheap to substitute exactly.
      const sixtyFourths = symbols.map((s) => [s, 32 + Math.floor(random() * 97)] as const);
      const point = Object.fromEntries(sixtyFourths.map(([s, m]) => [s, m / 64]));
      // The results are evaluated exactly at the point: their expanded forms lose digits in floats.
      const exactAt = rationalField(Object.fromEntries(sixtyFourths.map(([s, m]) => [s, BigInt(m)])), 64n);
      const F = floatField(point);
      const floatValue = onceEach((p: Poly) => accurateInFloats(p, point));
      let usable = true;
      const verdicts: { name: Checked; error: number | null; existence: string | null }[] = [];
      for (const name of ["vth", "rth", "isc"] as const) {
        const f = input[name];
        const solved = tableauPortValue(input.network, input.values, input.terms, MODE_OF[name], F, point[LAPLACE]);
        if (solved.kind === "pole") {
          usable = false;
          break;
        }
        if (f === null) {
          // No exact result means the set-up is singular for every value: so at this point too.
          verdicts.push({ name, error: null, existence: solved.kind === "singular" ? null : `${LABEL[name]} has no exact form, but the tableau solves` });
          continue;
        }
        // Floats where their rounding bound allows it (far the most results), else exact.
        const num = floatValue(f.num);
        const den = num === null ? null : floatValue(f.den);
        const exact = num !== null && den !== null && den !== 0 ? num / den : (exactAt.of(f)?.toNumber() ?? NaN);
        if (solved.kind === "singular" || !Number.isFinite(exact)) {
          usable = false; // a point where this set-up happens to be singular: try elsewhere
          break;
        }
        const error = Math.abs(exact - solved.value) / Math.max(1e-9 * solved.scale, Math.abs(exact), Math.abs(solved.value), Number.MIN_VALUE);
        verdicts.push({ name, error, existence: null });
      }
      if (!usable) continue;
      tallyPoint(numeric, point, verdicts);
      tallyPoint(testSource, point, verdicts.filter((v) => v.name === "rth"));
      break;
    }
  }
  return { numeric, testSource };
}

function tallyPoint(tally: Tally, point: Record<string, number>, verdicts: { name: Checked; error: number | null; existence: string | null }[]): void {
  tally.firstPoint ??= point;
  tally.points++;
  for (const v of verdicts) {
    tally.compared++;
    if (v.existence) tally.disagree.push(v.existence);
    if (v.error !== null) {
      tally.worst = Math.max(tally.worst, v.error);
      if (v.error >= 1e-6) tally.disagree.push(`${LABEL[v.name]} differs by ${v.error.toExponential(1)} (relative)`);
    }
  }
}

/** Exact rational tableau solves at random rational points against the exact results substituted there. */
function exactCompare(input: CheckInput, random: () => number): { compared: number; points: number; disagree: string[] } {
  const symbols = symbolsOf(input.values, input.terms);
  const out = { compared: 0, points: 0, disagree: [] as string[] };
  for (let k = 0; k < EXACT_POINTS; k++) {
    for (let attempt = 0; attempt < TRIES; attempt++) {
      // Small numerators over one odd prime per point: cheap exact arithmetic, unlike the binary float points.
      const q = [3, 5, 7, 11][Math.floor(random() * 4)];
      const numerators = Object.fromEntries(symbols.map((s) => [s, BigInt(1 + Math.floor(random() * 97))]));
      const F = rationalField(numerators, BigInt(q));
      // Residues of the results at the point, each polynomial once (det A is under Vth and Rth).
      const qInverse = invMod(residue(BigInt(q)));
      const at = new Map(Object.entries(numerators).map(([s, m]) => [s, (residue(m) * qInverse) % PRIME]));
      const residues = onceEach((p: Poly) => evalMod(p, at));
      const found: string[] = [];
      let usable = true;
      let compared = 0;
      for (const name of ["vth", "rth", "isc"] as const) {
        const f = input[name];
        const solved = tableauPortValue(input.network, input.values, input.terms, MODE_OF[name], F, Rational.of(numerators[LAPLACE], q));
        if (solved.kind === "pole") {
          usable = false;
          break;
        }
        if (f === null) {
          if (solved.kind !== "singular") found.push(`${LABEL[name]} has no exact form, but the tableau solves`);
          compared++;
          continue;
        }
        const compare = solved.kind === "singular" ? null : sameAtPoint(f, solved.value, residues, F);
        if (solved.kind === "singular" || compare === null) {
          usable = false;
          break;
        }
        if (!compare.same) found.push(`${LABEL[name]} is ${compare.exact!.toString()} by the result but ${solved.value.toString()} by the tableau`);
        compared++;
      }
      if (!usable) continue;
      out.points++;
      out.compared += compared;
      out.disagree.push(...found);
      break;
    }
  }
  return out;
}

/** Voc/Isc equals Rth: mathematical equality (the difference cancels), not just equal printed forms. */
export function vocIscAgreement(vth: RationalFunction | null, isc: RationalFunction | null, rth: RationalFunction | null): { rthFromVocIsc: RationalFunction | null; agree: boolean | null } {
  if (!vth || !isc) return { rthFromVocIsc: null, agree: null };
  if (isc.isZero()) return { rthFromVocIsc: null, agree: vth.isZero() ? null : false };
  const rthFromVocIsc = vth.div(isc);
  return { rthFromVocIsc, agree: rth ? rthFromVocIsc.equals(rth) || rthFromVocIsc.sub(rth).isZero() : null };
}

const TEST_SOURCE_METHOD =
  "Drove 1 A into the port with the independent sources zeroed, in a separate sparse-tableau formulation (every element current an unknown), solved in floating point at random values of the symbols, and compared the port voltage with Rth.";

const VOC_ISC_METHOD =
  "Divided the open-port Vth by the shorted-port Isc, two solves apart from the test source, and reduced the difference from Rth exactly.";

const NUMERIC_METHOD =
  "Solved the open, test-source and shorted port in the sparse tableau in floating point at random values of the symbols, and compared Vth, Rth and Isc with the exact results evaluated there.";

const EXACT_POINT_METHOD =
  "Substituted random rational values for the symbols, solved the sparse tableau by exact rational elimination, and compared Vth, Rth and Isc with the results substituted at the same values, digit for digit.";

function detail(agree: boolean | null, method: string, outcome: string, points: number, relativeError: number | null = null): CheckDetail {
  return { agree, method, outcome, points, relativeError };
}

/** A floating-point mark: null when nothing could be compared, else whether every comparison agreed. */
function floatDetail(anyResult: boolean, run: Tally, method: string): CheckDetail {
  const agree = !anyResult || run.compared === 0 ? null : run.disagree.length === 0;
  const outcome =
    agree === null
      ? "No point could be compared."
      : agree
        ? `Agreed at ${run.points} point${run.points === 1 ? "" : "s"}, largest relative difference ${run.worst.toExponential(1)}.`
        : [...new Set(run.disagree)].join("; ");
  return detail(agree, method, outcome, run.points, run.compared > 0 ? run.worst : null);
}

/** The marks before any check ran (a network that could not be solved). */
export function uncheckedMarks(): SolveChecks {
  const none = (method: string) => detail(null, method, "Not run: the network has no solution to check.", 0);
  return {
    testSource: null,
    vocIsc: null,
    numeric: null,
    exactPoint: null,
    details: { testSource: none(TEST_SOURCE_METHOD), vocIsc: none(VOC_ISC_METHOD), numeric: none(NUMERIC_METHOD), exactPoint: none(EXACT_POINT_METHOD) },
  };
}

/** Every mark of the check badge, with what each did; the legacy numericCheck from the numeric mark. */
export function checkResults(input: CheckInput): { checks: SolveChecks; numericCheck: NumericCheck | null } {
  const random = seededRandom(input.seed ^ 0x5eed);
  const anyResult = input.vth !== null || input.isc !== null || input.rth !== null;

  const floatRuns = floatCompare(input, random);
  const testSource = floatDetail(anyResult, floatRuns.testSource, TEST_SOURCE_METHOD);

  const vocIsc = detail(
    input.agree,
    VOC_ISC_METHOD,
    input.agree === null ? "Only one form of Rth exists for this port." : input.agree ? "Voc/Isc − Rth cancels to 0." : "Voc/Isc − Rth does not cancel: the results disagree.",
    0,
  );

  const numericRun = floatRuns.numeric;
  const numeric = floatDetail(anyResult, numericRun, NUMERIC_METHOD);

  const exactRun = anyResult ? exactCompare(input, random) : { compared: 0, points: 0, disagree: [] };
  const exactAgree = exactRun.compared === 0 ? null : exactRun.disagree.length === 0;
  const exactPoint = detail(
    exactAgree,
    EXACT_POINT_METHOD,
    exactAgree === null ? "No point could be compared." : exactAgree ? `Equal exactly at ${exactRun.points} point${exactRun.points === 1 ? "" : "s"}.` : exactRun.disagree.join("; "),
    exactRun.points,
  );

  const numericCheck: NumericCheck | null =
    numericRun.firstPoint === null ? null : { agree: numeric.agree, relativeError: numericRun.compared > 0 ? numericRun.worst : null, point: numericRun.firstPoint };
  return {
    checks: {
      testSource: testSource.agree,
      vocIsc: vocIsc.agree,
      numeric: numeric.agree,
      exactPoint: exactPoint.agree,
      details: { testSource, vocIsc, numeric, exactPoint },
    },
    numericCheck,
  };
}

/**
 * Where a singular open-port system leaves freedom: the nodes whose voltage and the elements whose
 * current can move without any source driving them (the null space of the tableau at a random
 * rational point). null when the tableau is not singular there.
 */
export function undeterminedParts(network: Network, values: ReadonlyMap<string, RationalFunction>, terms: SourceTerms, seed: number): { nodes: string[]; elements: string[] } | null {
  const random = seededRandom(seed ^ 0x0d15);
  const symbols = symbolsOf(values, terms);
  for (let attempt = 0; attempt < TRIES; attempt++) {
    const q = [3, 5, 7, 11][Math.floor(random() * 4)];
    const numerators = Object.fromEntries(symbols.map((s) => [s, BigInt(1 + Math.floor(random() * 97))]));
    const F = rationalField(numerators, BigInt(q));
    const t = buildTableau(network, values, terms, "open", F, Rational.of(numerators[LAPLACE], q));
    if (t === null) continue;
    const solved = eliminate(t.a, t.b, t.n, F);
    if (!("nullVectors" in solved)) return null;
    const moves = (c: number) => solved.nullVectors.some((z) => !z[c].isZero());
    return {
      nodes: t.nodes.filter((node) => moves(t.voltage(node))),
      elements: network.elements.filter((e) => moves(t.current.get(e.name)!)).map((e) => e.name),
    };
  }
  return null;
}
