// Frequency-dependent equivalents: Zth(s), Vth(s) of RC and RL networks against sympy, the exact DC
// (s -> 0) and high-frequency (s -> inf) equivalents, numeric poles against hand-derived formulas,
// and the Bode-plot evaluation F(j·2πf).

import { describe, expect, it } from "vitest";
import { Rational, parseValue } from "../../shared/engine/algebra";
import { frequencyResponse, independentSourcesOf, numericCoefficientsInS, openCircuitTransfer, polynomialRoots, solveNetwork, toSolveOutput, type SolveResult } from "../../shared/engine";
import { askSympy } from "./algebra-sympy";

function solve(text: string, values?: Record<string, string>): SolveResult {
  const r = solveNetwork(text, { steps: false, sensitivities: false, values });
  expect(r.diagnostics.filter((d) => d.severity === "error")).toEqual([]);
  return r;
}

// A sensor front end: the sensor (Vs behind Rsrc), an anti-alias capacitor, then a series resistor.
const RC = `
port out 0
Sensor voltage a 0 = Vs
Rsrc resistor a n = R1
Cfilt capacitor n 0 = C
Rser resistor n out = R2
`;

// An audio line driver's output: source resistance, a series choke, a shunt resistor at the port.
const RL = `
port out 0
Drive voltage a 0 = Vs
Rdrv resistor a m = Rs
Choke inductor m out = L
Rshunt resistor out 0 = R
`;

// Two RC sections in a row: the classic two-pole ladder.
const LADDER = `
port out 0
Sensor voltage in 0 = Vs
Ra resistor in n1 = R1
Ca capacitor n1 0 = C1
Rb resistor n1 out = R2
Cb capacitor out 0 = C2
`;

describe("Zth(s) against sympy", () => {
  it("RC and RL networks: Zth, Vth and Isc equal sympy's impedance combinations", () => {
    const rc = solve(RC);
    const rl = solve(RL);
    const answers = askSympy([
      // Series R2 after R1 in parallel with 1/(sC); Vth is the divider of R1 and 1/(sC).
      { kind: "equal", a: rc.rth!.infix, b: "R2 + 1/(1/R1 + s*C)" },
      { kind: "equal", a: rc.vth!.infix, b: "Vs*(1/(s*C))/(R1 + 1/(s*C))" },
      { kind: "equal", a: rc.isc!.infix, b: "(Vs*(1/(s*C))/(R1 + 1/(s*C)))/(R2 + 1/(1/R1 + s*C))" },
      // R in parallel with Rs + sL; Vth is the divider of Rs + sL and R.
      { kind: "equal", a: rl.rth!.infix, b: "1/(1/R + 1/(Rs + s*L))" },
      { kind: "equal", a: rl.vth!.infix, b: "Vs*R/(R + Rs + s*L)" },
    ]);
    expect(answers).toEqual([true, true, true, true, true]);
  });

  it("DC and high-frequency equivalents are sympy's limits s -> 0 and s -> oo", () => {
    const rc = solve(RC);
    const rl = solve(RL);
    const f = rc.frequency!;
    const g = rl.frequency!;
    expect(f.dc.rth.kind).toBe("finite");
    const answers = askSympy([
      { kind: "limit", expr: rc.rth!.infix, symbol: "s", to: "zero", ours: f.dc.rth.value! },
      { kind: "limit", expr: rc.rth!.infix, symbol: "s", to: "inf", ours: f.hf.rth.value! },
      { kind: "limit", expr: rc.vth!.infix, symbol: "s", to: "zero", ours: f.dc.vth.value! },
      { kind: "limit", expr: rc.vth!.infix, symbol: "s", to: "inf", ours: f.hf.vth.value! },
      { kind: "limit", expr: rl.rth!.infix, symbol: "s", to: "zero", ours: g.dc.rth.value! },
      { kind: "limit", expr: rl.rth!.infix, symbol: "s", to: "inf", ours: g.hf.rth.value! },
      { kind: "limit", expr: rl.isc!.infix, symbol: "s", to: "inf", ours: g.hf.isc.value! },
    ]);
    expect(answers).toEqual([true, true, true, true, true, true, true]);
    // Common practice: at DC the capacitor is open (Rth = R1 + R2), at high frequency a short (Rth = R2).
    expect(f.dc.rth.value).toBe("R1 + R2");
    expect(f.hf.rth.value).toBe("R2");
    // Common practice: at high frequency the choke is open, so Rth = R and Isc = 0.
    expect(g.hf.rth.value).toBe("R");
    expect(g.hf.isc.value).toBe("0");
  });

  it("a coupling capacitor blocks DC; alone in series it makes the DC Rth unbounded", () => {
    const r = solve("port out 0\nSig voltage a 0 = Vs\nCc capacitor a out = C\nRb resistor out 0 = R\n");
    // Common practice: a coupling capacitor blocks DC, so the port sees R alone at DC and Vth = 0.
    expect(r.frequency!.dc.rth).toMatchObject({ kind: "finite", value: "R" });
    expect(r.frequency!.dc.vth).toMatchObject({ kind: "finite", value: "0" });
    const open = solve("port out 0\nSig voltage a 0 = Vs\nCc capacitor a out = C\n");
    expect(open.frequency!.dc.rth.kind).toBe("infinite");
    expect(open.frequency!.hf.rth).toMatchObject({ kind: "finite", value: "0" });
  });

  it("the frequency extension is in the CLI output only when s appears", () => {
    expect(toSolveOutput(solve(RC)).frequency?.dc.rth.value).toBe("R1 + R2");
    expect("frequency" in toSolveOutput(solve("port a 0\nRes1 resistor a 0 = R\n"))).toBe(false);
  });
});

describe("poles and zeros", () => {
  it("RC–RC ladder: poles of Vth are the roots of s²R1R2C1C2 + s(R1C1 + R2C2 + R1C2) + 1", () => {
    // Hand derivation (nodal analysis): at out, (Vo − V1)/R2 + sC2·Vo = 0, so V1 = Vo(1 + sR2C2);
    // at n1, (V1 − Vs)/R1 + sC1·V1 + (V1 − Vo)/R2 = 0. Substituting and multiplying by R1:
    // Vo[(1 + sR2C2)(1 + sR1C1 + R1/R2) − R1/R2] = Vs, i.e.
    // Vth = Vs / (s²R1R2C1C2 + s(R1C1 + R2C2 + R1C2) + 1).
    const values = { R1: "1k", R2: "10k", C1: "100n", C2: "10n", Vs: "1" };
    const r = solve(LADDER, values);
    const [R1, R2, C1, C2] = [1e3, 1e4, 100e-9, 10e-9];
    const a = R1 * R2 * C1 * C2;
    const b = R1 * C1 + R2 * C2 + R1 * C2;
    const disc = Math.sqrt(b * b - 4 * a);
    const expected = [(-b + disc) / (2 * a), (-b - disc) / (2 * a)];
    const poles = r.frequency!.roots.results.vth!.poles;
    expect(poles.map((p) => p.im)).toEqual([0, 0]);
    expect(poles.length).toBe(2);
    for (let i = 0; i < 2; i++) expect(Math.abs(poles[i].re - expected[i]) / Math.abs(expected[i])).toBeLessThan(1e-10);
    expect(r.frequency!.roots.results.vth!.zeros).toEqual([]);
    // The exact denominator is the hand-derived polynomial (Vs = 1 given; compare symbolically too).
    const symbolic = solve(LADDER);
    expect(askSympy([{ kind: "equal", a: symbolic.vth!.infix, b: "Vs/(s^2*R1*R2*C1*C2 + s*(R1*C1 + R2*C2 + R1*C2) + 1)" }])).toEqual([true]);
  });

  it("series RLC: a complex pair at −R/(2L) ± j·sqrt(1/(LC) − (R/(2L))²)", () => {
    // Common practice (second-order low-pass): Vth = Vs/(s²LC + sRC + 1).
    const r = solve("port out 0\nSig voltage a 0 = Vs\nRs resistor a m = R\nLs inductor m out = L\nCo capacitor out 0 = C\n", { R: "10", L: "1m", C: "1u", Vs: "1" });
    const [R, L, C] = [10, 1e-3, 1e-6];
    const sigma = -R / (2 * L);
    const omega = Math.sqrt(1 / (L * C) - sigma * sigma);
    const poles = r.frequency!.roots.results.vth!.poles;
    expect(poles).toHaveLength(2);
    for (const p of poles) {
      expect(Math.abs(p.re - sigma) / Math.abs(sigma)).toBeLessThan(1e-9);
      expect(Math.abs(Math.abs(p.im) - omega) / omega).toBeLessThan(1e-9);
      // Natural frequency 1/(2π·sqrt(LC)).
      expect(Math.abs(p.hz - 1 / (2 * Math.PI * Math.sqrt(L * C))) / p.hz).toBeLessThan(1e-9);
    }
    expect(poles[0].im).toBeCloseTo(-poles[1].im, 3);
  });

  it("without values the symbols still missing are named instead of roots", () => {
    const r = solve(LADDER, { R1: "1k" });
    expect(r.frequency!.roots.results).toEqual({});
    expect(r.frequency!.roots.missing).toEqual(["C1", "C2", "R2", "Vs"]);
  });

  it("polynomialRoots: (s+1)(s+2)(s+3) and s(s²+1) at widely scaled coefficients", () => {
    const roots = polynomialRoots([6, 11, 6, 1]).map((r) => r.re);
    expect(roots.map((x) => Math.round(x * 1e9) / 1e9)).toEqual([-1, -2, -3]);
    // Scaled by 1e6 rad/s: (s + 1e6)(s + 2e6) = s² + 3e6 s + 2e12.
    const big = polynomialRoots([2e12, 3e6, 1]).map((r) => r.re);
    expect(big[0] / -1e6).toBeCloseTo(1, 10);
    expect(big[1] / -2e6).toBeCloseTo(1, 10);
    const jw = polynomialRoots([0, 1, 0, 1]);
    expect(jw.map((r) => [r.re, Math.round(r.im * 1e9) / 1e9])).toEqual([[0, 0], [0, -1], [0, 1]]);
  });
});

describe("Bode evaluation", () => {
  it("RC: |Zth| = R/√2 and phase −45° at f = 1/(2πRC)", () => {
    // Common practice: a single-pole RC corner.
    const r = solve("port out 0\nRb resistor out 0 = R\nCb capacitor out 0 = C\n");
    const rth = r.rth!;
    expect(rth.infix).toBe("R/(C*R*s + 1)");
    const f = numericCoefficientsInS(parseRth(rth.infix), { R: Rational.of(1000), C: Rational.parseDecimal("1e-6") });
    if ("missing" in f) throw new Error("missing symbols");
    const corner = 1 / (2 * Math.PI * 1000 * 1e-6);
    const { magnitude, phase } = frequencyResponse(f, [corner / 1000, corner, corner * 1000]);
    expect(magnitude[0]).toBeCloseTo(1000, 3);
    expect(magnitude[1]).toBeCloseTo(1000 / Math.SQRT2, 6);
    expect(phase[1]).toBeCloseTo(-45, 9);
    // Common practice: the phase is −atan(f/fc).
    expect(phase[2]).toBeCloseTo((-Math.atan(1000) * 180) / Math.PI, 9);
    expect(phase[0]).toBeCloseTo((-Math.atan(1 / 1000) * 180) / Math.PI, 9);
  });
});

function parseRth(text: string) {
  return parseValue(text);
}

describe("open-circuit transfer from the independent source", () => {
  it("one source: Vth/Vs of the sensor RC is 1/(1 + sR1C) (common practice: a single-pole low-pass)", () => {
    const r = solve(RC);
    const sources = independentSourcesOf(RC);
    expect(sources?.map((s) => [s.name, s.kind, s.value.toInfix()])).toEqual([["Sensor", "voltage", "Vs"]]);
    const h = openCircuitTransfer(parseValue(r.vth!.infix), sources);
    if (h.kind !== "transfer") throw new Error(h.kind);
    expect(askSympy([{ kind: "equal", a: h.transfer.toInfix(), b: "1/(1 + s*R1*C)" }])).toEqual([true]);
  });

  it("a current source gives a transimpedance; a controlled source with no independent part is not counted", () => {
    // A photodiode current into a shunt RC, buffered by a VCVS: Vth/Iph = Rsh/(1 + sRshC) (common practice).
    const text = "port out 0\nDiode current 0 n = Iph\nRsh resistor n 0 = R\nCj capacitor n 0 = C\nBuf voltage out 0 = across(n, 0)\n";
    const sources = independentSourcesOf(text);
    expect(sources?.map((s) => s.name)).toEqual(["Diode"]);
    const h = openCircuitTransfer(parseValue(solve(text).vth!.infix), sources);
    if (h.kind !== "transfer") throw new Error(h.kind);
    expect(h.source.kind).toBe("current");
    expect(askSympy([{ kind: "equal", a: h.transfer.toInfix(), b: "R/(1 + s*R*C)" }])).toEqual([true]);
  });

  it("several sources (a bias part in a controlled source counts) and none are said as such", () => {
    const biased = "port out 0\nSig voltage in 0 = Vin\nR1 resistor in n = R\nBuf voltage out 0 = across(n, 0) + Voff\nCload capacitor n 0 = C\n";
    const several = openCircuitTransfer(parseValue(solve(biased).vth!.infix), independentSourcesOf(biased));
    expect(several.kind === "several" && several.sources.map((s) => [s.name, s.value.toInfix()])).toEqual([["Sig", "Vin"], ["Buf", "Voff"]]);
    const passive = "port out 0\nR1 resistor out n = R\nCload capacitor n 0 = C\n";
    expect(openCircuitTransfer(parseValue(solve(passive).vth!.infix), independentSourcesOf(passive)).kind).toBe("none");
    expect(independentSourcesOf("port out 0\nR1 resistor out 0 = 2.2Meg\n")).toBeNull();
  });
});
