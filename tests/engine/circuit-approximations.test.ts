// Design-oriented approximations: dominant terms under "gm*ro >> 1" or "A >> 1", against
// textbook approximate forms (source and "from memory" beside each).

import { describe, expect, it } from "vitest";
import { parseValue } from "../../shared/engine/algebra";
import { approximate, parseAssumption, parseNetwork, printNetlistText, solveNetwork, toSolveOutput } from "../../shared/engine";
import { expectSameExpression } from "../support/expressions";

const CASCODE = `
port out 0
Dev1 cell mosfet g=0 d=x s=0 b=0 rename gm:gm1 gmb:gmb1 ro:ro1
Dev2 cell mosfet g=0 d=out s=x b=x rename gm:gm2 gmb:gmb2 ro:ro2
`;

describe("approximations", () => {
  it("cascode: Rout ≈ gm2·ro2·ro1 for gm·ro ≫ 1, as its own ledger step", () => {
    // Razavi, Design of Analog CMOS Integrated Circuits, 2nd ed., ch. 3 (cascode Rout ≈ gm2 ro2 ro1); from memory.
    const r = solveNetwork(CASCODE, { assume: ["gm*ro >> 1"], sensitivities: false });
    expectSameExpression(r.rth?.infix, "ro1 + ro2 + gm2*ro1*ro2");
    expectSameExpression(r.approximations?.results.rth?.approximate, "gm2*ro2*ro1");
    expect(r.approximations?.assumptions).toEqual(["gm*ro >> 1"]);
    const step = r.steps.find((s) => s.id === "approx.rth");
    expect(step?.kind).toBe("approximation");
    expect(step?.title).toBe("Rth when gm*ro >> 1");
    expect(step?.tex).toContain("\\gg 1");
    expect(toSolveOutput(r).approximations?.results.rth?.dropped).toEqual({ numerator: 2, denominator: 0 });
  });

  it("cascode with body effect: Rout ≈ (gm2 + gmb2)·ro2·ro1", () => {
    // Razavi, 2nd ed., ch. 3 (cascode with body effect); from memory.
    const r = solveNetwork(CASCODE.replace("b=x", "b=0"), { assume: ["gm*ro >> 1"], steps: false });
    expectSameExpression(r.approximations?.results.rth?.approximate, "(gm2 + gmb2)*ro2*ro1");
  });

  it("degenerated common source: Rout ≈ ro(1 + gm·Rs) for gm·ro ≫ 1 (Rs alone is dropped, ro is kept)", () => {
    // Razavi, 2nd ed., ch. 3 (CS with degeneration, Rout ≈ (1 + gm Rs) ro when gm ro ≫ 1); from memory.
    const r = solveNetwork("port out 0\nDegen resistor src 0 = Rs\nDev1 cell mosfet g=0 d=out s=src b=src\n", { assume: ["gm*ro >> 1"], steps: false });
    expectSameExpression(r.rth?.infix, "ro + Rs + gm*ro*Rs");
    expectSameExpression(r.approximations?.results.rth?.approximate, "ro*(1 + gm*Rs)");
  });

  it("finite-gain follower: Rout ≈ Ro/A and Vth ≈ Vs for A ≫ 1", () => {
    // Sedra & Smith, Microelectronic Circuits, 7th ed., ch. 2 (follower: Ro/(1 + A) ≈ Ro/A, gain ≈ 1); from memory.
    const r = solveNetwork("port out 0\nSig voltage in 0 = Vs\nAmp voltage x 0 = A * across(in, out)\nRout resistor x out = Ro\n", { assume: ["A >> 1"], steps: false });
    expectSameExpression(r.approximations?.results.rth?.approximate, "Ro/A");
    expectSameExpression(r.approximations?.results.vth?.approximate, "Vs");
  });

  it("a stem covers its numbered kin only (gm covers gm1, gm_2, not gmb)", () => {
    const a = parseAssumption("gm · ro ≫ 1");
    expect(a.stems).toEqual(["gm", "ro"]);
    const f = parseValue("ro + gmb*ro*Rs");
    // gmb·ro is not assumed large, so nothing is dropped.
    expect(approximate(f, [a]).approximate.toInfix()).toBe(f.toInfix());
    expect(approximate(parseValue("ro_1 + gm_2*ro_1*ro_2"), [a]).approximate.toInfix()).toBe("gm_2*ro_1*ro_2");
  });

  it("an unreadable assumption is an option-invalid diagnostic", () => {
    const r = solveNetwork("port a 0\nRes1 resistor a 0 = R\n", { assume: ["gm much bigger than ro"], steps: false });
    expect(r.diagnostics.map((d) => d.code)).toEqual(["option-invalid"]);
    expect(r.approximations).toBeUndefined();
  });

  it("an assumption written in the netlist applies as if asked for, and survives text and JSON", () => {
    // Same source as above: Razavi, 2nd ed., ch. 3, cascode Rout ≈ gm2 ro2 ro1; from memory.
    const text = `${CASCODE}assume gm*ro >> 1\n`;
    const read = parseNetwork(text);
    expect(read.network?.assumptions).toEqual(["gm*ro >> 1"]);
    expect(parseNetwork(printNetlistText(read.network!)).network).toEqual(read.network);
    expect(parseNetwork(JSON.stringify(read.network)).network?.assumptions).toEqual(["gm*ro >> 1"]);
    const r = solveNetwork(text, { sensitivities: false });
    expectSameExpression(r.approximations?.results.rth?.approximate, "gm2*ro2*ro1");
    expect(r.steps.find((s) => s.id === "approx.rth")?.kind).toBe("approximation");
  });

  it("an assume line with nothing assumed is a parse error at its line", () => {
    const r = parseNetwork("port a 0\nRa resistor a 0 = R\nassume\n");
    expect(r.diagnostics[0]).toMatchObject({ code: "parse-error", line: 3, column: 1 });
  });
});
