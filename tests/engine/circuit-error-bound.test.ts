// Approximations with a stated error: terms dropped at a design point (over a band or a tolerance
// box), checked on textbook closed forms; the exact forms against sympy (port_reference.py), and
// the stated error against sympy's own evaluation of exact and approximate forms.

import { execFileSync } from "node:child_process";
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { solveNetwork, type NetworkInput } from "../../shared/engine";
import { readExpression, RationalFunction } from "../../shared/engine/algebra";
import { askSympy } from "./algebra-sympy";

const SCRIPT = new URL("./sympy/port_reference.py", import.meta.url).pathname;
const ROOT = new URL("../../", import.meta.url).pathname;

const same = (a: string, b: string) => readExpression(a).sub(readExpression(b)).isZero();

function sympyAgrees(id: string, network: NetworkInput, ours: { vth: string | null; rth: string | null; isc: string | null }): void {
  const out = execFileSync("/usr/bin/python3", [SCRIPT], { input: JSON.stringify([{ id, network, ours }]), encoding: "utf8", timeout: 120_000 });
  const [report] = JSON.parse(out) as Array<{ checks: Record<string, string> }>;
  expect(report.checks).toEqual({ vth: "ok", rth: "ok", isc: "ok" });
}

const cascode = JSON.parse(readFileSync(`${ROOT}fixtures/cascode-current-sink.json`, "utf8")) as NetworkInput;

// Emitter follower with an emitter resistor: Rout = RE || (r_pi + Rs)/(beta + 1).
const follower: NetworkInput = {
  port: { plus: "e", minus: "0" },
  elements: [
    { name: "Sig", kind: "voltage", nodes: ["s", "0"], value: "Vs" },
    { name: "Rsrc", kind: "resistor", nodes: ["s", "b"], value: "Rs" },
    { name: "Rpi", kind: "resistor", nodes: ["b", "e"], value: "r_pi" },
    { name: "Gain", kind: "current", nodes: ["0", "e"], value: "beta * through(Rpi)" },
    { name: "Remit", kind: "resistor", nodes: ["e", "0"], value: "RE" },
  ],
};

// Two-stage amplifier small-signal model with Miller compensation Cc across the second stage.
const twoStage: NetworkInput = {
  port: { plus: "out", minus: "0" },
  elements: [
    { name: "Drive", kind: "voltage", nodes: ["in", "0"], value: "Vs" },
    { name: "Stage1", kind: "current", nodes: ["n1", "0"], value: "gm1 * across(in, 0)" },
    { name: "Rout1", kind: "resistor", nodes: ["n1", "0"], value: "R1" },
    { name: "Cpar1", kind: "capacitor", nodes: ["n1", "0"], value: "C1" },
    { name: "Stage2", kind: "current", nodes: ["out", "0"], value: "gm2 * across(n1, 0)" },
    { name: "Rout2", kind: "resistor", nodes: ["out", "0"], value: "R2" },
    { name: "Cload", kind: "capacitor", nodes: ["out", "0"], value: "C2" },
    { name: "Comp", kind: "capacitor", nodes: ["n1", "out"], value: "Cc" },
  ],
};

function exactOf(network: NetworkInput) {
  const r = solveNetwork(network, { steps: false, sensitivities: false, dimensions: false });
  return { vth: r.vth?.infix ?? null, rth: r.rth?.infix ?? null, isc: r.isc?.infix ?? null };
}

describe("approximations within a stated error", { timeout: 120_000 }, () => {
  it("cascode output resistance approaches gm*ro^2 (Razavi, Design of Analog CMOS Integrated Circuits, 2nd ed., from memory)", () => {
    sympyAgrees("cascode", cascode, exactOf(cascode));
    const values = { gm2: "2m", ro1: "50k", ro2: "50k", Vs: "1" };
    const r = solveNetwork(cascode, { values, approximate: { epsilon: 0.05 } });
    const a = r.boundedApproximations!.results.rth!;
    expect(same(a.approximate, "gm2*ro1*ro2")).toBe(true);
    expect(r.rth!.infix).toBe(a.exact); // the exact result is kept
    // The stated error is the one sympy finds between the two forms at the design point.
    const sympyError = askSympy([{ kind: "value", expr: `((${a.exact}) - (${a.approximate}))/(${a.exact})`.replace(/gm2/g, "(2/1000)").replace(/ro1|ro2/g, "50000") }])[0] as string;
    const [p, q] = sympyError.split("/").map(Number);
    expect(a.maxError).toBeCloseTo(Math.abs(p / q), 12);
    expect(a.maxError).toBeLessThanOrEqual(0.05);
    const step = r.steps.find((s) => s.id === "approx-bound.rth")!;
    expect(step.kind).toBe("approximation");
    expect(step.explanation).toMatch(/Largest error actually incurred/);
  });

  it("emitter follower output resistance approaches (r_pi + Rs)/(beta + 1) with the RE term locked in (Sedra and Smith, Microelectronic Circuits, from memory)", () => {
    sympyAgrees("follower", follower, exactOf(follower));
    const values = { Rs: "1k", r_pi: "2.5k", beta: "100", RE: "10k", Vs: "1" };
    const free = solveNetwork(follower, { values, steps: false, approximate: {} }).boundedApproximations!.results.rth!;
    expect(same(free.approximate, "(r_pi + Rs)/beta")).toBe(true);
    const locked = solveNetwork(follower, { values, steps: false, approximate: { keep: ["RE"] } }).boundedApproximations!.results.rth!;
    expect(same(locked.approximate, "(r_pi + Rs)/(beta + 1)")).toBe(true);
    expect(locked.maxError).toBeLessThan(free.maxError);
    // A term locked out is dropped whatever it costs, and the cost is stated.
    const forced = solveNetwork(follower, { values, steps: false, approximate: { drop: ["RE*beta"] } }).boundedApproximations!.results.rth!;
    expect(forced.dropped.denominator).toContain("RE*beta");
    expect(forced.kept.denominator).not.toContain("RE*beta");
    // Kept and dropped together are every term of the exact form, each once.
    const exact = readExpression(forced.exact);
    const names = (terms: { monomial: Record<string, number> }[]) => terms.map((t) => Object.keys(t.monomial).sort().map((v) => (t.monomial[v] === 1 ? v : `${v}^${t.monomial[v]}`)).join("*") || "1").sort();
    expect([...forced.kept.numerator, ...forced.dropped.numerator].sort()).toEqual(names(exact.num.terms()));
    expect([...forced.kept.denominator, ...forced.dropped.denominator].sort()).toEqual(names(exact.den.terms()));
    expect(forced.maxError).toBeGreaterThan(0.05);
  });

  it("two-stage amplifier with Miller compensation: the dominant pole approaches 1/(gm2*R1*R2*Cc) over the band (common textbook treatment, from memory)", () => {
    sympyAgrees("two-stage", twoStage, exactOf(twoStage));
    const values = { gm1: "1m", gm2: "5m", R1: "100k", R2: "100k", C1: "0.2p", C2: "2p", Cc: "1p", Vs: "1" };
    const r = solveNetwork(twoStage, { values, steps: false, approximate: { epsilon: 0.05, band: [1, 30e3], tolerance: 0.2 } });
    const a = r.boundedApproximations!.results.vth!;
    expect(a.over).toBe("band and box");
    expect(a.maxError).toBeLessThanOrEqual(0.05);
    const d = readExpression(a.approximate).den;
    expect(d.degreeIn("s")).toBe(1);
    const pole = RationalFunction.fromPoly(d.coefficientIn("s", 0)).div(RationalFunction.fromPoly(d.coefficientIn("s", 1)));
    expect(same(pole.toInfix(), "1/(gm2*R1*R2*Cc)")).toBe(true);
  });

  it("asks for the design point and for a band where one is needed", () => {
    const missing = solveNetwork(cascode, { values: { gm2: "2m" }, steps: false, approximate: {} });
    expect(missing.diagnostics.find((d) => d.code === "option-invalid")?.message).toMatch(/ro1, ro2/);
    const noBand = solveNetwork(twoStage, { values: { gm1: "1m", gm2: "5m", R1: "100k", R2: "100k", C1: "0.2p", C2: "2p", Cc: "1p", Vs: "1" }, steps: false, approximate: {} });
    expect(noBand.statements.map((s) => s.code)).toContain("approximation-needs-band");
  });
});
