// The dimension check. Each symbol gets a quantity (declared, or inferred from the element its value
// sits on); each result is then tested by scaling: multiplying every symbol by λ_V^a λ_A^b λ_T^c for
// its unit V^a A^b s^c must multiply Rth by λ_V/λ_A, Vth by λ_V, Isc by λ_A.

import { RationalFunction } from "../algebra";
import type { Diagnostic, DimensionReport, Network, Quantity, ResultName } from "../types";
import { diagnostic } from "./diagnostics";
import { gainQuantity, isOpamp, valueQuantity } from "./elements";
import { assembleNodalSystem } from "./mna";
import { floatPortValues, seededRandom } from "./numeric";
import { LAPLACE, type SourceTerm, type SourceTerms } from "./values";

/** Exponents of volt, ampere and second. */
type Dim = readonly [number, number, number];

const QUANTITY_DIMS: Record<Quantity, Dim> = {
  resistance: [1, -1, 0],
  conductance: [-1, 1, 0],
  voltage: [1, 0, 0],
  current: [0, 1, 0],
  dimensionless: [0, 0, 0],
  transconductance: [-1, 1, 0],
  transresistance: [1, -1, 0],
  capacitance: [-1, 1, 1],
  inductance: [1, -1, 1],
  frequency: [0, 0, -1],
  time: [0, 0, 1],
};

const UNIT_NAMES: [Dim, string][] = [
  [[1, -1, 0], "Ω"],
  [[-1, 1, 0], "S"],
  [[1, 0, 0], "V"],
  [[0, 1, 0], "A"],
  [[0, 0, 0], "1"],
  [[-1, 1, 1], "F"],
  [[1, -1, 1], "H"],
  [[0, 0, -1], "1/s"],
  [[0, 0, 1], "s"],
];

const sameDim = (x: Dim, y: Dim) => x[0] === y[0] && x[1] === y[1] && x[2] === y[2];
const addDim = (x: Dim, y: Dim, k = 1): Dim => [x[0] + k * y[0], x[1] + k * y[1], x[2] + k * y[2]];

function unitOf(d: Dim): string {
  const named = UNIT_NAMES.find(([u]) => sameDim(u, d));
  if (named) return named[1];
  const parts = (["V", "A", "s"] as const).flatMap((u, i) => (d[i] === 0 ? [] : [d[i] === 1 ? u : `${u}^${d[i]}`]));
  return parts.join("·");
}

function quantityOfDim(d: Dim): Quantity | null {
  for (const q of ["resistance", "conductance", "voltage", "current", "dimensionless", "capacitance", "inductance", "frequency", "time"] as const) {
    if (sameDim(QUANTITY_DIMS[q], d)) return q;
  }
  return null;
}

interface Known {
  dim: Dim;
  quantity: Quantity | null;
  source: string;
}

interface Term {
  exps: Record<string, number>;
}

function termsOf(p: RationalFunction["num"]): Term[] {
  return p.terms().map((t) => ({ exps: t.monomial }));
}

/** Infer quantities from element values, by propagation until nothing changes. */
function inferQuantities(
  network: Network,
  values: ReadonlyMap<string, RationalFunction>,
  declared: Record<string, Quantity>,
  terms: SourceTerms = new Map(),
): { known: Map<string, Known>; conflicts: DimensionReport["conflicts"]; diagnostics: Diagnostic[] } {
  const known = new Map<string, Known>();
  for (const [s, q] of Object.entries(declared)) known.set(s, { dim: QUANTITY_DIMS[q], quantity: q, source: "declared" });
  if (!known.has(LAPLACE)) known.set(LAPLACE, { dim: QUANTITY_DIMS.frequency, quantity: "frequency", source: "Laplace variable" });

  const constraints = network.elements.flatMap((e) => {
    if (isOpamp(e)) return [];
    const v = values.get(e.name);
    const q = valueQuantity(e.kind);
    const own = v && q ? [{ element: e.name, quantity: q, target: QUANTITY_DIMS[q], num: termsOf(v.num), den: termsOf(v.den) }] : [];
    // Each gain of a controlled source carries the unit that turns its control into the source's output.
    const gains = (terms.get(e.name) ?? []).map((t) => {
      const g = gainQuantity(e.kind, t.control);
      return { element: e.name, quantity: g, target: QUANTITY_DIMS[g], num: termsOf(t.gain.num), den: termsOf(t.gain.den) };
    });
    return [...own, ...gains];
  });
  const conflicts = new Map<string, { symbol: string; quantities: Set<Quantity>; elements: Set<string> }>();
  const noteConflict = (symbol: string, a: Known, demanded: Dim, element: string) => {
    const c = conflicts.get(symbol) ?? { symbol, quantities: new Set<Quantity>(), elements: new Set<string>() };
    if (a.quantity) c.quantities.add(a.quantity);
    const dq = quantityOfDim(demanded);
    if (dq) c.quantities.add(dq);
    if (a.source !== "declared" && a.source !== "Laplace variable") c.elements.add(a.source);
    c.elements.add(element);
    conflicts.set(symbol, c);
  };

  const termDim = (t: Term): { dim: Dim; unknown: string[] } => {
    let dim: Dim = [0, 0, 0];
    const unknown: string[] = [];
    for (const [v, k] of Object.entries(t.exps)) {
      const kn = known.get(v);
      if (kn) dim = addDim(dim, kn.dim, k);
      else unknown.push(v);
    }
    return { dim, unknown };
  };

  // Terms of one side must all have `side` dimension; solve lone unknowns, flag lone mismatches.
  const settle = (terms: Term[], side: Dim, c: (typeof constraints)[number], lone: boolean): boolean => {
    let changed = false;
    for (const t of terms) {
      const { dim, unknown } = termDim(t);
      if (unknown.length === 1) {
        const v = unknown[0];
        const k = t.exps[v];
        const rest = addDim(side, dim, -1);
        if (rest.every((x) => x % k === 0)) {
          const d: Dim = [rest[0] / k, rest[1] / k, rest[2] / k];
          const isLone = lone && terms.length === 1 && k === 1 && Object.keys(t.exps).length === 1;
          known.set(v, { dim: d, quantity: isLone && sameDim(d, c.target) ? c.quantity : quantityOfDim(d), source: c.element });
          changed = true;
        }
      } else if (unknown.length === 0 && !sameDim(dim, side)) {
        const vars = Object.keys(t.exps);
        if (vars.length === 1) noteConflict(vars[0], known.get(vars[0])!, [side[0] / t.exps[vars[0]], side[1] / t.exps[vars[0]], side[2] / t.exps[vars[0]]], c.element);
      }
    }
    return changed;
  };

  for (let round = 0; round < 50; round++) {
    let changed = false;
    for (const c of constraints) {
      const numConstant = c.num.length === 1 && Object.keys(c.num[0].exps).length === 0;
      const denConstant = c.den.length === 1 && Object.keys(c.den[0].exps).length === 0;
      if (numConstant && denConstant) continue; // a plain number carries the element's unit
      if (denConstant) {
        changed = settle(c.num, c.target, c, true) || changed;
        continue;
      }
      const knownNum = c.num.map(termDim).find((t) => t.unknown.length === 0);
      const knownDen = c.den.map(termDim).find((t) => t.unknown.length === 0);
      const numSide = knownNum ? knownNum.dim : knownDen ? addDim(knownDen.dim, c.target) : null;
      const denSide = knownDen ? knownDen.dim : knownNum ? addDim(knownNum.dim, c.target, -1) : null;
      if (numSide) changed = settle(c.num, numSide, c, false) || changed;
      if (denSide) changed = settle(c.den, denSide, c, false) || changed;
    }
    if (!changed) break;
  }

  const list = [...conflicts.values()].map((c) => ({ symbol: c.symbol, quantities: [...c.quantities], elements: [...c.elements] }));
  const diagnostics = list.map((c) =>
    diagnostic(
      "quantity-conflict",
      `symbol "${c.symbol}" is used as ${c.quantities.join(" and as ")} by ${c.elements.map((e) => `"${e}"`).join(", ")}; results mixing them are not dimensionally sound`,
      { elements: c.elements },
    ),
  );
  return { known, conflicts: list, diagnostics };
}

const EXPECTED: Record<ResultName, Quantity> = { vth: "voltage", isc: "current", rth: "resistance", rthFromVocIsc: "resistance" };
const LABEL: Record<ResultName, string> = { vth: "Vth", isc: "Isc", rth: "Rth", rthFromVocIsc: "Voc/Isc" };

/**
 * Check every result by scaling a floating-point solve of the network. Plain-number element values are
 * given their element's unit for the test (they become placeholder symbols), so "1k" counts as ohms.
 */
export function checkDimensions(
  network: Network,
  values: ReadonlyMap<string, RationalFunction>,
  terms: SourceTerms,
  results: Partial<Record<ResultName, RationalFunction | null>>,
  declared: Record<string, Quantity>,
  seed: number,
): { report: DimensionReport; diagnostics: Diagnostic[] } {
  const { known, conflicts, diagnostics } = inferQuantities(network, values, declared, terms);
  const symbols = new Set<string>();
  for (const v of values.values()) for (const s of v.variables()) symbols.add(s);
  for (const ts of terms.values()) for (const t of ts) for (const s of t.gain.variables()) symbols.add(s);
  if (network.elements.some((e) => e.kind === "capacitor" || e.kind === "inductor")) symbols.add(LAPLACE);
  const quantities: Record<string, Quantity | null> = {};
  const sources: Record<string, string> = {};
  for (const s of [...symbols].sort()) {
    const k = known.get(s);
    quantities[s] = k ? k.quantity : null;
    if (k) sources[s] = k.source;
  }
  const unknownSymbols = [...symbols].filter((s) => !known.has(s));

  // Placeholders for plain-number values, carrying their element's unit.
  const dimValues = new Map(values);
  const dims = new Map<string, Dim>([...known].map(([s, k]) => [s, k.dim]));
  const base: Record<string, number> = {};
  network.elements.forEach((e, i) => {
    if (isOpamp(e)) return;
    const v = values.get(e.name);
    const c = v?.constantValue();
    const q = valueQuantity(e.kind);
    if (!v || !c || c.isZero() || !q) return;
    const name = `$n${i + 1}`;
    dimValues.set(e.name, RationalFunction.variable(name));
    dims.set(name, QUANTITY_DIMS[q]);
    base[name] = c.toNumber();
  });
  const dimTerms = new Map<string, SourceTerm[]>();
  network.elements.forEach((e, i) => {
    const ts = terms.get(e.name);
    if (!ts) return;
    dimTerms.set(
      e.name,
      ts.map((t, j) => {
        const c = t.gain.constantValue();
        if (!c || c.isZero()) return t;
        const name = `$n${i + 1}_${j + 1}`;
        dims.set(name, QUANTITY_DIMS[gainQuantity(e.kind, t.control)]);
        base[name] = c.toNumber();
        return { control: t.control, gain: RationalFunction.variable(name) };
      }),
    );
  });

  const checks: DimensionReport["checks"] = {};
  const names = (Object.keys(results) as ResultName[]).filter((r) => results[r] !== undefined && results[r] !== null);
  const needScaling = names.filter((r) => {
    const f = results[r]!;
    return !f.isZero() && !f.variables().some((s) => unknownSymbols.includes(s));
  });
  for (const r of names) {
    const f = results[r]!;
    const expected = EXPECTED[r];
    if (f.isZero()) {
      checks[r] = { expected, status: "ok", found: null, message: `${LABEL[r]} = 0, which carries any unit` };
    } else {
      const missing = f.variables().filter((s) => unknownSymbols.includes(s));
      if (missing.length > 0) {
        checks[r] = {
          expected,
          status: "unknown",
          found: null,
          message: `no quantity is known for ${missing.map((s) => `"${s}"`).join(", ")}; declare ${missing.length > 1 ? "them" : "it"} (quantity <symbol> <quantity>)`,
        };
      }
    }
  }
  if (needScaling.length > 0) {
    const sys = assembleNodalSystem(network, dimValues, dimTerms);
    const random = seededRandom(seed);
    const scaled = (point: Record<string, number>, l: Dim) => {
      const out: Record<string, number> = {};
      for (const [s, x] of Object.entries(point)) {
        const d = dims.get(s) ?? [0, 0, 0];
        out[s] = x * l[0] ** d[0] * l[1] ** d[1] * l[2] ** d[2];
      }
      return out;
    };
    const valueOf = (point: Record<string, number>, r: ResultName): number | null => {
      const f = floatPortValues(sys, network.port, point);
      if (r === "rthFromVocIsc") return f.vth !== null && f.isc !== null && f.isc !== 0 ? f.vth / f.isc : null;
      return f[r];
    };
    for (const r of needScaling) {
      const expected = EXPECTED[r];
      let done = false;
      for (let attempt = 0; attempt < 4 && !done; attempt++) {
        const p0: Record<string, number> = { ...base };
        for (const s of symbols) p0[s] = 0.5 + 1.5 * random();
        for (const s of Object.keys(base)) p0[s] = base[s] * (0.5 + random());
        const f0 = valueOf(p0, r);
        if (f0 === null || !Number.isFinite(f0) || Math.abs(f0) < 1e-200) continue;
        const exps: number[] = [];
        let homogeneous = true;
        for (const l of [
          [2, 1, 1],
          [1, 2, 1],
          [1, 1, 2],
        ] as Dim[]) {
          const f1 = valueOf(scaled(p0, l), r);
          const e = f1 === null ? NaN : Math.log2(f1 / f0);
          if (!Number.isFinite(e) || Math.abs(e - Math.round(e)) > 1e-6) homogeneous = false;
          exps.push(Math.round(e));
        }
        const found: Dim = [exps[0], exps[1], exps[2]];
        if (homogeneous) {
          const mix: Dim = [1.5, 0.7, 1.3];
          const fm = valueOf(scaled(p0, mix), r);
          const want = f0 * mix[0] ** found[0] * mix[1] ** found[1] * mix[2] ** found[2];
          if (fm === null || Math.abs(fm - want) > 1e-6 * Math.abs(want)) homogeneous = false;
        }
        done = true;
        if (!homogeneous) {
          checks[r] = {
            expected,
            status: "inhomogeneous",
            found: null,
            message: `${LABEL[r]} adds terms of different units; check the quantities of its symbols`,
          };
        } else if (sameDim(found, QUANTITY_DIMS[expected])) {
          checks[r] = { expected, status: "ok", found: unitOf(found), message: `${LABEL[r]} comes out in ${unitOf(found)}` };
        } else {
          checks[r] = {
            expected,
            status: "mismatch",
            found: unitOf(found),
            message: `${LABEL[r]} comes out in ${unitOf(found)}, not ${unitOf(QUANTITY_DIMS[expected])}; check the quantities of its symbols`,
          };
        }
      }
      if (!done) checks[r] = { expected, status: "unknown", found: null, message: `${LABEL[r]} could not be evaluated at test points` };
    }
  }
  for (const r of names) {
    const c = checks[r];
    if (c && (c.status === "mismatch" || c.status === "inhomogeneous")) {
      diagnostics.push(diagnostic("dimension-mismatch", c.message, {}));
    }
  }
  return { report: { quantities, sources, conflicts, checks }, diagnostics };
}
