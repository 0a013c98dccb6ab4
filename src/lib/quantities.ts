import type { ResultName } from "@/lib/api-contract";

// SI units for the engine's quantities; gains are dimensionless and carry no unit.
const UNITS: Record<string, string> = {
  resistance: "Ω",
  conductance: "S",
  voltage: "V",
  current: "A",
  dimensionless: "",
  transconductance: "S",
  transresistance: "Ω",
  capacitance: "F",
  inductance: "H",
  frequency: "Hz",
  time: "s",
};

function unitOf(quantity: string | null | undefined): string {
  return quantity ? (UNITS[quantity] ?? "") : "";
}

/** The unit a symbol's numbers are typed in; "s" is the engine's Laplace variable (complex frequency, s⁻¹). */
export function symbolUnit(symbol: string, quantity: string | null | undefined): string {
  return symbol === "s" ? "s⁻¹" : unitOf(quantity);
}

export function symbolLabel(symbol: string, quantity: string | null | undefined): string {
  return symbol === "s" ? "Laplace variable" : quantityLabel(quantity);
}

function quantityLabel(quantity: string | null | undefined): string {
  if (!quantity) return "quantity not known";
  return quantity === "dimensionless" ? "gain, no unit" : quantity;
}

export const RESULT_NAMES: ResultName[] = ["vth", "rth", "isc"];

export const RESULT_UNIT: Record<ResultName, string> = { vth: "V", rth: "Ω", isc: "A" };

export const RESULT_LABEL: Record<ResultName, string> = { vth: "Vth", rth: "Rth", isc: "Isc" };

export const RESULT_TEX: Record<ResultName, string> = { vth: "V_{\\mathrm{th}}", rth: "R_{\\mathrm{th}}", isc: "I_{\\mathrm{sc}}" };

const RESULT_MEANING: Record<ResultName, string> = {
  vth: "open-circuit voltage",
  rth: "Thevenin resistance",
  isc: "short-circuit current",
};

// With L or C in the network the results are functions of s: the port then has an impedance Zth(s), not a resistance.
const IMPEDANCE = { label: "Zth(s)", tex: "Z_{\\mathrm{th}}(s)", meaning: "Thevenin impedance" };

/** A result's name, plain text, as the network implies: Zth(s) when the results depend on s. */
export function resultLabel(name: ResultName, inS: boolean): string {
  return name === "rth" && inS ? IMPEDANCE.label : inS ? `${RESULT_LABEL[name]}(s)` : RESULT_LABEL[name];
}

export function resultTex(name: ResultName, inS: boolean): string {
  return name === "rth" && inS ? IMPEDANCE.tex : inS ? `${RESULT_TEX[name]}(s)` : RESULT_TEX[name];
}

export function resultMeaning(name: ResultName, inS: boolean): string {
  return name === "rth" && inS ? IMPEDANCE.meaning : RESULT_MEANING[name];
}

/** Whether stored results depend on the Laplace variable s (read from their printed form). */
export function resultsInS(results: { vth: { infix: string } | null; rth: { infix: string } | null; isc: { infix: string } | null }): boolean {
  return [results.vth, results.rth, results.isc].some((r) => r !== null && /(^|[^A-Za-z0-9_])s([^A-Za-z0-9_(]|$)/.test(r.infix));
}
