// The element model: what each kind is, which nodes it touches, what its value means.

import type { ControlledSourceElement, Element, ElementKind, Network, OpampElement, Quantity, TwoTerminalElement } from "../types";

export function isOpamp(e: Element): e is OpampElement {
  return e.kind === "opamp";
}

export function isControlled(e: Element): e is ControlledSourceElement {
  return e.kind === "vcvs" || e.kind === "vccs" || e.kind === "ccvs" || e.kind === "cccs";
}

export function isTwoTerminal(e: Element): e is TwoTerminalElement {
  return !isOpamp(e) && !isControlled(e);
}

export function isPassive(e: Element): boolean {
  return e.kind === "resistor" || e.kind === "conductance" || e.kind === "capacitor" || e.kind === "inductor";
}

export function isIndependentSource(e: Element): boolean {
  return e.kind === "vsource" || e.kind === "isource";
}

/** Sources that fix a voltage between their nodes and carry a branch current as an unknown. */
export function isVoltageType(kind: ElementKind): boolean {
  return kind === "vsource" || kind === "vcvs" || kind === "ccvs";
}

/** Sources that drive a current between their nodes. */
export function isCurrentType(kind: ElementKind): boolean {
  return kind === "isource" || kind === "vccs" || kind === "cccs";
}

export function isVoltageControlled(kind: ElementKind): boolean {
  return kind === "vcvs" || kind === "vccs";
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

/** The quantity an element's value carries; for dependent sources, the gain's. */
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
    case "vsource":
      return "voltage";
    case "isource":
      return "current";
    case "vcvs":
    case "cccs":
      return "dimensionless";
    case "vccs":
      return "transconductance";
    case "ccvs":
      return "transresistance";
    case "opamp":
      return null;
  }
}

/** Words used in explanations. */
export function kindPhrase(kind: ElementKind): string {
  switch (kind) {
    case "resistor":
      return "resistor";
    case "conductance":
      return "conductance";
    case "capacitor":
      return "capacitor";
    case "inductor":
      return "inductor";
    case "vsource":
      return "voltage source";
    case "isource":
      return "current source";
    case "vcvs":
      return "voltage-controlled voltage source";
    case "vccs":
      return "voltage-controlled current source";
    case "ccvs":
      return "current-controlled voltage source";
    case "cccs":
      return "current-controlled current source";
    case "opamp":
      return "ideal op-amp";
  }
}

/** Names of elements whose reference current is a controlling variable of some dependent source. */
export function currentControlledElements(network: Network): Set<string> {
  const out = new Set<string>();
  for (const e of network.elements) {
    if (isControlled(e) && "element" in e.control) out.add(e.control.element);
  }
  return out;
}
