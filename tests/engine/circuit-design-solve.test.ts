// Design solve: the value of one symbol that makes a result meet a target.

import { describe, expect, it } from "vitest";
import { Rational, parseValue } from "../../shared/engine/algebra";
import { expectSameExpression } from "../support/expressions";
import { designSolve, solveNetwork } from "../../shared/engine";

// A sensor's output resistance R1 loaded by RL, seen at the port.
const LOADED = "port out 0\nSensor voltage a 0 = Vs\nRsen resistor a out = R1\nLoad resistor out 0 = RL\n";
const rth = parseValue(solveNetwork(LOADED, { steps: false }).rth!.infix);

describe("design solve", () => {
  it("RL for Rth = 50 Ω with R1 = 100 Ω is 100 Ω (equal resistors in parallel halve, common practice)", () => {
    const a = designSolve({ result: rth, label: "Rth", symbol: "RL", target: parseValue("50"), values: { R1: Rational.of(100) }, quantity: "resistance" });
    expect(a).toMatchObject({ kind: "exact", number: 100 });
  });

  it("exact in the other symbols when they have no value: RL = R1·T/(R1 − T)", () => {
    const a = designSolve({ result: rth, label: "Rth", symbol: "RL", target: parseValue("T"), quantity: "resistance" });
    expect(a.kind).toBe("exact");
    if (a.kind === "exact") expectSameExpression(a.value.toInfix(), "R1*T/(R1 - T)");
  });

  it("a target above R1 needs a negative resistance: no value meets it", () => {
    const a = designSolve({ result: rth, label: "Rth", symbol: "RL", target: parseValue("150"), values: { R1: Rational.of(100) }, quantity: "resistance" });
    expect(a.kind).toBe("none");
    if (a.kind === "none") expect(a.reason).toBe("no positive resistance meets it: the equation gives RL = -300.0");
  });

  it("a target equal to R1 is only approached as RL grows without bound", () => {
    const a = designSolve({ result: rth, label: "Rth", symbol: "RL", target: parseValue("100"), values: { R1: Rational.of(100) }, quantity: "resistance" });
    expect(a).toEqual({ kind: "none", reason: "no finite value of RL gives Rth = 100: Rth only approaches it as RL grows without bound" });
  });

  it("degree 2 in the symbol: numeric real roots (R + R∥R2 = 150 Ω with R2 = 100 Ω gives R = 100 Ω)", () => {
    // By hand: R + 100R/(R + 100) = 150  <=>  R² + 50R − 15000 = 0  <=>  R = 100 or R = −150.
    const f = parseValue(solveNetwork("port a 0\nTop resistor a m = R\nLeg1 resistor m 0 = R\nLeg2 resistor m 0 = R2\n", { steps: false }).rth!.infix);
    const positive = designSolve({ result: f, label: "Rth", symbol: "R", target: parseValue("150"), values: { R2: Rational.of(100) }, quantity: "resistance" });
    expect(positive.kind).toBe("numeric");
    if (positive.kind === "numeric") expect(positive.numbers.map((x) => Math.round(x * 1e9) / 1e9)).toEqual([100]);
    const any = designSolve({ result: f, label: "Rth", symbol: "R", target: parseValue("150"), values: { R2: Rational.of(100) } });
    if (any.kind === "numeric") expect(any.numbers.map((x) => Math.round(x * 1e9) / 1e9)).toEqual([-150, 100]);
    else expect.unreachable();
  });

  it("a result that does not depend on the symbol says so", () => {
    const a = designSolve({ result: rth, label: "Rth", symbol: "Vs", target: parseValue("50") });
    expect(a).toEqual({ kind: "none", reason: "Rth does not depend on Vs" });
  });
});
