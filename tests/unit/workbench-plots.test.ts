// What the Sweep and Frequency panels hand to uPlot and what they refuse: log ticks at decades in
// engineering notation, 1-2-5 steps on linear axes (common practice on engineering plots), ranges a
// log axis cannot show, typed frequency ranges, and the editor's margin notes that never overlap.
import { describe, expect, it } from "vitest";
import { DEGREE_STEPS, ONE_TWO_FIVE, engineeringTick, logTicks } from "@/features/analysis/lib/axis-ticks";
import { notLogRange, sweepPoints } from "@/features/analysis/lib/sweep";
import { bodeFunctions, readFrequencyRange } from "@/features/analysis/lib/bode";
import { noteTops } from "@/features/network-editor/components/netlist-editor";
import { readExpression } from "@/lib/engine";

describe("axis ticks", () => {
  it("labels log decades with SI prefixes: 1, 10, 100, 1k, 10k, 100k, 1M", () => {
    expect(logTicks(1, 1e6, 10).map(engineeringTick)).toEqual(["1", "10", "100", "1k", "10k", "100k", "1M"]);
    expect(logTicks(1e-9, 1e-6, 10).map(engineeringTick)).toEqual(["1n", "10n", "100n", "1µ"]);
  });

  it("thins decades that would crowd, keeping whole decades", () => {
    // 25 decades in room for 6 labels: one per two SI prefixes; 7 decades in room for 4: every second.
    expect(logTicks(1e-12, 1e12, 6).map(engineeringTick)).toEqual(["1p", "1µ", "1", "1M", "1T"]);
    expect(logTicks(1, 1e6, 4).map(engineeringTick)).toEqual(["1", "100", "10k", "1M"]);
  });

  it("inside less than two decades, 1-2-5 multiples", () => {
    expect(logTicks(150, 900, 10)).toEqual([200, 500]);
    expect(logTicks(120, 480, 10)).toEqual([200, 300, 400]); // no two 1-2-5 points in view: every mantissa
    expect(logTicks(110, 180, 10)).toEqual([110, 180]); // not even one: the two ends
  });

  it("steps linear axes by 1, 2 and 5 times a power of ten, and phase by fractions of a turn", () => {
    expect(ONE_TWO_FIVE.filter((v) => v >= 0.1 && v <= 100)).toEqual([0.1, 0.2, 0.5, 1, 2, 5, 10, 20, 50, 100]);
    expect(ONE_TWO_FIVE).not.toContain(2.5);
    expect(DEGREE_STEPS).toContain(45);
    expect(engineeringTick(-200)).toBe("-200");
    expect(engineeringTick(4700)).toBe("4.7k");
    expect(engineeringTick(0)).toBe("0");
  });
});

describe("sweep ranges", () => {
  it("a range touching, crossing or below zero cannot be log", () => {
    expect(notLogRange(1, 1e6)).toBeNull();
    expect(notLogRange(0, 10)).toMatch(/touches zero/);
    expect(notLogRange(-5, 5)).toMatch(/crosses zero/);
    expect(notLogRange(-5, -1)).toMatch(/lies below zero/);
  });

  it("points: 40 a decade on a log axis, ends exact; evenly in value on a linear one", () => {
    const log = sweepPoints(1, 1e6, "log");
    expect(log).toHaveLength(241);
    expect([log[0], log[40], log[240]]).toEqual([1, 10 ** 1, 1e6]);
    const lin = sweepPoints(-1, 1, "linear");
    expect(lin[0]).toBe(-1);
    expect(lin[100]).toBeCloseTo(0, 15);
    expect(lin[200]).toBe(1);
  });
});

describe("frequency range and functions", () => {
  it("reads start and stop in Hz with SI prefixes and says what is wrong", () => {
    expect(readFrequencyRange("10", "1 MHz")).toEqual({ start: 10, stop: 1e6 });
    expect(readFrequencyRange("2.5k", "10kHz")).toEqual({ start: 2500, stop: 10000 });
    expect(readFrequencyRange("0", "1k")).toEqual({ error: "Start: the frequency axis is logarithmic, so the start must be above 0 Hz." });
    expect(readFrequencyRange("1k", "100")).toEqual({ error: "Stop: must be above the start (1 kHz)." });
    expect("error" in readFrequencyRange("ten", "1k") && readFrequencyRange("ten", "1k")).toMatchObject({ error: expect.stringMatching(/^Start: expected a number/) });
    expect(readFrequencyRange("1f", "1T")).toEqual({ error: "At most 24 decades at once." });
  });

  it("names the transfer by the source's value, and says so when there is no single source", () => {
    const zth = readExpression("R/(1 + s*R*C)");
    const vth = readExpression("Vin/(1 + s*R*C)");
    const source = { name: "Sig", kind: "voltage" as const, value: readExpression("Vin") };
    const one = bodeFunctions(zth, { kind: "transfer", source, transfer: vth.div(source.value) }, vth);
    expect(one.functions.map((f) => [f.name, f.unit, f.dbUnit])).toEqual([["Vth/Vin", "V/V", "dB"], ["Zth(s)", "Ω", "dBΩ"]]);
    const none = bodeFunctions(zth, { kind: "none" }, vth);
    expect(none.functions.map((f) => f.key)).toEqual(["zth"]);
    expect(none.sourceNote).toMatch(/^No independent source/);
    const several = bodeFunctions(zth, { kind: "several", sources: [source, { ...source, name: "Bias" }] }, vth);
    expect(several.functions.map((f) => [f.name, f.unit])).toEqual([["Vth(s)", "V"], ["Zth(s)", "Ω"]]);
    expect(several.sourceNote).toMatch(/^2 independent sources \(Sig, Bias\): no one transfer/);
  });
});

describe("margin notes of the netlist editor", () => {
  it("sit level with their line, pushed below a taller note above them, never overlapping", () => {
    // Lines are 20 px from 8 px down: line 3 starts at 48, line 4 at 68.
    expect(noteTops([3], [18])).toEqual([48]);
    expect(noteTops([3, 4], [50, 18])).toEqual([48, 100]);
    expect(noteTops([3, 9], [50, 18])).toEqual([48, 168]);
  });
});
