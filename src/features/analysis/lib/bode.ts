import { formatSI, type RationalFunction } from "@/lib/engine";
import { readTypedNumber } from "./typed-number";
import { MAX_DECADES } from "./sweep";
import type { OpenCircuitTransfer } from "@/lib/engine-frequency";

/** One function of s the Frequency panel can draw: its name, its unit and what it is. */
export interface BodeFunction {
  key: "transfer" | "vth" | "zth";
  /** Plain-text name for labels: "Vth/Sig", "Vth(s)", "Zth(s)". */
  name: string;
  f: RationalFunction;
  /** Linear magnitude unit ("V/V", "Ω", "V") and its dB form ("dB", "dBΩ", "dBV"). */
  unit: string;
  dbUnit: string;
  meaning: string;
}

// What the panel offers: the open-circuit transfer when the network has one independent source
// (Vth itself otherwise, said as such), and Zth(s) always.
export function bodeFunctions(zth: RationalFunction | undefined, transfer: OpenCircuitTransfer, vth: RationalFunction | undefined): { functions: BodeFunction[]; sourceNote: string } {
  const functions: BodeFunction[] = [];
  let sourceNote: string;
  if (transfer.kind === "transfer") {
    const { source } = transfer;
    const fromVoltage = source.kind === "voltage";
    // Named by the source's value where that is one symbol (Vth/Vin), by the source otherwise.
    const value = source.value.toInfix();
    const by = /^[A-Za-z_][A-Za-z0-9_]*$/.test(value) ? value : source.name;
    functions.push({
      key: "transfer",
      name: `Vth/${by}`,
      f: transfer.transfer,
      unit: fromVoltage ? "V/V" : "Ω",
      dbUnit: fromVoltage ? "dB" : "dBΩ",
      meaning: `open-circuit transfer from ${source.name}`,
    });
    sourceNote = `Vth/${by}: the open-circuit voltage divided by the value of ${source.name} (${value}), the network's one independent source, a ${source.kind} source; ${fromVoltage ? "a voltage gain, V/V" : "a transimpedance, V/A = Ω"}.`;
  } else if (transfer.kind === "several") {
    if (vth) functions.push({ key: "vth", name: "Vth(s)", f: vth, unit: "V", dbUnit: "dBV", meaning: "open-circuit voltage" });
    sourceNote = `${transfer.sources.length} independent sources (${transfer.sources.map((s) => s.name).join(", ")}): no one transfer. Vth(s) is the open-circuit voltage with every source at its value, in volts.`;
  } else if (transfer.kind === "none") {
    sourceNote = "No independent source: Vth is 0, so only Zth(s) is drawn.";
  } else {
    if (vth) functions.push({ key: "vth", name: "Vth(s)", f: vth, unit: "V", dbUnit: "dBV", meaning: "open-circuit voltage" });
    sourceNote = "The network's sources could not be listed here: Vth(s) is the open-circuit voltage in volts, not a transfer.";
  }
  if (zth) functions.push({ key: "zth", name: "Zth(s)", f: zth, unit: "Ω", dbUnit: "dBΩ", meaning: "Thevenin impedance" });
  return { functions, sourceNote };
}

/** The short name of a function's magnitude, for axes and readouts: |Vth/Sig|, |Zth|. */
export function magnitudeName(fn: BodeFunction): string {
  return `|${fn.name.replace("(s)", "")}|`;
}

/** A frequency range typed in Hz with SI prefixes: both above zero, stop above start, at most MAX_DECADES decades. */
export function readFrequencyRange(startText: string, stopText: string): { start: number; stop: number } | { error: string } {
  const start = readTypedNumber(startText, "Hz");
  if ("error" in start) return { error: `Start: ${start.error} (a frequency in Hz, e.g. 10, 1k, 2.5M).` };
  const stop = readTypedNumber(stopText, "Hz");
  if ("error" in stop) return { error: `Stop: ${stop.error} (a frequency in Hz, e.g. 10, 1k, 2.5M).` };
  const [a, b] = [start.value.toNumber(), stop.value.toNumber()];
  if (!(a > 0)) return { error: "Start: the frequency axis is logarithmic, so the start must be above 0 Hz." };
  if (!(b > a)) return { error: `Stop: must be above the start (${formatSI(a, "Hz")}).` };
  if (Math.log10(b / a) > MAX_DECADES) return { error: `At most ${MAX_DECADES} decades at once.` };
  return { start: a, stop: b };
}

export const toDb = (magnitude: number) => 20 * Math.log10(magnitude);

/** The drawn points as CSV: frequency, magnitude (linear and dB), phase. */
export function bodeCsv(fn: BodeFunction, f: number[], magnitude: number[], phase: number[]): string {
  const header = `frequency (Hz),${magnitudeName(fn)} (${fn.unit}),${magnitudeName(fn)} (${fn.dbUnit}),phase (°)`;
  const cell = (v: number) => (Number.isFinite(v) ? String(v) : "");
  return [header, ...f.map((fi, i) => [fi, magnitude[i], toDb(magnitude[i]), phase[i]].map(cell).join(","))].join("\n") + "\n";
}
