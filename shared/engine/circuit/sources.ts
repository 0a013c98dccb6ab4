// The network's independent sources: every voltage or current source whose value has a part that
// names no control. With exactly one, Vth divided by its value is the port's open-circuit transfer.

import type { RationalFunction } from "../algebra";
import type { Network } from "../types";
import { isOpamp, isSource } from "./elements";
import { parseElementValues } from "./values";

export interface IndependentSource {
  name: string;
  kind: "voltage" | "current";
  /** The independent part of its value (what is left once the controlled parts are split off). */
  value: RationalFunction;
}

/** The sources with a non-zero independent part, in netlist order; null when a value cannot be read. */
export function independentSources(network: Network): IndependentSource[] | null {
  const { values, diagnostics } = parseElementValues(network);
  if (diagnostics.some((d) => d.severity === "error")) return null;
  const found: IndependentSource[] = [];
  for (const e of network.elements) {
    if (!isSource(e) || isOpamp(e)) continue;
    const value = values.get(e.name);
    if (value && !value.isZero()) found.push({ name: e.name, kind: e.kind as IndependentSource["kind"], value });
  }
  return found;
}
