// The element model: what each kind is, which nodes it touches, what its value means.

import { controlsIn } from "../algebra/expression";
import type { Control, Element, ElementKind, Network, OpampElement, Quantity } from "../types";

export function isOpamp(e: Element): e is OpampElement {
  return e.kind === "opamp";
}

export function isSource(e: Element): boolean {
  return e.kind === "voltage" || e.kind === "current";
}

/** Sources that fix a voltage between their nodes and carry a branch current as an unknown. */
export function isVoltageType(kind: ElementKind): boolean {
  return kind === "voltage";
}

/** Sources that drive a current between their nodes. */
export function isCurrentType(kind: ElementKind): boolean {
  return kind === "current";
}

const controlCache = new Map<string, Control[]>();

/**
 * The controls a source value names (across(a, b) -> nodes, through(x) -> element), in text order,
 * read structurally without the algebra; a value that does not scan names none (its syntax error
 * is reported where values are parsed).
 */
function controlsOfValue(value: string): Control[] {
  const cached = controlCache.get(value);
  if (cached) return cached;
  let controls: Control[] = [];
  try {
    controls = controlsIn(value).map((c): Control => (c.word === "across" ? { nodes: [c.args[0], c.args[1]] } : { element: c.args[0] }));
  } catch {
    controls = [];
  }
  if (controlCache.size > 5000) controlCache.clear();
  controlCache.set(value, controls);
  return controls;
}

/** The controls of an element: those its value names when it is a source, none otherwise. */
export function sourceControls(e: Element): Control[] {
  return isSource(e) && !isOpamp(e) ? controlsOfValue(e.value) : [];
}

/** A source whose value names at least one control: a dependent (controlled) source. */
export function isControlled(e: Element): boolean {
  return sourceControls(e).length > 0;
}

/** Every node an element touches, in its own order. */
export function elementNodes(e: Element): string[] {
  return isOpamp(e) ? [e.inputs[0], e.inputs[1], e.output] : [e.nodes[0], e.nodes[1]];
}

/** Non-ground nodes in order of first appearance; this order is the unknowns' order. */
export function networkNodes(network: Network): string[] {
  const seen = new Set<string>();
  const order: string[] = [];
  for (const e of network.elements) {
    for (const n of elementNodes(e)) {
      if (n !== network.ground && !seen.has(n)) {
        seen.add(n);
        order.push(n);
      }
    }
  }
  return order;
}

/** The quantity an element's value carries; for a source, that of its independent part. */
export function valueQuantity(kind: ElementKind): Quantity | null {
  switch (kind) {
    case "resistor":
      return "resistance";
    case "conductance":
      return "conductance";
    case "capacitor":
      return "capacitance";
    case "inductor":
      return "inductance";
    case "voltage":
      return "voltage";
    case "current":
      return "current";
    case "opamp":
      return null;
  }
}

/** The quantity of the gain that multiplies a control in a source value (V/V, V/A, A/V, A/A). */
export function gainQuantity(kind: ElementKind, control: Control): Quantity {
  const byVoltage = "nodes" in control;
  if (kind === "voltage") return byVoltage ? "dimensionless" : "transresistance";
  return byVoltage ? "transconductance" : "dimensionless";
}

/** Words for a kind, used in explanations. */
function kindPhrase(kind: ElementKind): string {
  switch (kind) {
    case "voltage":
      return "voltage source";
    case "current":
      return "current source";
    case "opamp":
      return "ideal op-amp";
    default:
      return kind;
  }
}

/** The trade's name for an element: "voltage-controlled current source" for a source that names across(...). */
export function elementPhrase(e: Element): string {
  const controls = sourceControls(e);
  if (controls.length === 0) return kindPhrase(e.kind);
  const byVoltage = controls.some((c) => "nodes" in c);
  const byCurrent = controls.some((c) => "element" in c);
  const by = byVoltage && byCurrent ? "voltage- and current-controlled" : byVoltage ? "voltage-controlled" : "current-controlled";
  return `${by} ${kindPhrase(e.kind)}`;
}

/** Names of elements whose reference current is a controlling variable of some dependent source. */
export function currentControlledElements(network: Network): Set<string> {
  const out = new Set<string>();
  for (const e of network.elements) for (const c of sourceControls(e)) if ("element" in c) out.add(c.element);
  return out;
}
