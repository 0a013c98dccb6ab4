// Named results from published texts, each network written in the Portfold netlist.
// Each check names its source; "from memory" means the formula was recalled, not re-read.

import { describe, expect, it } from "vitest";
import { solveNetwork, type SolveResult } from "../../shared/engine";
import { evaluateInfix, expectSameExpression } from "../support/expressions";

function solve(text: string): SolveResult {
  const r = solveNetwork(text, { steps: false, sensitivities: false });
  expect(r.diagnostics.filter((d) => d.severity === "error")).toEqual([]);
  return r;
}

describe("textbook results", () => {
  it("finite-gain voltage follower: Rout = Ro/(1+A), Vth = A Vs/(1+A)", () => {
    // Sedra & Smith, Microelectronic Circuits, 7th ed., ch. 2 (op-amp with finite gain and output resistance); from memory.
    const r = solve(`
      port out 0
      Vsig voltage in 0 = Vs
      Amp voltage x 0 = A * across(in, out)
      Rout resistor x out = Ro`);
    expectSameExpression(r.rth?.infix, "Ro/(1 + A)");
    expectSameExpression(r.vth?.infix, "A*Vs/(1 + A)");
    expect(r.agree).toBe(true);
  });

  it("emitter follower output resistance: RE parallel (Rs + r_pi)/(beta + 1)", () => {
    // Sedra & Smith, Microelectronic Circuits, 7th ed., ch. 7 (emitter follower, ro neglected); from memory.
    const r = solve(`
      port e 0
      Vsig voltage s 0 = Vs
      Rsrc resistor s b = Rs
      Rpi resistor b e = r_pi
      Fb current 0 e = beta * through(Rpi)
      Remit resistor e 0 = RE`);
    const follower = "(Rs + r_pi)/(beta + 1)";
    expectSameExpression(r.rth?.infix, `RE*${follower}/(RE + ${follower})`);
    // Open-circuit gain RE (beta+1) / (Rs + r_pi + (beta+1) RE), same source.
    expectSameExpression(r.vth?.infix, "Vs*RE*(beta + 1)/(Rs + r_pi + (beta + 1)*RE)");
  });

  it("common-source stage with source degeneration: Rout = ro (1 + gm Rs) + Rs", () => {
    // Razavi, Design of Analog CMOS Integrated Circuits, 2nd ed., ch. 3 (degenerated CS stage, no body effect); from memory.
    const r = solve(`
      port d 0
      Gm1 current d src = gm * across(0, src)
      Ro1 resistor d src = ro
      Rdeg resistor src 0 = Rs`);
    expectSameExpression(r.rth?.infix, "ro*(1 + gm*Rs) + Rs");
    expect(r.statements.map((s) => s.code)).toContain("vth-zero");
  });

  it("common-gate stage with body effect: Rout = ro + (1 + (gm + gmb) ro) RS", () => {
    // Razavi, Design of Analog CMOS Integrated Circuits, 2nd ed., ch. 3 (common-gate stage, output
    // impedance with body effect); from memory. One element carries both controls.
    const r = solve(`
      port d 0
      Gm1 current d s = gm*across(0, s) + gmb*across(0, s)
      Ro1 resistor d s = ro
      Rdegen resistor s 0 = RS`);
    expectSameExpression(r.rth?.infix, "ro + (1 + (gm + gmb)*ro)*RS");
  });

  it("cascode output resistance: Rout = ro1 + ro2 + gm2 ro1 ro2", () => {
    // Razavi, Design of Analog CMOS Integrated Circuits, 2nd ed., ch. 3 (cascode stage, exact small-signal result); from memory.
    const r = solve(`
      port d 0
      Gm2 current d x = gm2 * across(0, x)
      Rhigh resistor d x = ro2
      Rlow resistor x 0 = ro1`);
    expectSameExpression(r.rth?.infix, "ro1 + ro2 + gm2*ro1*ro2");
  });

  it("CE stage with emitter degeneration: Rout = ro (1 + gm (RE || r_pi)) + RE || r_pi", () => {
    // Sedra & Smith, Microelectronic Circuits, 7th ed., ch. 7 (output resistance of a degenerated BJT); from memory.
    const r = solve(`
      port c 0
      Gmq current c e = gm * across(0, e)
      Rce resistor c e = ro
      Rpi resistor 0 e = r_pi
      Remit resistor e 0 = RE`);
    const rp = "(RE*r_pi/(RE + r_pi))";
    expectSameExpression(r.rth?.infix, `ro*(1 + gm*${rp}) + ${rp}`);
  });

  it("source follower output resistance: ro/(1 + gm ro), open-circuit gain gm ro/(1 + gm ro)", () => {
    // Razavi, Design of Analog CMOS Integrated Circuits, 2nd ed., ch. 3 (source follower without body effect); from memory.
    const r = solve(`
      port out 0
      Vg voltage g 0 = Vin
      Gm1 current 0 out = gm * across(g, out)
      Ro1 resistor 0 out = ro`);
    expectSameExpression(r.rth?.infix, "ro/(1 + gm*ro)");
    expectSameExpression(r.vth?.infix, "gm*ro*Vin/(1 + gm*ro)");
  });

  it("Norton–Thevenin conversion: a current source I parallel R is Vth = I R, Rth = R, Isc = I", () => {
    // Hayt, Kemmerly & Durbin, Engineering Circuit Analysis, 8th ed., ch. 5 (source transformation); from memory.
    const r = solve(`
      port a 0
      Is current 0 a = I
      Rp resistor a 0 = R`);
    expectSameExpression(r.vth?.infix, "I*R");
    expectSameExpression(r.rth?.infix, "R");
    expectSameExpression(r.isc?.infix, "I");
    expect(r.norton).toEqual({ isc: "I", rth: "R" });
  });

  it("maximum power transfer: the load power peaks at RL = Rth, with Pmax = Vth^2 / (4 Rth)", () => {
    // Hayt, Kemmerly & Durbin, Engineering Circuit Analysis, 8th ed., ch. 5 (maximum power transfer); from memory.
    const r = solve(`
      port out 0
      Vs voltage in 0 = V
      Ra resistor in out = R1
      Rb resistor out 0 = R2`);
    // The load's power from a second solve with the load in place (its voltage is the loaded port's Vth),
    // read by the independent reader: it peaks where RL equals the first solve's Rth.
    const loaded = solve(`
      port out 0
      Vs voltage in 0 = V
      Ra resistor in out = R1
      Rb resistor out 0 = R2
      Load resistor out 0 = RL`);
    const point = { V: 1.5, R1: 0.75, R2: 2.25 };
    const vth = evaluateInfix(r.vth!.infix, point);
    const rth = evaluateInfix(r.rth!.infix, point);
    const power = (rl: number) => evaluateInfix(loaded.vth!.infix, { ...point, RL: rl }) ** 2 / rl;
    expect(power(rth)).toBeCloseTo((vth * vth) / (4 * rth), 12);
    for (const off of [0.9, 0.99, 1.01, 1.1, 2]) expect(power(rth * off), `RL = ${off} Rth`).toBeLessThan(power(rth));
  });

  it("voltage divider: Vth = Vs R2/(R1+R2), Rth = R1 R2/(R1+R2)", () => {
    // Common practice.
    const r = solve(`
      port out 0
      Vs voltage in 0 = V
      Ra resistor in out = R1
      Rb resistor out 0 = R2`);
    expectSameExpression(r.vth?.infix, "V*R2/(R1 + R2)");
    expectSameExpression(r.rth?.infix, "R1*R2/(R1 + R2)");
  });

  it("inverting amplifier on an ideal op-amp: Vth = -(R2/R1) Vs and Rth = 0 (no Norton form)", () => {
    // Sedra & Smith, Microelectronic Circuits, 7th ed., ch. 2 (inverting configuration); from memory.
    const r = solve(`
      port o 0
      Vs voltage in 0 = V
      Rlow resistor in n = R1
      Rhigh resistor n o = R2
      Buf opamp 0 n -> o`);
    expectSameExpression(r.vth?.infix, "-R2*V/R1");
    expectSameExpression(r.rth?.infix, "0");
    expect(r.isc).toBeNull();
    expect(r.norton).toBeNull();
    expect(r.statements.map((s) => s.code)).toContain("rth-zero");
  });

  it("non-inverting amplifier on an ideal op-amp: gain 1 + R2/R1", () => {
    // Sedra & Smith, Microelectronic Circuits, 7th ed., ch. 2 (non-inverting configuration); from memory.
    const r = solve(`
      port o 0
      Vs voltage p 0 = V
      Rlow resistor n 0 = R1
      Rhigh resistor n o = R2
      Buf opamp p n -> o`);
    expectSameExpression(r.vth?.infix, "V*(1 + R2/R1)");
  });

  it("inverting amplifier with finite open-loop gain A: G = -(R2/R1) / (1 + (1 + R2/R1)/A)", () => {
    // Sedra & Smith, Microelectronic Circuits, 7th ed., ch. 2 (effect of finite open-loop gain); from memory.
    const r = solve(`
      port o 0
      Vs voltage in 0 = V
      Rlow resistor in n = R1
      Rhigh resistor n o = R2
      Amp voltage o 0 = A * across(0, n)`);
    expectSameExpression(r.vth?.infix, "-V*(R2/R1)/(1 + (1 + R2/R1)/A)");
    const lim = solveNetwork(
      `port o 0\nVs voltage in 0 = V\nRlow resistor in n = R1\nRhigh resistor n o = R2\nAmp voltage o 0 = A * across(0, n)`,
      { limits: [{ symbol: "A", to: "inf" }], steps: false },
    ).limits[0].results.vth;
    expectSameExpression(lim?.value, "-R2*V/R1");
  });

  it("Wheatstone bridge: Vth = Vr (RT/(R1+RT) - R4/(R3+R4)), Rth = R1||RT + R3||R4", () => {
    // Hayt, Kemmerly & Durbin, Engineering Circuit Analysis, 8th ed., ch. 5 (Thevenin equivalent of a bridge); from memory.
    const r = solve(`
      port a b
      Vref voltage top 0 = Vr
      Ra resistor top a = R1
      Rt resistor a 0 = RT
      Rb resistor top b = R3
      Rc resistor b 0 = R4`);
    expectSameExpression(r.vth?.infix, "Vr*(RT/(R1 + RT) - R4/(R3 + R4))");
    expectSameExpression(r.rth?.infix, "R1*RT/(R1 + RT) + R3*R4/(R3 + R4)");
  });

  it("RC low-pass: Vth = Vs/(1 + sRC), Zth = R/(1 + sRC)", () => {
    // Common practice.
    const r = solve(`
      port out 0
      Vin voltage in 0 = Vs
      Rf resistor in out = R
      Cf capacitor out 0 = C`);
    expectSameExpression(r.vth?.infix, "Vs/(1 + s*R*C)");
    expectSameExpression(r.rth?.infix, "R/(1 + s*R*C)");
  });

  it("series RL: Zth = R + sL, and an ideal current source port has no Thevenin form", () => {
    // Common practice (impedance of an inductor is sL; an ideal current source has infinite output resistance).
    const rl = solve(`
      port a 0
      Rs resistor a m = R
      Ls inductor m 0 = L`);
    expectSameExpression(rl.rth?.infix, "R + s*L");
    const cs = solve(`
      port a 0
      Is current 0 a = I`);
    expect(cs.rth).toBeNull();
    expect(cs.thevenin).toBeNull();
    expectSameExpression(cs.isc?.infix, "I");
    expect(cs.statements.map((s) => s.code)).toContain("rth-infinite");
  });
});
