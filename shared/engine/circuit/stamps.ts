// Element stamps of modified nodal analysis: one function per element kind.
//
// Rows are KCL equations "sum of currents leaving the node = 0" (sources moved to the right side)
// and one branch equation per extra unknown. Unknowns are node voltages V:<node> and branch
// currents I:<element>. An element's reference current flows from its first node, through it,
// to its second node; an op-amp's current I:<name> is what it delivers into its output node.

import { Poly, RationalFunction } from "../algebra";
import type { Element, OpampElement, TwoTerminalElement } from "../types";
import { currentInfix, currentTex, differenceOf, negate, over, sumOf, times, voltageInfix, voltageTex, type Written } from "./display";
import { elementPhrase } from "./elements";
import { LAPLACE, coefficientOf, type Coefficient, type InternalSymbol, type SourceTerm } from "./values";

export const kclRow = (node: string) => `KCL:${node}`;
export const branchRow = (element: string) => `BR:${element}`;
export const voltageUnknown = (node: string) => `V:${node}`;
export const currentUnknown = (element: string) => `I:${element}`;

interface MatrixEntry {
  row: string;
  col: string;
  coeff: Poly;
  display: RationalFunction;
}

/** A right-side term contributed by an independent source. */
interface SourceEntry {
  row: string;
  value: Poly;
  display: RationalFunction;
}

/** The current an element carries out of a node, as the KCL step writes it. */
interface NodeCurrent {
  node: string;
  written: Written;
}

interface BranchEquation {
  row: string;
  unknown: string;
  kind: "constraint" | "control";
  /** "lhs = rhs" */
  equation: Written;
  explanation: string;
}

interface ControlVariable {
  equation: Written;
  explanation: string;
}

export interface ElementStamp {
  element: string;
  kind: Element["kind"];
  entries: MatrixEntry[];
  sources: SourceEntry[];
  currents: NodeCurrent[];
  branch: BranchEquation | null;
  /** The controlling variables a controlled source names, one per controlled part. */
  controls: ControlVariable[];
  internals: InternalSymbol[];
}

export interface StampContext {
  ground: string;
  /** Position of the element in the network, for internal variable names. */
  index: number;
  /** Parsed value (user symbols); null for op-amps. */
  value: RationalFunction | null;
  /** The element's current is an unknown (it is some dependent source's control). */
  branchForm: boolean;
  /** A source's controlled parts (gain × control); empty for every other element. */
  terms: readonly SourceTerm[];
}

const ONE = RationalFunction.constant(1);

function entry(row: string, col: string, c: { poly: Poly; display: RationalFunction }, sign: 1 | -1 = 1): MatrixEntry {
  return sign === 1 ? { row, col, coeff: c.poly, display: c.display } : { row, col, coeff: c.poly.neg(), display: c.display.neg() };
}

const unit = { poly: Poly.one(), display: ONE };

function internalsOf(...cs: (Coefficient | null)[]): InternalSymbol[] {
  return cs.flatMap((c) => (c && c.internal ? [c.internal] : []));
}

/** ±I at the two nodes: the element's branch current enters KCL. */
function branchCurrentEntries(e: { name: string; nodes: [string, string] }): MatrixEntry[] {
  const col = currentUnknown(e.name);
  return [entry(kclRow(e.nodes[0]), col, unit), entry(kclRow(e.nodes[1]), col, unit, -1)];
}

function branchCurrents(e: { name: string; nodes: [string, string] }): NodeCurrent[] {
  const i = { infix: currentInfix(e.name), tex: currentTex(e.name) };
  return [
    { node: e.nodes[0], written: i },
    { node: e.nodes[1], written: negate(i) },
  ];
}

/** The four entries of an admittance between two nodes. */
function admittanceEntries(a: string, b: string, c: Coefficient): MatrixEntry[] {
  return [
    entry(kclRow(a), voltageUnknown(a), c),
    entry(kclRow(a), voltageUnknown(b), c, -1),
    entry(kclRow(b), voltageUnknown(a), c, -1),
    entry(kclRow(b), voltageUnknown(b), c),
  ];
}

/** Entries that add coefficient × (V(c1) − V(c2)) to a row. */
function differenceEntries(row: string, c1: string, c2: string, c: { poly: Poly; display: RationalFunction }, sign: 1 | -1 = 1): MatrixEntry[] {
  return [entry(row, voltageUnknown(c1), c, sign), entry(row, voltageUnknown(c2), c, sign === 1 ? -1 : 1)];
}

function written(lhs: Written, rhs: Written): Written {
  return { infix: `${lhs.infix} = ${rhs.infix}`, tex: `${lhs.tex} = ${rhs.tex}` };
}

function valueWritten(v: RationalFunction): Written {
  return { infix: v.toInfix(), tex: v.toTex() };
}

// ---- passives ---------------------------------------------------------------------------

interface PassiveForm {
  /** Admittance in user symbols. */
  admittance: RationalFunction;
  /** Impedance in user symbols. */
  impedance: RationalFunction;
  /** Current from a to b written from the difference. */
  current: (diff: Written & { terms: number }) => Written;
  phrase: string;
}

function stampPassive(e: TwoTerminalElement, ctx: StampContext, form: PassiveForm): ElementStamp {
  const [a, b] = e.nodes;
  const base = { element: e.name, kind: e.kind, sources: [], controls: [] };
  if (!ctx.branchForm) {
    const y = coefficientOf(form.admittance, e.name, ctx.index, "admittance");
    return {
      ...base,
      entries: admittanceEntries(a, b, y),
      currents: [
        { node: a, written: form.current(differenceOf(a, b, ctx.ground)) },
        { node: b, written: form.current(differenceOf(b, a, ctx.ground)) },
      ],
      branch: null,
      internals: internalsOf(y),
    };
  }
  // Its current controls a source: keep the current as an unknown, with a branch equation.
  const row = branchRow(e.name);
  const i = currentUnknown(e.name);
  const iw = { infix: currentInfix(e.name), tex: currentTex(e.name) };
  const eq = written(iw, form.current(differenceOf(a, b, ctx.ground)));
  const explanation = `The current of ${form.phrase} "${e.name}" controls a source, so it is kept as an unknown with its own branch equation.`;
  const admittancePolynomial = form.admittance.den.constantValue() !== null;
  if (!admittancePolynomial) {
    // V(a) − V(b) − Z·I = 0 keeps the entry a polynomial without an internal variable.
    const z = coefficientOf(form.impedance, e.name, ctx.index, "impedance");
    return {
      ...base,
      entries: [...branchCurrentEntries(e), ...differenceEntries(row, a, b, unit), entry(row, i, z, -1)],
      currents: branchCurrents(e),
      branch: { row, unknown: i, kind: "control", equation: eq, explanation },
      internals: internalsOf(z),
    };
  }
  const y = coefficientOf(form.admittance, e.name, ctx.index, "admittance");
  return {
    ...base,
    entries: [...branchCurrentEntries(e), ...differenceEntries(row, a, b, y), entry(row, i, unit, -1)],
    currents: branchCurrents(e),
    branch: { row, unknown: i, kind: "control", equation: eq, explanation },
    internals: internalsOf(y),
  };
}

function stampResistor(e: TwoTerminalElement, ctx: StampContext): ElementStamp {
  const r = ctx.value!;
  return stampPassive(e, ctx, { admittance: r.inverse(), impedance: r, current: (d) => over(d, r), phrase: "resistor" });
}

function stampConductance(e: TwoTerminalElement, ctx: StampContext): ElementStamp {
  const g = ctx.value!;
  return stampPassive(e, ctx, {
    admittance: g,
    impedance: g.isZero() ? g : g.inverse(),
    current: (d) => times(g, d),
    phrase: "conductance",
  });
}

function stampCapacitor(e: TwoTerminalElement, ctx: StampContext): ElementStamp {
  const y = RationalFunction.variable(LAPLACE).mul(ctx.value!);
  return stampPassive(e, ctx, { admittance: y, impedance: y.isZero() ? y : y.inverse(), current: (d) => times(y, d), phrase: "capacitor" });
}

function stampInductor(e: TwoTerminalElement, ctx: StampContext): ElementStamp {
  const z = RationalFunction.variable(LAPLACE).mul(ctx.value!);
  return stampPassive(e, ctx, { admittance: z.inverse(), impedance: z, current: (d) => over(d, z), phrase: "inductor" });
}

// ---- sources -----------------------------------------------------------------------------
// A source's value is an independent part plus Σ gain × control (across(a, b) or through(x)):
// the independent part goes to the right side, each controlled part into the matrix.

/** One controlled part of a source, ready to stamp into any row. */
interface ControlPart {
  at(row: string, sign: 1 | -1): MatrixEntry[];
  written: Written;
  variable: ControlVariable;
  coefficient: Coefficient;
}

/** A source's controlled parts: each its gain times the controlling quantity, a node-voltage difference (across) or a branch current (through). */
function controlParts(e: TwoTerminalElement, ctx: StampContext): ControlPart[] {
  const label = (letter: "v" | "i", j: number) => {
    const sub = ctx.terms.length > 1 ? `${e.name}_${j + 1}` : e.name;
    return { infix: `${letter}_${sub}`, tex: `${letter}_{${sub.replace(/_/g, "\\_")}}` };
  };
  return ctx.terms.map((term, j): ControlPart => {
    const k = coefficientOf(term.gain, e.name, ctx.index, "gain", false, j);
    if ("nodes" in term.control) {
      const [c1, c2] = term.control.nodes;
      const diff = differenceOf(c1, c2, ctx.ground);
      return {
        at: (row, sign) => differenceEntries(row, c1, c2, k, sign),
        written: times(term.gain, diff),
        variable: {
          equation: written(label("v", j), diff),
          explanation: `The controlling voltage across(${c1}, ${c2}) of "${e.name}" is V(${c1}) − V(${c2}), written directly in the node voltages.`,
        },
        coefficient: k,
      };
    }
    const x = term.control.element;
    const current = { infix: currentInfix(x), tex: currentTex(x) };
    return {
      at: (row, sign) => [entry(row, currentUnknown(x), k, sign)],
      written: times(term.gain, current),
      variable: {
        equation: written(label("i", j), current),
        explanation: `The controlling current through(${x}) of "${e.name}" is the reference current of "${x}", an unknown of the system.`,
      },
      coefficient: k,
    };
  });
}

/** What a source drives: its independent part (when not zero) plus its controlled parts. */
function drivenWritten(value: RationalFunction, parts: ControlPart[]): Written {
  const terms = parts.map((p) => p.written);
  if (!value.isZero() || terms.length === 0) terms.unshift(valueWritten(value));
  return sumOf(terms);
}

function sourceBase(e: TwoTerminalElement, parts: ControlPart[], own: Coefficient) {
  return {
    element: e.name,
    kind: e.kind,
    controls: parts.map((p) => p.variable),
    internals: internalsOf(own, ...parts.map((p) => p.coefficient)),
  };
}

function sourceWords(e: TwoTerminalElement): string {
  const phrase = elementPhrase(e);
  return phrase.charAt(0).toUpperCase() + phrase.slice(1);
}

/**
 * Where a source's output goes: a branch equation "output = what the source drives" in its own
 * row, with its current I a new unknown entering KCL at its nodes (the output is V(a) − V(b) for
 * a voltage source, I itself for a current source whose current controls another source), or an
 * injection of what it drives into the KCL rows of its two nodes.
 */
type SourceOutput =
  | { form: "branch"; kind: BranchEquation["kind"]; output: Written; outputEntries: (row: string) => MatrixEntry[]; explanation: string }
  | { form: "injection" };

/**
 * Every source stamp, independent or controlled (VCVS, CCVS, VCCS, CCCS and their mixtures): the
 * controlled parts (controlParts: a node-voltage difference or a branch current, times its gain)
 * go where the output goes, with the sign that moves them to the left side; the independent part
 * goes to the right side.
 */
function stampSource(e: TwoTerminalElement, ctx: StampContext, to: SourceOutput): ElementStamp {
  const [a, b] = e.nodes;
  const v = coefficientOf(ctx.value!, e.name, ctx.index, "source");
  const parts = controlParts(e, ctx);
  const driven = drivenWritten(ctx.value!, parts);
  if (to.form === "injection") {
    // The source current leaves node a and enters node b; its independent part changes sign on the right side.
    return {
      ...sourceBase(e, parts, v),
      entries: parts.flatMap((p) => [...p.at(kclRow(a), 1), ...p.at(kclRow(b), -1)]),
      sources: [
        { row: kclRow(a), value: v.poly.neg(), display: v.display.neg() },
        { row: kclRow(b), value: v.poly, display: v.display },
      ],
      currents: [
        { node: a, written: driven },
        { node: b, written: negate(driven) },
      ],
      branch: null,
    };
  }
  const row = branchRow(e.name);
  return {
    ...sourceBase(e, parts, v),
    entries: [...branchCurrentEntries(e), ...to.outputEntries(row), ...parts.flatMap((p) => p.at(row, -1))],
    sources: [{ row, value: v.poly, display: v.display }],
    currents: branchCurrents(e),
    branch: { row, unknown: currentUnknown(e.name), kind: to.kind, equation: written(to.output, driven), explanation: to.explanation },
  };
}

/** A voltage source (VCVS or CCVS when controlled): V(a) − V(b) − Σ gain·control = independent part; its current is a new unknown. */
function stampVoltageSource(e: TwoTerminalElement, ctx: StampContext): ElementStamp {
  const [a, b] = e.nodes;
  return stampSource(e, ctx, {
    form: "branch",
    kind: "constraint",
    output: differenceOf(a, b, ctx.ground),
    outputEntries: (row) => differenceEntries(row, a, b, unit),
    explanation:
      ctx.terms.length === 0
        ? `Voltage source "${e.name}" fixes the voltage between its nodes; its current is a new unknown.`
        : `${sourceWords(e)} "${e.name}" sets the voltage between its nodes from its controls; its current is a new unknown.`,
  });
}

/** A current source (VCCS or CCCS when controlled): drives its value from a to b; kept as a current unknown when some source names through() it. */
function stampCurrentSource(e: TwoTerminalElement, ctx: StampContext): ElementStamp {
  if (!ctx.branchForm) return stampSource(e, ctx, { form: "injection" });
  return stampSource(e, ctx, {
    form: "branch",
    kind: "control",
    output: { infix: currentInfix(e.name), tex: currentTex(e.name) },
    outputEntries: (row) => [entry(row, currentUnknown(e.name), unit)],
    explanation: `The current of ${elementPhrase(e)} "${e.name}" controls another source, so it is kept as an unknown equal to what the source drives.`,
  });
}

// ---- op-amp ------------------------------------------------------------------------------

/** Nullor: the nullator holds V(p) = V(n) and draws no current; the norator's output current is free. */
function stampOpamp(e: OpampElement, ctx: StampContext): ElementStamp {
  const [p, n] = e.inputs;
  const row = branchRow(e.name);
  const i = currentUnknown(e.name);
  const iw = { infix: currentInfix(e.name), tex: currentTex(e.name) };
  const side = (x: string) => (x === ctx.ground ? { infix: "0", tex: "0" } : { infix: voltageInfix(x), tex: voltageTex(x) });
  // Written with the node voltage on the left: V_p = V_n, or V_n = 0 when p is ground.
  const [lhs, rhs] = p === ctx.ground ? [side(n), side(p)] : [side(p), side(n)];
  return {
    element: e.name,
    kind: e.kind,
    entries: [entry(kclRow(e.output), i, unit, -1), ...differenceEntries(row, p, n, unit)],
    sources: [],
    currents: [{ node: e.output, written: negate(iw) }],
    branch: {
      row,
      unknown: i,
      kind: "constraint",
      equation: written(lhs, rhs),
      explanation: `Ideal op-amp "${e.name}" holds its inputs at equal voltage and draws no input current; the current it delivers at its output is a new unknown.`,
    },
    controls: [],
    internals: [],
  };
}

export function stampElement(e: Element, ctx: StampContext): ElementStamp {
  switch (e.kind) {
    case "resistor":
      return stampResistor(e as TwoTerminalElement, ctx);
    case "conductance":
      return stampConductance(e as TwoTerminalElement, ctx);
    case "capacitor":
      return stampCapacitor(e as TwoTerminalElement, ctx);
    case "inductor":
      return stampInductor(e as TwoTerminalElement, ctx);
    case "voltage":
      return stampVoltageSource(e as TwoTerminalElement, ctx);
    case "current":
      return stampCurrentSource(e as TwoTerminalElement, ctx);
    case "opamp":
      return stampOpamp(e as OpampElement, ctx);
  }
}
