// The ledger: the derivation as an ordered list of steps with stable ids, in our own words.
// Deterministic: the same network gives the same steps, in network order.

import { RationalFunction, type Poly } from "../algebra";
import type { Network, Step } from "../types";
import { currentTex, differenceOf, labelTex, sumOf, times, voltageTex, type Written } from "./display";
import { elementNodes, elementPhrase, isOpamp, networkNodes, sourceControls } from "./elements";
import type { NodalSystem, Unknown } from "./mna";
import type { OpenPortSolution, ShortPortSolution } from "./port-solution";
import { displayRing, portVector, shortPort, zeroIndependentSources } from "./ports";
import { kclRow } from "./stamps";
import type { SourceTerms } from "./values";

/** Expressions longer than this many terms are left out of the TeX (the data keeps them). */
const TEX_TERM_LIMIT = 300;

export interface LedgerInput {
  network: Network;
  system: NodalSystem;
  values: ReadonlyMap<string, RationalFunction>;
  /** The controlled parts of each controlled source. */
  terms: SourceTerms;
  open: OpenPortSolution;
  short: ShortPortSolution;
  vth: RationalFunction | null;
  rth: RationalFunction | null;
  isc: RationalFunction | null;
  rthFromVocIsc: RationalFunction | null;
  agree: boolean | null;
}

function size(f: RationalFunction): number {
  return f.num.termCount() + f.den.termCount();
}

function texOf(f: RationalFunction | null): string {
  if (f === null) return "\\text{none}";
  if (size(f) > TEX_TERM_LIMIT) return `\\text{(${f.num.termCount()} / ${f.den.termCount()} terms)}`;
  return f.compactTex();
}

/** Expressions of the ledger's data; a large result is referenced by name instead of repeated. */
const DATA_TERM_LIMIT = 2000;

type ResultData = string | null | { result: string; terms: number };

function dataOf(f: RationalFunction | null, name: string): ResultData {
  if (f === null) return null;
  return size(f) > DATA_TERM_LIMIT ? { result: name, terms: size(f) } : f.toInfix();
}

function polyTex(p: Poly): string {
  return p.termCount() > TEX_TERM_LIMIT ? `\\text{(${p.termCount()} terms)}` : p.toTex();
}

function matrixTex(rows: string[][]): string {
  return `\\begin{bmatrix} ${rows.map((r) => r.join(" & ")).join(" \\\\ ")} \\end{bmatrix}`;
}

function systemTex(a: RationalFunction[][], unknowns: Unknown[], b: RationalFunction[]): string {
  const entry = (f: RationalFunction) => (size(f) > 40 ? "\\ast" : f.toTex());
  return `${matrixTex(a.map((r) => r.map(entry)))} ${matrixTex(unknowns.map((u) => [u.tex]))} = ${matrixTex(b.map((x) => [entry(x)]))}`;
}

function systemData(a: RationalFunction[][], unknowns: Unknown[], b: RationalFunction[]): Record<string, unknown> {
  return {
    unknowns: unknowns.map((u) => u.infix),
    matrix: a.map((r) => r.map((f) => f.toInfix())),
    rhs: b.map((f) => f.toInfix()),
  };
}

/** The ledger: one builder per phase of the derivation, in the order a reader follows it. */
export function buildLedger(input: LedgerInput): Step[] {
  return [
    ...portSteps(input),
    ...openPortSteps(input),
    ...kclSteps(input.system),
    ...controlVariableSteps(input.system),
    ...branchEquationSteps(input.system),
    ...openPortSolutionSteps(input),
    ...testSourceSteps(input),
    ...shortPortSteps(input),
    ...vocIscSteps(input),
    ...equivalentSteps(input),
  ];
}

/** The port and the network as given. */
function portSteps(input: LedgerInput): Step[] {
  const { network } = input;
  const { port, ground } = network;
  const portTex = `V_{th} = ${differenceOf(port.plus, port.minus, ground).tex}`;
  const nodes = networkNodes(network);
  const controlled = network.elements.filter((e) => sourceControls(e).length > 0);
  const controls = Object.fromEntries(controlled.map((e) => [e.name, sourceControls(e).map(controlText)]));
  const controlSentence =
    controlled.length === 0
      ? ""
      : `; the controlled sources and their controls: ${controlled.map((e) => `"${e.name}", a ${elementPhrase(e)}, by ${controls[e.name].join(" and ")}`).join("; ")}`;
  return [
    {
      id: "port",
      kind: "port",
      title: "The port",
      explanation: `The port is taken from node "${port.plus}" (+) to node "${port.minus}" (−), with node "${ground}" as ground. Vth is the voltage across it when open; Isc is the current leaving at "${port.plus}" through a short.`,
      tex: portTex,
      data: { plus: port.plus, minus: port.minus, ground },
    },
    {
      id: "network",
      kind: "network",
      title: "The network as given",
      explanation: `${network.elements.length} element${network.elements.length === 1 ? "" : "s"} on ${nodes.length} node${nodes.length === 1 ? "" : "s"} besides ground. Each element's reference current runs from its first node to its second${controlSentence}.`,
      tex: `\\begin{aligned} ${network.elements.map((e) => elementTex(e, input.values, input.terms)).join(" \\\\ ")} \\end{aligned}`,
      data: { elements: network.elements, nodes, controls },
    },
  ];
}

/** The open port and the unknowns of the nodal system. */
function openPortSteps(input: LedgerInput): Step[] {
  const sys = input.system;
  return [
    {
      id: "vth.setup",
      kind: "setup",
      title: "Open port",
      explanation: "Nothing is connected to the port, so no current flows through it; every source keeps its value.",
      tex: "I_{\\text{port}} = 0",
      data: { port: "open" },
    },
    {
      id: "vth.unknowns",
      kind: "unknowns",
      title: "The unknowns",
      explanation: `One voltage per node besides ground, plus one current for each source that fixes a voltage, each op-amp output and each element whose current controls a source: ${sys.unknowns.length} in all.`,
      tex: `x = ${matrixTex([sys.unknowns.map((u) => u.tex)])}^{T}`,
      data: { unknowns: sys.unknowns.map((u) => ({ name: u.infix, kind: u.kind, of: u.of })) },
    },
  ];
}

/** KCL at each node: the currents leaving it, element by element, add up to zero. */
function kclSteps(sys: NodalSystem): Step[] {
  return sys.nodes.map((n) => {
    const contributions = sys.stamps.flatMap((s) => s.currents.filter((c) => c.node === n).map((c) => ({ element: s.element, current: c.written })));
    const lhs = sumOf(contributions.map((c) => c.current));
    const r = sys.rowIndex.get(kclRow(n))!;
    return {
      id: `vth.kcl.${n}`,
      kind: "kcl",
      title: `KCL at node ${n}`,
      explanation: `The currents leaving node "${n}" through ${contributions.map((c) => `"${c.element}"`).join(", ")} add up to zero.`,
      tex: `${lhs.tex} = 0`,
      data: {
        node: n,
        contributions: contributions.map((c) => ({ element: c.element, current: c.current.infix })),
        equation: `${lhs.infix} = 0`,
        row: rowData(sys.aDisplay[r], sys.unknowns, sys.bDisplay[r]),
      },
    };
  });
}

/** The controlling variables of each controlled source, in the unknowns of the system. */
function controlVariableSteps(sys: NodalSystem): Step[] {
  return sys.stamps.flatMap((s): Step[] => {
    if (s.controls.length === 0) return [];
    const several = s.controls.length > 1;
    return [
      {
        id: `vth.control.${s.element}`,
        kind: "control",
        title: `Controlling variable${several ? "s" : ""} of ${s.element}`,
        explanation: s.controls.map((c) => c.explanation).join(" "),
        tex: s.controls.map((c) => c.equation.tex).join(",\\quad "),
        data: { element: s.element, equation: s.controls.map((c) => c.equation.infix).join(", "), equations: s.controls.map((c) => c.equation.infix) },
      },
    ];
  });
}

/** The branch equations: source constraints, op-amp inputs, elements whose current controls a source. */
function branchEquationSteps(sys: NodalSystem): Step[] {
  return sys.stamps.flatMap((s): Step[] => {
    if (!s.branch) return [];
    const r = sys.rowIndex.get(s.branch.row)!;
    return [
      {
        id: `vth.branch.${s.element}`,
        kind: s.branch.kind,
        title: s.branch.kind === "constraint" ? `Source constraint of ${s.element}` : `Branch equation of ${s.element}`,
        explanation: s.branch.explanation,
        tex: s.branch.equation.tex,
        data: { element: s.element, equation: s.branch.equation.infix, row: rowData(sys.aDisplay[r], sys.unknowns, sys.bDisplay[r]) },
      },
    ];
  });
}

/** The open-port system in matrix form, solved for Vth. */
function openPortSolutionSteps(input: LedgerInput): Step[] {
  const { system: sys, open } = input;
  return [
    {
      id: "vth.matrix",
      kind: "matrix",
      title: "The open-port system",
      explanation: "The equations above in matrix form A x = b, with the independent sources on the right side.",
      tex: systemTex(sys.aDisplay, sys.unknowns, sys.bDisplay),
      data: systemData(sys.aDisplay, sys.unknowns, sys.bDisplay),
    },
    {
      id: "vth.solution",
      kind: "solution",
      title: "Solving for Vth",
      explanation: open.singular
        ? "det A is zero: the open-port equations have no unique solution, so the port has no Thevenin voltage."
        : "By Cramer's rule with division-free determinants, Vth = cᵀx, where c picks V(plus) − V(minus). Δ is det A with the element values' denominators cleared; the result is in lowest terms.",
      tex: open.singular ? "\\det A = 0" : `\\Delta = ${polyTex(open.determinant)}, \\qquad V_{th} = ${texOf(input.vth)}`,
      data: {
        singular: open.singular,
        determinant: open.singular ? "0" : open.determinant.termCount() <= TEX_TERM_LIMIT ? open.determinant.toInfix() : null,
        determinantTerms: open.determinant.termCount(),
        vth: dataOf(input.vth, "vth"),
      },
    },
  ];
}

/** Rth by a test source: the independent sources zeroed, the test current, its system and solution. */
function testSourceSteps(input: LedgerInput): Step[] {
  const { network, system: sys, open } = input;
  const { port } = network;
  const zeroed = zeroIndependentSources(network, input.values);
  const valueTex = (name: string) => input.values.get(name)?.toTex() ?? "0";
  const zeroTex = [...zeroed.shorted, ...zeroed.opened, ...zeroed.partly].map((n) => `\\mathrm{${n.replace(/_/g, "\\_")}}:\\ ${valueTex(n)} \\to 0`);
  const zeroPhrase = [
    zeroed.shorted.length > 0 ? `voltage source${zeroed.shorted.length > 1 ? "s" : ""} ${listOrNone(zeroed.shorted)} become${zeroed.shorted.length > 1 ? "" : "s"} a short` : "",
    zeroed.opened.length > 0 ? `current source${zeroed.opened.length > 1 ? "s" : ""} ${listOrNone(zeroed.opened)} become${zeroed.opened.length > 1 ? "" : "s"} an open` : "",
    zeroed.partly.length > 0 ? `the independent part${zeroed.partly.length > 1 ? "s" : ""} of controlled source${zeroed.partly.length > 1 ? "s" : ""} ${listOrNone(zeroed.partly)} ${zeroed.partly.length > 1 ? "are" : "is"} set to zero` : "",
  ].filter((x) => x !== "");
  const c = portVector(sys, port);
  const cDisplay = c.map((p) => RationalFunction.constant(p.constantValue()!));
  return [
    {
      id: "rth.zeroing",
      kind: "zeroing",
      title: "Independent sources zeroed",
      explanation:
        zeroed.shorted.length + zeroed.opened.length + zeroed.partly.length === 0
          ? "The network has no independent sources, so nothing is zeroed; dependent sources always stay."
          : `${capitalize(zeroPhrase.join(" and "))}; dependent sources stay.`,
      tex: zeroTex.length > 0 ? zeroTex.join(",\\quad ") : "\\text{no independent sources}",
      data: zeroed,
    },
    {
      id: "rth.test-source",
      kind: "test-source",
      title: "Test source at the port",
      explanation: `A test current I_T enters at "${port.plus}" and leaves at "${port.minus}"; the voltage it produces across the port, divided by I_T, is Rth. I_T = 1 A is used.`,
      tex: `I_T = 1\\,\\mathrm{A}, \\qquad R_{th} = \\frac{V_T}{I_T}`,
      data: { plus: port.plus, minus: port.minus, current: "1" },
    },
    {
      id: "rth.matrix",
      kind: "matrix",
      title: "The test-source system",
      explanation: "The left side is the same matrix A; the right side now holds only the test current at the port nodes.",
      tex: systemTex(sys.aDisplay, sys.unknowns, cDisplay),
      data: systemData(sys.aDisplay, sys.unknowns, cDisplay),
    },
    {
      id: "rth.solution",
      kind: "solution",
      title: "Solving for Rth",
      explanation: open.singular
        ? "det A is zero: with the sources zeroed, no finite voltage answers the test current, so Rth is infinite."
        : "Rth = cᵀx for the test current, by the same cofactors of A, reduced to lowest terms.",
      tex: open.singular ? "R_{th} = \\infty" : `R_{th} = ${texOf(input.rth)}`,
      data: { singular: open.singular, rth: dataOf(input.rth, "rth") },
    },
  ];
}

/** Isc from the shorted port: the short, its system and solution. */
function shortPortSteps(input: LedgerInput): Step[] {
  const { network, system: sys, short } = input;
  const { port, ground } = network;
  const sd = shortPort(sys, port, sys.aDisplay, sys.bDisplay, displayRing);
  const mergedTex = `${voltageOrZero(port.plus, ground)} = ${voltageOrZero(port.minus, ground)}`;
  return [
    {
      id: "isc.short",
      kind: "short",
      title: "Shorted port",
      explanation: `A short joins "${sd.merged}" to "${sd.into}", so their voltages are equal; the KCL equation of "${sd.merged}" then gives the current through the short.`,
      tex: mergedTex,
      data: { merged: sd.merged, into: sd.into, probe: rowData(sd.probeRow, sd.unknowns, sd.probeRhs), sign: sd.sign },
    },
    {
      id: "isc.matrix",
      kind: "matrix",
      title: "The shorted-port system",
      explanation: `With "${sd.merged}" joined to "${sd.into}", its voltage column and KCL row merge into the other node's.`,
      tex: systemTex(sd.a, sd.unknowns, sd.b),
      data: systemData(sd.a, sd.unknowns, sd.b),
    },
    {
      id: "isc.solution",
      kind: "solution",
      title: "Solving for Isc",
      explanation: short.singular
        ? "The shorted-port equations have no unique solution: the port fixes its own voltage (Rth = 0), so the short current is unbounded."
        : "Cramer's rule on the shorted system gives the node voltages; the short current is what the merged node's KCL leaves over.",
      tex: short.singular ? "I_{sc}\\ \\text{unbounded}" : `I_{sc} = ${texOf(input.isc)}`,
      data: { singular: short.singular, isc: dataOf(input.isc, "isc"), determinantTerms: short.determinant.termCount() },
    },
  ];
}

/** Voc/Isc against the test-source Rth. */
function vocIscSteps(input: LedgerInput): Step[] {
  return [
    {
      id: "check.voc-isc",
      kind: "cross-check",
      title: "Cross-check: Voc / Isc",
      explanation:
        input.rthFromVocIsc === null
          ? "Voc/Isc cannot be formed here (one of them does not exist, or both are zero), so Rth rests on the test source alone."
          : input.agree
            ? "Voc divided by Isc, from two separate solves, equals the test-source Rth exactly."
            : "Voc divided by Isc does NOT equal the test-source Rth; the derivation should not be trusted.",
      tex: input.rthFromVocIsc === null ? "\\frac{V_{th}}{I_{sc}}\\ \\text{undefined}" : `\\frac{V_{th}}{I_{sc}} = ${texOf(input.rthFromVocIsc)} ${input.agree ? "= R_{th}" : "\\neq R_{th}"}`,
      data: { rthFromVocIsc: dataOf(input.rthFromVocIsc, "rthFromVocIsc"), agree: input.agree },
    },
  ];
}

/** The Thevenin and Norton equivalents, or why there is none. */
function equivalentSteps(input: LedgerInput): Step[] {
  const thevenin = input.vth !== null && input.rth !== null;
  const norton = input.isc !== null && input.rth !== null && !input.rth.isZero();
  return [
    {
      id: "result.thevenin",
      kind: "equivalent",
      title: "Thevenin equivalent",
      explanation: thevenin
        ? "Seen from the port, the network is a voltage source Vth in series with Rth."
        : input.isc !== null
          ? "The port behaves as an ideal current source (Rth is infinite), so it has no Thevenin form."
          : "Neither the open nor the shorted port has a unique solution, so there is no Thevenin form.",
      tex: thevenin ? `V_{th} = ${texOf(input.vth)}, \\qquad R_{th} = ${texOf(input.rth)}` : input.isc !== null ? "R_{th} = \\infty" : "\\text{no unique solution}",
      data: { exists: thevenin, vth: dataOf(input.vth, "vth"), rth: dataOf(input.rth, "rth") },
    },
    {
      id: "result.norton",
      kind: "equivalent",
      title: "Norton equivalent",
      explanation: norton
        ? "Seen from the port, the network is a current source Isc in parallel with Rth."
        : input.isc !== null && input.rth === null
          ? "Rth is infinite: the port is the current source Isc alone, with nothing in parallel."
          : input.rth !== null
            ? "Rth is zero: the port is an ideal voltage source, so it has no Norton form."
            : "Neither the open nor the shorted port has a unique solution, so there is no Norton form.",
      tex: norton
        ? `I_{sc} = ${texOf(input.isc)}, \\qquad R_{th} = ${texOf(input.rth)}`
        : input.isc !== null
          ? `I_{sc} = ${texOf(input.isc)}, \\qquad R_{th} = \\infty`
          : input.rth !== null
            ? "R_{th} = 0"
            : "\\text{no unique solution}",
      data: { exists: norton, isc: dataOf(input.isc, "isc"), rth: dataOf(input.rth, "rth") },
    },
  ];
}

function voltageOrZero(node: string, ground: string): string {
  return node === ground ? "0" : voltageTex(node);
}

function capitalize(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}

function listOrNone(names: string[]): string {
  return names.length === 0 ? "(none)" : names.map((n) => `"${n}"`).join(", ");
}

function rowData(row: RationalFunction[], unknowns: Unknown[], rhs: RationalFunction): Record<string, unknown> {
  const coefficients: Record<string, string> = {};
  row.forEach((f, j) => {
    if (!f.isZero()) coefficients[unknowns[j].infix] = f.toInfix();
  });
  return { coefficients, rhs: rhs.toInfix() };
}

function controlText(c: ReturnType<typeof sourceControls>[number]): string {
  return "nodes" in c ? `across(${c.nodes[0]}, ${c.nodes[1]})` : `through(${c.element})`;
}

/** A control as the ledger writes it: v(a, b) for a voltage, i(x) for a current. */
function controlWritten(c: ReturnType<typeof sourceControls>[number]): Written {
  if ("nodes" in c) return { infix: `v(${c.nodes[0]}, ${c.nodes[1]})`, tex: `v(${labelTex(c.nodes[0])}, ${labelTex(c.nodes[1])})` };
  return { infix: `i(${c.element})`, tex: currentTex(c.element).replace(/^I/, "i") };
}

function elementTex(e: Network["elements"][number], values: ReadonlyMap<string, RationalFunction>, terms: SourceTerms): string {
  const name = `\\mathrm{${e.name.replace(/_/g, "\\_")}}`;
  if (isOpamp(e)) {
    return `${name} &: \\text{${elementPhrase(e)}},\\ ${labelTex(e.inputs[0])}^{+}\\ ${labelTex(e.inputs[1])}^{-} \\to ${labelTex(e.output)}`;
  }
  const v = values.get(e.name);
  const parts = (terms.get(e.name) ?? []).map((t) => times(t.gain, controlWritten(t.control)).tex);
  const independent = v ? v.toTex() : e.value;
  const value = parts.length === 0 ? independent : sumOf([...(v && !v.isZero() ? [{ infix: "", tex: independent }] : []), ...parts.map((tex) => ({ infix: "", tex }))]).tex;
  const [a, b] = elementNodes(e);
  return `${name} &: \\text{${elementPhrase(e)}},\\ ${labelTex(a)} \\to ${labelTex(b)},\\ ${value}`;
}
