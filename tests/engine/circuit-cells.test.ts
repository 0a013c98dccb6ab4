// Device cells: instances expand into elements with their own (renamable) symbols. Checked against
// named small-signal results; each names its source and "from memory" where the formula was recalled.

import { describe, expect, it } from "vitest";
import { parseNetwork, printNetlistText, solveNetwork, toSolveOutput, type SolveResult } from "../../shared/engine";
import { checkCellDefinition } from "../../shared/engine/circuit/cells";
import { evaluateInfix, expectSameExpression } from "../support/expressions";

function solve(input: string | object, options: Parameters<typeof solveNetwork>[1] = {}): SolveResult {
  const r = solveNetwork(input as string, { steps: false, sensitivities: false, ...options });
  expect(r.diagnostics.filter((d) => d.severity === "error")).toEqual([]);
  return r;
}

describe("bipolar stages (hybrid-π cell)", () => {
  it("common emitter: Rout = RC ∥ ro looking into the collector", () => {
    // Sedra & Smith, Microelectronic Circuits, 7th ed., ch. 7 (CE amplifier, Ro = RC ∥ ro); from memory.
    const r = solve(`
      port c 0
      Sig voltage in 0 = Vs
      Rsig resistor in b = Rs
      Load resistor c 0 = RC
      Stage cell bjt-hybrid-pi b=b c=c e=0`);
    expectSameExpression(r.rth?.infix, "RC*ro/(RC + ro)");
    // Gain into an open port: Vth = −gm (RC ∥ ro) · Vs·r_pi/(Rs + r_pi) (same source).
    expectSameExpression(r.vth?.infix, "-gm*(RC*ro/(RC + ro))*Vs*r_pi/(Rs + r_pi)");
  });

  it("common base: Rout = ro + (1 + gm·ro)(Re ∥ r_pi) looking into the collector", () => {
    // Sedra & Smith, 7th ed., ch. 7 (CB amplifier output resistance, also the degenerated CE); from memory.
    const r = solve(`
      port c 0
      Sig voltage in 0 = Vs
      Rsig resistor in e = Re
      Stage cell bjt-hybrid-pi b=0 c=c e=e`);
    expectSameExpression(r.rth?.infix, "ro + (1 + gm*ro)*(Re*r_pi/(Re + r_pi))");
  });

  it("common collector (emitter follower): Rout = RE ∥ ro ∥ (r_pi + Rs)/(1 + β), β = gm·r_pi", () => {
    // Sedra & Smith, 7th ed., ch. 7 (emitter follower output resistance); from memory.
    const r = solve(`
      port e 0
      Sig voltage in 0 = Vs
      Rsig resistor in b = Rs
      Rbias resistor e 0 = RE
      Stage cell bjt-hybrid-pi b=b c=0 e=e`);
    expectSameExpression(r.rth?.infix, "1/(1/RE + 1/ro + (1 + gm*r_pi)/(r_pi + Rs))");
  });
});

describe("MOSFET stages", () => {
  const CASCODE = `
    # the output branch of a sensor amplifier: Lower common source, Upper cascode on top
    port out 0
    Lower cell mosfet g=0 d=x s=0 b=0 rename gm:gm1 gmb:gmb1 ro:ro1
    Upper cell mosfet g=0 d=out s=x b=0 rename gm:gm2 gmb:gmb2 ro:ro2`;

  it("cascode: Rout = ro1 + ro2 + (gm2 + gmb2)·ro1·ro2", () => {
    // Razavi, Design of Analog CMOS Integrated Circuits, 2nd ed., ch. 3 (cascode stage); from memory.
    const r = solve(CASCODE);
    expectSameExpression(r.rth?.infix, "ro1 + ro2 + (gm2 + gmb2)*ro1*ro2");
    expect(r.rth?.symbols).toEqual(["gm2", "gmb2", "ro1", "ro2"]);
  });

  it("source follower with body effect: Rout = 1/(gm + gmb) ∥ ro", () => {
    // Razavi, 2nd ed., ch. 3 (source follower output resistance with body effect); from memory.
    const r = solve(`
      port out 0
      Bias current out 0 = Ib
      Lower cell mosfet g=0 d=0 s=out b=0`);
    expectSameExpression(r.rth?.infix, "1/(gm + gmb + 1/ro)");
  });

  it("source-degenerated common source: Rout = ro + Rs + (gm + gmb)·ro·Rs", () => {
    // Razavi, 2nd ed., ch. 3 (CS stage with source degeneration, output resistance); from memory.
    const r = solve(`
      port out 0
      Degen resistor src 0 = Rs
      Lower cell mosfet g=0 d=out s=src b=0`);
    expectSameExpression(r.rth?.infix, "ro + Rs + (gm + gmb)*ro*Rs");
  });

  it("optional Cgs and Cgd: a common-source stage's input admittance s(Cgs + Cgd(1 + gm·RD))", () => {
    // Miller effect with an ideal gate drive at the port, RD load, ro left out (ro -> inf):
    // Sedra & Smith, 7th ed., ch. 10 (Miller's theorem, Cin = Cgs + Cgd(1 + gm RD)); from memory.
    const r = solve(
      `
      port g 0
      Load resistor d 0 = RD
      Lower cell mosfet g=g d=d s=0 b=0 with Cgs Cgd`,
      { limits: [{ symbol: "ro", to: "inf" }] },
    );
    expect(r.frequency).toBeDefined();
    const lim = r.limits[0].results.rth;
    expect(lim?.kind).toBe("finite");
    // The exact input admittance is s·Cgs + s·Cgd(1 + gm·RD)/(1 + s·Cgd·RD); at low frequency the Miller form.
    expectSameExpression(`1/(${lim!.value})`, "s*Cgs + s*Cgd*(1 + gm*RD)/(1 + s*Cgd*RD)");
    // Y/s as s -> 0, read at a small s by the independent reader: Cgs + Cgd(1 + gm RD).
    const at = { Cgs: 1.5, Cgd: 0.25, gm: 2, RD: 3, s: 1e-9 };
    expect(1 / evaluateInfix(lim!.value!, at) / at.s).toBeCloseTo(1.5 + 0.25 * (1 + 2 * 3), 6);
  });
});

describe("finite-gain amplifier cell", () => {
  it("voltage follower: Rout → Ro/(1 + A) as Rin → ∞", () => {
    // Sedra & Smith, 7th ed., ch. 2 (follower with finite gain and output resistance); from memory.
    const r = solve(
      `
      port out 0
      Sig voltage in 0 = Vs
      Dev1 cell amplifier p=in n=out o=out`,
      { limits: [{ symbol: "Rin", to: "inf" }] },
    );
    const limits = r.limits[0].results;
    expect(limits.rth?.kind).toBe("finite");
    expectSameExpression(limits.rth?.value, "Ro/(1 + A)");
    // With an ideal source at p, Rin is in parallel with nothing that matters: Vth = A·Vs/(1 + A) exactly, as Rin → ∞.
    expectSameExpression(limits.vth?.value, "A*Vs/(1 + A)");
  });
});

describe("cell instances: formats and diagnostics", () => {
  const JSON_CASCODE = {
    port: { plus: "out", minus: "0" },
    elements: [],
    cells: [
      { name: "Lower", cell: "mosfet", terminals: { g: "0", d: "x", s: "0", b: "0" }, symbols: { gm: "gm1", gmb: "gmb1", ro: "ro1" } },
      { name: "Upper", cell: "mosfet", terminals: { g: "0", d: "out", s: "x", b: "x" }, symbols: { gm: "gm2", gmb: "gmb2", ro: "ro2" } },
    ],
  };

  it("JSON and text give the same network and the text round-trips", () => {
    const parsed = parseNetwork(JSON_CASCODE);
    expect(parsed.diagnostics).toEqual([]);
    const text = printNetlistText(parsed.network!);
    expect(text).toContain("Upper cell mosfet g=0 d=out s=x b=x rename gm:gm2 gmb:gmb2 ro:ro2");
    const back = parseNetwork(text);
    expect(back.network!.cells).toEqual(JSON_CASCODE.cells);
    // Body tied to source: no body effect, Rout = ro1 + ro2 + gm2·ro1·ro2 (Razavi, 2nd ed., ch. 3; from memory).
    expectSameExpression(solve(JSON_CASCODE).rth?.infix, "ro1 + ro2 + gm2*ro1*ro2");
    expect(solve(text).rth?.infix).toBe(solve(JSON_CASCODE).rth?.infix);
  });

  it("the result keeps the instance; the ledger shows the expanded elements", () => {
    const r = solveNetwork(JSON_CASCODE, { sensitivities: false });
    expect(r.network?.cells?.map((c) => c.name)).toEqual(["Lower", "Upper"]);
    const network = r.steps.find((s) => s.id === "vth.kcl.x");
    expect(JSON.stringify(network?.data)).toContain("Upper_ro");
    expect(toSolveOutput(r).rth).toBe(r.rth?.infix);
  });

  it("a renamed symbol may be an expression (a matched pair at twice the current)", () => {
    const r = solve("port c 0\nStage cell bjt-hybrid-pi b=0 c=c e=0 rename ro:ro/2\n");
    expectSameExpression(r.rth?.infix, "ro/2");
  });

  it("a diagnostic from inside a cell names the instance and its line", () => {
    // Without Cgs and Cgd nothing touches the gate node: the control across (g, src) names a node no element touches.
    const r = solveNetwork("port d 0\nLoad resistor d 0 = RD\nLower cell mosfet g=g d=d s=src b=0\n", { steps: false });
    const d = r.diagnostics.find((x) => x.code === "control-unknown-node");
    expect(d, JSON.stringify(r.diagnostics)).toBeDefined();
    expect(d!.elements[0]).toBe("Lower");
    expect(d!.line).toBe(3);
    expect(d!.message).toContain('inside cell "Lower"');
    const json = solveNetwork({ port: { plus: "d", minus: "0" }, elements: [{ name: "Load", kind: "resistor", nodes: ["d", "0"], value: "RD" }], cells: [{ name: "Lower", cell: "mosfet", terminals: { g: "g", d: "d", s: "src", b: "0" } }] });
    expect(json.diagnostics.find((x) => x.code === "control-unknown-node")?.path).toEqual(["cells", 0]);
  });

  it("a user cell's terminal may only sense a voltage, as a transistor gate does", () => {
    // Common practice: in the small-signal model the gate draws no current; it only sets v_gs.
    const gateOnly = { id: "gm-stage", title: "Transconductor", terminals: ["g", "d"], symbols: ["gm"], elements: [{ name: "Gm", kind: "current" as const, nodes: ["d", "0"] as [string, string], value: "gm * across(g, 0)" }] };
    expect(checkCellDefinition(gateOnly)).toEqual([]);
    expect(checkCellDefinition({ ...gateOnly, terminals: ["g", "d", "x"] })).toEqual([expect.stringContaining('terminal "x"')]);
  });
});
