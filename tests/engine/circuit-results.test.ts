// What is derived from a result: compact and TeX forms, limits with leading order, values with
// SI prefixes, sensitivities, solving for a symbol, the dimension check and the numeric check.

import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { solveNetwork, type NetworkInput } from "../../shared/engine";
import { Rational, readExpression } from "../../shared/engine/algebra";
import { expectSameExpression } from "../support/expressions";

const FIXTURES = new URL("../../fixtures/", import.meta.url).pathname;
const follower = readFileSync(FIXTURES + "sensor-buffer.pfn", "utf8"); // Vth = A Vs/(1+A), Rth = Ro/(1+A)
const same = expectSameExpression;

describe("results", () => {
  it("prints expanded and compact forms, infix and TeX", () => {
    const r = solveNetwork(readFileSync(FIXTURES + "thermistor-bridge.pfn", "utf8"), { steps: false });
    expect(r.rth!.infix).toBe("(R1*R3*R4 + R1*R3*RT + R1*R4*RT + R3*R4*RT)/(R1*R3 + R1*R4 + R3*RT + R4*RT)");
    // Compact: the denominator factored as (R1 + RT)(R3 + R4), the same function.
    expect(r.rth!.compact).toContain("(R1 + RT)*(R3 + R4)");
    same(r.rth!.compact, r.rth!.infix);
    expect(r.rth!.tex).toMatch(/^\\frac\{/);
    expect(r.rth!.terms).toEqual({ numerator: 4, denominator: 4 });
  });

  it("takes limits exactly, with the leading-order form", () => {
    const r = solveNetwork(follower, {
      limits: [
        { symbol: "A", to: "inf" },
        { symbol: "A", to: "zero" },
      ],
      steps: false,
    });
    const inf = r.limits.find((l) => l.key === "A=inf")!.results;
    // Common practice: Ro/(1+A) -> 0 like Ro/A; A Vs/(1+A) -> Vs; Isc = A Vs/Ro grows without bound.
    expect(inf.rth).toMatchObject({ kind: "finite", value: "0", leading: "Ro/A" });
    expect(inf.vth).toMatchObject({ kind: "finite", value: "Vs" });
    expect(inf.isc).toMatchObject({ kind: "infinite" });
    const zero = r.limits.find((l) => l.key === "A=0")!.results;
    expect(zero.rth).toMatchObject({ kind: "finite", value: "Ro" });
    expect(zero.vth).toMatchObject({ kind: "finite", value: "0", leading: "A*Vs" });
  });

  it("evaluates with SI prefixes exactly, partially, and in floating point on request", () => {
    const full = solveNetwork(follower, { values: { Ro: "4.7k", A: "1e5", Vs: "2.5m" }, float: true, steps: false });
    // SI Brochure (BIPM, 9th ed.): k = 10^3, m = 10^-3.
    expect(full.values!.given).toEqual({ Ro: "4700", A: "100000", Vs: "1/400" });
    expect(full.values!.results.rth).toEqual({ exact: "4700/100001", float: 4700 / 100001, display: "47 mΩ" });
    const partial = solveNetwork(follower, { values: { Ro: "50" }, steps: false });
    same(partial.values!.results.rth!.exact, "50/(1 + A)");
    expect(partial.values!.results.rth!.float).toBeNull();
  });

  it("gives normalized sensitivities (x/F) dF/dx", () => {
    const r = solveNetwork(follower, { steps: false });
    // By differentiation (common practice): S_A(Ro/(1+A)) = -A/(1+A), S_Ro = 1, S_A(A Vs/(1+A)) = 1/(1+A).
    same(r.sensitivities.rth!.A, "-A/(1 + A)");
    same(r.sensitivities.rth!.Ro, "1");
    same(r.sensitivities.vth!.A, "1/(1 + A)");
    expect(Object.keys(r.sensitivities.rth!)).toEqual(["A", "Ro"]);
  });

  // Euler's theorem: a function homogeneous of degree k in the resistances has normalized
  // sensitivities to them summing to k; Rth has degree 1, Vth 0, Isc -1, and Vth and Isc are
  // proportional to Vs (common practice in network sensitivity analysis).
  function expectEulerSums(network: NetworkInput, resistorCount: number) {
    const r = solveNetwork(network, { steps: false });
    expect(r.statements.map((x) => x.code)).not.toContain("sensitivity-skipped");
    const point: Record<string, Rational> = { Vs: Rational.of(3) };
    network.elements.forEach((e, i) => {
      if (e.kind === "resistor") point[e.value] = Rational.of(2 * i + 1, 7);
    });
    const at = (text: string) => readExpression(text).substitute(point).constantValue()!;
    const sumOverResistors = (of: Record<string, string>) =>
      Object.entries(of).filter(([name]) => name !== "Vs").reduce((sum, [, text]) => sum.add(at(text)), Rational.ZERO);
    const s = r.sensitivities;
    expect(Object.keys(s.rth!)).toHaveLength(resistorCount);
    expect(sumOverResistors(s.rth!).toString()).toBe("1");
    expect(sumOverResistors(s.vth!).toString()).toBe("0");
    expect(sumOverResistors(s.isc!).toString()).toBe("-1");
    expect(at(s.vth!.Vs).toString()).toBe("1");
    expect(at(s.isc!.Vs).toString()).toBe("1");
    expect(s.rthFromVocIsc).toEqual(s.rth);
  }

  it("gives every sensitivity of a 13-element ladder, and they sum as Euler's theorem on homogeneous functions says", () => {
    // Six sections of series Ra_i and shunt Rb_i behind Vs: 13 elements, 13 symbols, Rth 144/233 terms.
    const elements: NetworkInput["elements"] = [{ name: "Vin", kind: "voltage", nodes: ["n0", "0"], value: "Vs" }];
    for (let i = 1; i <= 6; i++) {
      elements.push({ name: `Ra${i}`, kind: "resistor", nodes: [`n${i - 1}`, `n${i}`], value: `Ra_${i}` });
      elements.push({ name: `Rb${i}`, kind: "resistor", nodes: [`n${i}`, "0"], value: `Rb_${i}` });
    }
    expectEulerSums({ port: { plus: "n6", minus: "0" }, elements }, 12);
  });

  it("gives every sensitivity of a 14-element 3×3 resistor grid, the densest results of that size in the benchmark", () => {
    // Nodes g_r_c on a 3×3 grid (g_0_0 is ground), a resistor on each of the 12 sides, fed at the
    // far corner by Vs behind Rs, port from the centre to ground: Rth 312/480 terms.
    const node = (row: number, col: number) => (row === 0 && col === 0 ? "0" : `g${row}_${col}`);
    const elements: NetworkInput["elements"] = [
      { name: "Vin", kind: "voltage", nodes: ["src", "0"], value: "Vs" },
      { name: "Rsrc", kind: "resistor", nodes: ["src", "g2_2"], value: "Rs" },
    ];
    for (let row = 0; row < 3; row++)
      for (let col = 0; col < 3; col++) {
        const here = node(row, col);
        if (col < 2) elements.push({ name: `Rh${row}${col}`, kind: "resistor", nodes: [here, node(row, col + 1)], value: `Rh_${row}${col}` });
        if (row < 2) elements.push({ name: `Rv${row}${col}`, kind: "resistor", nodes: [here, node(row + 1, col)], value: `Rv_${row}${col}` });
      }
    expect(elements).toHaveLength(14);
    expectEulerSums({ port: { plus: "g1_1", minus: "0" }, elements }, 13);
  });

  it("skips sensitivities of large results and says so", () => {
    const r = solveNetwork(follower, { sensitivitySizeLimit: 1, steps: false });
    expect(r.sensitivities.rth).toBeUndefined();
    expect(r.sensitivities.isc).toBeDefined(); // A*Vs/Ro: 1 × 1 terms
    expect(r.statements.find((x) => x.code === "sensitivity-skipped")?.message).toMatch(/vth, rth/);
  });

  it("solves a result = target for a symbol where it is linear-fractional", () => {
    const r = solveNetwork(follower, {
      solveFor: [
        { result: "rth", symbol: "Ro", target: "50" },
        { result: "rth", symbol: "A", target: "1" },
        { result: "rth", symbol: "Vs", target: "1" },
      ],
      steps: false,
    });
    same(r.solved[0].value, "50*(1 + A)");
    same(r.solved[1].value, "Ro - 1");
    expect(r.solved[2]).toMatchObject({ value: null, reason: "rth does not depend on Vs" });
  });

  it("checks dimensions with quantities inferred from the elements", () => {
    const r = solveNetwork(readFileSync(FIXTURES + "photodiode-tia.pfn", "utf8"), { steps: false });
    expect(r.dimensions!.quantities).toEqual({ Cd: "capacitance", Cf: "capacitance", Ip: "current", Rf: "resistance", s: "frequency" });
    expect(r.dimensions!.checks.vth).toMatchObject({ status: "ok", found: "V" });
    expect(r.dimensions!.checks.rth).toMatchObject({ status: "ok" });
  });

  it("counts plain numbers in element values in their element's unit", () => {
    const r = solveNetwork("port a 0\nVs voltage in 0 = V\nRes1 resistor in a = 4.7k\nRes2 resistor a 0 = Rx\n", { steps: false });
    expect(r.dimensions!.checks.rth).toMatchObject({ status: "ok", found: "Ω" });
    expect(r.dimensions!.checks.isc).toMatchObject({ status: "ok", found: "A" });
  });

  it("says why a dimension cannot be checked, and what is wrong when it fails", () => {
    const unknown = solveNetwork("port a 0\nRes1 resistor a 0 = Ra*Rb/(Ra + Rb)\n", { steps: false });
    expect(unknown.dimensions!.checks.rth).toMatchObject({ status: "unknown" });
    expect(unknown.dimensions!.checks.rth!.message).toMatch(/"Ra", "Rb"/);
    const declared = solveNetwork("port a 0\nquantity Ra resistance\nRes1 resistor a 0 = Ra*Rb/(Ra + Rb)\n", { steps: false });
    expect(declared.dimensions!.quantities.Rb).toBe("resistance");
    expect(declared.dimensions!.checks.rth).toMatchObject({ status: "ok" });
    const wrong = solveNetwork("port b 0\nVs voltage a 0 = V\nRes1 resistor a 0 = R\nSrc1 voltage b 0 = R * across(a, 0)\n", { steps: false });
    expect(wrong.dimensions!.checks.vth!.status).toBe("mismatch");
    expect(wrong.dimensions!.checks.vth!.found).toBe("V^2·A^-1");
  });

  it("follows the port's sign conventions: Isc leaves at plus; swapping plus and minus negates Vth and Isc only", () => {
    // Common practice: a source V behind R1 into the port drives Isc = V/R1 out of the plus terminal.
    const text = (port: string) => `port ${port}\nVs voltage in 0 = V\nRes1 resistor in a = R1\nRes2 resistor a b = R2\nRes3 resistor b 0 = R3\n`;
    const ab = solveNetwork(text("a 0"), { steps: false });
    same(ab.isc!.infix, "V/R1");
    const ba = solveNetwork(text("0 a"), { steps: false });
    same(ba.vth!.infix, `-(${ab.vth!.infix})`);
    same(ba.isc!.infix, `-(${ab.isc!.infix})`);
    same(ba.rth!.infix, ab.rth!.infix);
    const floating = solveNetwork(text("b a"), { steps: false });
    expect(floating.agree).toBe(true);
    same(floating.rth!.infix, "R2*(R1 + R3)/(R1 + R2 + R3)");
  });

  it("gives only the infix form above the print limit, and says so", () => {
    const r = solveNetwork(follower, { printTermLimit: 2, steps: false });
    expect(r.rth!.infix).toBe("Ro/(A + 1)");
    expect(r.rth!.tex).toBeNull();
    expect(r.statements.map((x) => x.code)).toContain("forms-skipped");
  });

  it("agrees with a floating-point solve of a separate formulation at seeded points (the numeric check)", () => {
    const r = solveNetwork(follower, { steps: false });
    expect(r.numericCheck!.agree).toBe(true);
    expect(r.numericCheck!.relativeError!).toBeLessThan(1e-12);
    const { testSource, vocIsc, numeric, exactPoint } = r.checks;
    expect({ testSource, vocIsc, numeric, exactPoint }).toEqual({ testSource: true, vocIsc: true, numeric: true, exactPoint: true });
    expect(r.checks.details.numeric.points).toBe(3);
  });
});
