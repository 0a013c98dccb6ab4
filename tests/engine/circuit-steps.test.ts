// The ledger: stable ids in a fixed order, deterministic, and its equations really are the system
// (sympy solves the KCL and branch equations written in the steps and must find our Vth).

import { execFileSync } from "node:child_process";
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { solveNetwork, type Step } from "../../shared/engine";

const FIXTURES = new URL("../../fixtures/", import.meta.url).pathname;
const fixture = (name: string) => readFileSync(FIXTURES + name, "utf8");

describe("derivation steps", () => {
  const buffer = solveNetwork(fixture("sensor-buffer.pfn"));

  it("lists the ledger's steps in order, with stable ids", () => {
    expect(buffer.steps.map((s) => s.id)).toEqual([
      "port",
      "network",
      "vth.setup",
      "vth.unknowns",
      "vth.kcl.src",
      "vth.kcl.in",
      "vth.kcl.x",
      "vth.kcl.out",
      "vth.control.Amp",
      "vth.branch.Vsens",
      "vth.branch.Amp",
      "vth.matrix",
      "vth.solution",
      "rth.zeroing",
      "rth.test-source",
      "rth.matrix",
      "rth.solution",
      "isc.short",
      "isc.matrix",
      "isc.solution",
      "check.voc-isc",
      "result.thevenin",
      "result.norton",
    ]);
    const kinds = Object.fromEntries(buffer.steps.map((s) => [s.id, s.kind]));
    expect(kinds["vth.kcl.out"]).toBe("kcl");
    expect(kinds["vth.control.Amp"]).toBe("control");
    expect(kinds["vth.branch.Amp"]).toBe("constraint");
    expect(kinds["rth.zeroing"]).toBe("zeroing");
    expect(kinds["check.voc-isc"]).toBe("cross-check");
  });

  it("is deterministic and every step is filled in", () => {
    const again = solveNetwork(fixture("sensor-buffer.json"));
    expect(again.steps).toEqual(buffer.steps);
    for (const s of buffer.steps) {
      expect(s.title.length).toBeGreaterThan(3);
      expect(s.tex.length).toBeGreaterThan(0);
      const sentences = s.explanation.split(/(?<=[.!?])\s+(?=[A-Z])/);
      expect(sentences.length, s.id).toBeLessThanOrEqual(2);
    }
    expect(new Set(buffer.steps.map((s) => s.id)).size).toBe(buffer.steps.length);
  });

  it("records each KCL contribution, the sources zeroed for Rth and the Voc/Isc agreement", () => {
    const kclOut = buffer.steps.find((s) => s.id === "vth.kcl.out")!;
    expect(kclOut.data.contributions).toEqual([{ element: "Rout", current: "(V_out - V_x)/Ro" }]);
    const zero = buffer.steps.find((s) => s.id === "rth.zeroing")!;
    expect(zero.data).toEqual({ shorted: ["Vsens"], opened: [], partly: [] });
    const check = buffer.steps.find((s) => s.id === "check.voc-isc")!;
    expect(check.data.agree).toBe(true);
  });

  it("when neither the open nor the shorted port solves, the equivalents claim no Rth at all", () => {
    // A unity-gain current loop leaves node "sense" free with the port open and shorted alike (common practice).
    const r = solveNetwork("port out 0\nSig voltage in 0 = Vs\nRo resistor in out = R2\nRsense resistor sense 0 = Rs\nMirror current 0 sense = 1 * through(Rsense)\n");
    for (const id of ["result.thevenin", "result.norton"]) {
      const step = r.steps.find((s) => s.id === id)!;
      expect(step.tex, id).toBe("\\text{no unique solution}");
      expect(step.explanation, id).toMatch(/Neither the open nor the shorted port has a unique solution/);
    }
  });

  it("a degenerate port says so in its equivalents", () => {
    const tia = solveNetwork(fixture("photodiode-tia.pfn"));
    const norton = tia.steps.find((s) => s.id === "result.norton")!;
    expect(norton.data.exists).toBe(false);
    expect(norton.explanation).toMatch(/no Norton form/);
    const loop = solveNetwork(fixture("current-loop-transmitter.pfn"));
    expect(loop.steps.find((s) => s.id === "result.thevenin")!.explanation).toMatch(/no Thevenin form/);
  });

  it("the KCL and branch equations of the ledger, solved by sympy, give Vth", () => {
    const files = ["sensor-buffer.pfn", "audio-line-driver.pfn", "thermistor-bridge.pfn", "emitter-follower.pfn", "shunt-monitor.pfn", "rc-antialias.pfn", "photodiode-tia.pfn"];
    const cases = files.map((f) => {
      const r = solveNetwork(fixture(f));
      const eq = (s: Step) => s.data.equation as string;
      const unknowns = (r.steps.find((s) => s.id === "vth.unknowns")!.data.unknowns as { name: string }[]).map((u) => u.name);
      const port = r.network!.port;
      const v = (n: string) => (n === r.network!.ground ? "0" : `V_${n}`);
      return {
        id: f,
        unknowns,
        equations: r.steps.filter((s) => s.kind === "kcl" || (s.id.startsWith("vth.branch."))).map(eq),
        target: `${v(port.plus)} - ${v(port.minus)}`,
        vth: r.vth!.infix,
      };
    });
    const out: { id: string; verdict: string }[] = JSON.parse(
      execFileSync("/usr/bin/python3", [new URL("./sympy/ledger_check.py", import.meta.url).pathname], { input: JSON.stringify(cases), encoding: "utf8" }),
    );
    expect(out).toEqual(files.map((id) => ({ id, verdict: "ok" })));
  });
});
