// Public types of the engine: the interchange format, the solve options and the solve result.
// Plain data only (strings, numbers, arrays), so a result can be stored and sent as JSON.

import type { ApproximationReport } from "./circuit/approximations";
import type { BoundedApproximationReport, ErrorBoundOptions } from "./circuit/error-bound";
import type { FrequencyReport } from "./circuit/frequency";
export type { ApproximationEntry, ApproximationReport } from "./circuit/approximations";
export type { BoundedApproximation, BoundedApproximationReport, ErrorBoundOptions } from "./circuit/error-bound";
export type { FrequencyEquivalent, FrequencyLimitValue, FrequencyReport, PolesZeros, SRoot } from "./circuit/frequency";

/** Every element kind Portfold knows, spelled as the word used in both the JSON and the text netlist. */
export const ELEMENT_KINDS = ["resistor", "conductance", "capacitor", "inductor", "voltage", "current", "opamp"] as const;
export type ElementKind = (typeof ELEMENT_KINDS)[number];

export type PassiveKind = "resistor" | "conductance" | "capacitor" | "inductor";
/** A source: "voltage" holds V(first) − V(second) at its value, "current" drives its value from first to second. */
export type SourceKind = "voltage" | "current";

/** Control by the voltage V(c1) − V(c2): across(c1, c2) in a source value. */
export interface NodePairControl {
  nodes: [string, string];
}
/** Control by the reference current of a named element: through(element) in a source value. */
export interface ElementControl {
  element: string;
}
export type Control = NodePairControl | ElementControl;

/**
 * Passive or source: nodes [first, second]; reference current flows first -> second. A source whose
 * value names across(...) or through(...) (linearly) is a controlled source.
 */
export interface TwoTerminalElement {
  name: string;
  kind: PassiveKind | SourceKind;
  nodes: [string, string];
  value: string;
}

/** Ideal op-amp (nullor): V(inputs[0]) = V(inputs[1]), output current free, output referenced to ground. */
export interface OpampElement {
  name: string;
  kind: "opamp";
  inputs: [string, string];
  output: string;
}

export type Element = TwoTerminalElement | OpampElement;

export interface Port {
  plus: string;
  minus: string;
}

/** The interchange format exactly as read; `ground` defaults to "0". */
export interface NetworkInput {
  ground?: string;
  port: Port;
  elements: Element[];
  /** Optional declared quantity per symbol (an extension; inferred from elements otherwise). */
  quantities?: Record<string, Quantity>;
  /** Optional drawing of the network (an extension); the engine carries it unchanged and never reads it. */
  layout?: Record<string, unknown>;
  /** Cell instances (an extension), expanded into elements before solving. */
  cells?: CellInstance[];
  /** Cells defined with the network (an extension), beside the built-in ones. */
  cellDefinitions?: CellDefinition[];
  /** Design assumptions such as "gm*ro >> 1" (an extension): each result is also given with its dominant terms. */
  assumptions?: string[];
}

/** A network after validation: ground filled in. */
export interface Network {
  ground: string;
  port: Port;
  elements: Element[];
  quantities?: Record<string, Quantity>;
  layout?: Record<string, unknown>;
  cells?: CellInstance[];
  cellDefinitions?: CellDefinition[];
  assumptions?: string[];
}

/** One placed cell: a part with named terminals, standing for the cell's elements. */
export interface CellInstance {
  name: string;
  /** Cell id: "bjt-hybrid-pi", "mosfet", "amplifier", or one in cellDefinitions. */
  cell: string;
  /** Cell terminal -> network node. */
  terminals: Record<string, string>;
  /** Per-instance names (or expressions) of the cell's symbols, e.g. { "gm": "gm1" }. */
  symbols?: Record<string, string>;
  /** Optional parts of the cell to place with it, e.g. ["Cgs", "Cgd"] (netlist: "with Cgs Cgd"). */
  with?: string[];
}

/** A reusable block: elements whose nodes are its terminals, "0" (ground) or its own internal nodes. */
export interface CellDefinition {
  id: string;
  title: string;
  terminals: string[];
  /** The symbols its values use, which an instance may rename. */
  symbols: string[];
  elements: Element[];
  /** Elements left out unless an instance names them in its "with" list. */
  optional?: string[];
}

export const QUANTITIES = [
  "resistance",
  "conductance",
  "voltage",
  "current",
  "dimensionless",
  "transconductance",
  "transresistance",
  "capacitance",
  "inductance",
  "frequency",
  "time",
] as const;
export type Quantity = (typeof QUANTITIES)[number];

// ---------------------------------------------------------------------------------------------
// Diagnostics

export type Severity = "error" | "warning";

export interface Diagnostic {
  /** Stable code, see DIAGNOSTIC_CODES in circuit/diagnostics.ts. */
  code: string;
  severity: Severity;
  message: string;
  /** Elements involved, by name, in network order. */
  elements: string[];
  /** Nodes involved. */
  nodes: string[];
  /** Text netlist position, 1-based, when the input was text. */
  line?: number;
  column?: number;
  /** JSON position (e.g. ["elements", 2, "value"]) when the input was JSON. */
  path?: (string | number)[];
}

// ---------------------------------------------------------------------------------------------
// Options

export type LimitPoint = "inf" | "zero";

export interface SolveOptions {
  /** Limits to take of every result, e.g. [{ symbol: "mu", to: "inf" }]. */
  limits?: { symbol: string; to: LimitPoint }[];
  /** Symbol values for evaluation, exact decimal text with optional SI prefix ("4.7k") or numbers. */
  values?: Record<string, string | number>;
  /** Also evaluate in floating point (needs every symbol of a result given). */
  float?: boolean;
  /** Normalized sensitivities: true = every symbol, list = those symbols, false = none. Default true. */
  sensitivities?: boolean | string[];
  /**
   * Skip the sensitivities of a result when (numerator terms) × (denominator terms) exceeds this:
   * each sensitivity costs about the product N·D. Default 200000.
   */
  sensitivitySizeLimit?: number;
  /** Solve result = target for a symbol, e.g. [{ result: "rth", symbol: "RL", target: "50" }]. */
  solveFor?: { result: ResultName; symbol: string; target: string }[];
  /** Above this many terms (numerator + denominator) a result gets only its expanded infix form. Default 5000. */
  printTermLimit?: number;
  /** Record the derivation steps. Default true. */
  steps?: boolean;
  /** Run the dimension check. Default true. */
  dimensions?: boolean;
  /** Declared quantities, overriding inference. */
  quantities?: Record<string, Quantity>;
  /** Design assumptions such as "gm*ro >> 1": each result is also given with its dominant terms only (an extension). */
  assume?: string[];
  /**
   * Approximate Vth, Rth/Zth and Isc within a relative error (an extension): terms of N and D are
   * dropped at the design point given by `values`, over an optional band and ± tolerance box.
   */
  approximate?: ErrorBoundOptions;
}

// ---------------------------------------------------------------------------------------------
// Results

export type ResultName = "vth" | "isc" | "rth" | "rthFromVocIsc";

/** One exact result in every printed form. */
export interface ExactExpression {
  /** Canonical expanded N/D in lowest terms, plain infix. */
  infix: string;
  /** TeX and compact forms are null for results above SolveOptions.printTermLimit terms. */
  tex: string | null;
  /** Common factors pulled out, N and D factored where cheap. */
  compact: string | null;
  compactTex: string | null;
  terms: { numerator: number; denominator: number };
  symbols: string[];
}

/** A statement about the port that is not an error (degenerate ports, agreement). */
export interface PortStatement {
  code:
    | "rth-zero"
    | "rth-infinite"
    | "vth-zero"
    | "isc-zero"
    | "voc-isc-undefined"
    | "rth-agree"
    | "rth-disagree"
    | "sensitivity-skipped"
    | "forms-skipped"
    | "approximation-needs-band";
  message: string;
}

export interface LimitEntry {
  kind: "finite" | "infinite" | "none";
  /** Finite limit value (infix), or null. */
  value: string | null;
  valueTex: string | null;
  /** +1 / -1 for ±∞, 0 when the sign depends on other symbols. */
  sign?: 1 | -1 | 0;
  /** Leading-order form (infix), e.g. "R0/mu" for Rth as mu -> inf. */
  leading: string | null;
  leadingTex: string | null;
}

export interface LimitResult {
  symbol: string;
  to: LimitPoint;
  /** key like "mu=inf" */
  key: string;
  results: Partial<Record<ResultName, LimitEntry>>;
}

export interface ValueEntry {
  /** Exact value after substitution (infix; a number when every symbol was given); null when the substitution makes a denominator vanish. */
  exact: string | null;
  /** Float when requested and every symbol was given. */
  float: number | null;
  /** Engineering notation with unit, e.g. "4.7 kΩ", when fully numeric. */
  display: string | null;
}

export interface ValuesResult {
  given: Record<string, string>;
  results: Partial<Record<ResultName, ValueEntry>>;
}

export interface SolveForResult {
  result: ResultName;
  symbol: string;
  target: string;
  /** The symbol's value (infix) or null with the reason. */
  value: string | null;
  reason?: string;
}

export interface DimensionCheck {
  expected: Quantity;
  /** "ok": comes out in the expected unit; "mismatch": a different unit; "inhomogeneous": terms of different units; "unknown": a symbol has no quantity. */
  status: "ok" | "mismatch" | "inhomogeneous" | "unknown";
  /** The unit found, e.g. "V/A", when homogeneous. */
  found: string | null;
  message: string;
}

export interface DimensionReport {
  /** Quantity per symbol, null when none could be inferred. */
  quantities: Record<string, Quantity | null>;
  /** Where each quantity came from: element name, "declared", or "Laplace variable". */
  sources: Record<string, string>;
  conflicts: { symbol: string; quantities: Quantity[]; elements: string[] }[];
  checks: Partial<Record<ResultName, DimensionCheck>>;
}

export type StepKind =
  | "port"
  | "network"
  | "setup"
  | "unknowns"
  | "kcl"
  | "control"
  | "constraint"
  | "matrix"
  | "solution"
  | "zeroing"
  | "test-source"
  | "short"
  | "cross-check"
  | "equivalent"
  | "approximation";

/** One entry of the ledger. */
export interface Step {
  id: string;
  kind: StepKind;
  title: string;
  explanation: string;
  tex: string;
  data: Record<string, unknown>;
}

/** The numeric mark of the check badge in brief: the first point compared and the largest relative difference. */
export interface NumericCheck {
  agree: boolean | null;
  /** Largest relative difference over the results that exist. */
  relativeError: number | null;
  point: Record<string, number>;
}

/** What one mark of the check badge did and found, for the badge's details. */
export interface CheckDetail {
  /** The mark: true agrees, false disagrees, null when the check could not run. */
  agree: boolean | null;
  /** What the check did, in one sentence. */
  method: string;
  /** What it found. */
  outcome: string;
  /** Points compared (0 for a symbolic check). */
  points: number;
  /** Largest relative difference of a floating-point check, or null. */
  relativeError: number | null;
}

/** The check badge: each mark a test the results can fail (see "How results are checked" in the README). */
export interface SolveChecks {
  /** A test current driven into the port in a separate formulation (float, random points) gives Rth. */
  testSource: boolean | null;
  /** Voc/Isc equals the test-source Rth exactly. */
  vocIsc: boolean | null;
  /** Vth, Rth and Isc equal a floating-point solve of the separate formulation at random points. */
  numeric: boolean | null;
  /** Vth, Rth and Isc equal an exact rational solve of the separate formulation at random rational points (an extension). */
  exactPoint: boolean | null;
  /** What each mark did (an extension). */
  details: { testSource: CheckDetail; vocIsc: CheckDetail; numeric: CheckDetail; exactPoint: CheckDetail };
}

export interface TheveninEquivalent {
  vth: string;
  rth: string;
}
export interface NortonEquivalent {
  isc: string;
  rth: string;
}

export interface SolveResult {
  /** True when no error diagnostic was raised (degenerate ports included). */
  ok: boolean;
  network: Network | null;
  vth: ExactExpression | null;
  isc: ExactExpression | null;
  /** By the test source with independent sources zeroed. */
  rth: ExactExpression | null;
  /** Voc / Isc. */
  rthFromVocIsc: ExactExpression | null;
  /** Whether the two Rth agree; null when only one exists. */
  agree: boolean | null;
  numericCheck: NumericCheck | null;
  /** The check badge: the test source, Voc/Isc, the numeric and the exact-point checks, with what each did. */
  checks: SolveChecks;
  thevenin: TheveninEquivalent | null;
  norton: NortonEquivalent | null;
  statements: PortStatement[];
  limits: LimitResult[];
  values: ValuesResult | null;
  sensitivities: Partial<Record<ResultName, Record<string, string>>>;
  solved: SolveForResult[];
  dimensions: DimensionReport | null;
  steps: Step[];
  diagnostics: Diagnostic[];
  /** Extension: present only when a result depends on the Laplace variable s. */
  frequency?: FrequencyReport;
  /** Extension: present only when SolveOptions.assume was given. */
  approximations?: ApproximationReport;
  /** Extension: present only when SolveOptions.approximate was given. */
  boundedApproximations?: BoundedApproximationReport;
}

/** What parseNetwork returns: the network when it could be read, and what went wrong. */
export interface ParseResult {
  network: Network | null;
  diagnostics: Diagnostic[];
  /** "json" or "text", as detected. */
  format: "json" | "text";
  /** Text netlist positions per element (1-based), to place later diagnostics. */
  positions?: Record<string, { line: number; valueColumn: number | null }>;
}
