// Every diagnostic code has a network that triggers it, with the elements involved and, for the
// text netlist, the line and column. The list is checked against DIAGNOSTIC_CODES, so a new code
// without a case here fails.

import { describe, expect, it } from "vitest";
import { DIAGNOSTIC_CODES, solveNetwork, type Diagnostic, type SolveOptions } from "../../shared/engine";

interface Trigger {
  input: string | object;
  options?: SolveOptions;
  /** Expected fields of the diagnostic with that code. */
  expect?: Partial<Diagnostic>;
  /** Still solves (warnings only). */
  ok?: boolean;
}

const TRIGGERS: Record<keyof typeof DIAGNOSTIC_CODES, Trigger> = {
  "parse-error": {
    input: "port out 0\nRload resister out 0 = RL\n",
    expect: { line: 2, column: 7 },
  },
  "invalid-json": { input: '{ "port": { "plus": "a", "minus": "0" },\n  "elements": [ }', expect: { line: 2, column: 17 } },
  "schema-invalid": {
    input: { port: { plus: "a", minus: "0" }, elements: [{ name: "Res1", kind: "resistor", nodes: ["a"], value: "R" }] },
    expect: { elements: ["Res1"], path: ["elements", 0, "nodes"] },
  },
  "value-syntax": {
    input: "port a 0\nRes1 resistor a 0 = R1 + * 2\n",
    expect: { elements: ["Res1"], line: 2, column: 26 },
  },
  "duplicate-name": {
    input: "port a 0\nRes1 resistor a 0 = Ra\nRes1 resistor a 0 = Rb\n",
    expect: { elements: ["Res1"], line: 2 },
  },
  "empty-network": { input: { port: { plus: "a", minus: "0" }, elements: [] } },
  "port-unknown-node": { input: "port out 0\nRes1 resistor a 0 = R\n", expect: { nodes: ["out"] } },
  "port-same-node": { input: "port a a\nRes1 resistor a 0 = R\n", expect: { nodes: ["a"] } },
  "control-missing-element": {
    input: "port a 0\nRload resistor a 0 = R\nMirror current 0 a = beta * through(Rx)\n",
    expect: { elements: ["Mirror"], line: 3, path: ["elements", 1, "value"] },
  },
  "control-self": { input: "port a 0\nRload resistor a 0 = R\nMirror current 0 a = beta * through(Mirror)\n", expect: { elements: ["Mirror"] } },
  "control-unknown-node": {
    input: "port a 0\nRload resistor a 0 = R\nGm current 0 a = gm * across(b, 0)\n",
    expect: { elements: ["Gm"], nodes: ["b"] },
  },
  "control-nonlinear": {
    input: "port a 0\nRload resistor a 0 = R\nGm current 0 a = k * across(a, 0)^2\n",
    expect: { elements: ["Gm"], line: 3, column: 22, path: ["elements", 1, "value"] },
  },
  "format-renamed": {
    input: { port: { plus: "a", minus: "0" }, elements: [{ name: "Gm", kind: "vccs", nodes: ["a", "0"], control: { nodes: ["a", "0"] }, value: "gm" }] },
    expect: { elements: ["Gm"], path: ["elements", 0, "kind"] },
  },
  "control-unsupported": {
    input: "port o 0\nVs voltage p 0 = V\nRgnd resistor n 0 = R1\nRfb resistor n o = R2\nBuf opamp p n -> o\nMirror current 0 o = beta * through(Buf)\n",
    expect: { elements: ["Mirror", "Buf"] },
  },
  "value-zero": { input: "port a 0\nRes1 resistor a 0 = 0\n", expect: { elements: ["Res1"], line: 2, column: 21 } },
  "floating-node": {
    input: "port a 0\nRes1 resistor a 0 = R1\nRes2 resistor b c = R2\n",
    expect: { nodes: ["b", "c"], elements: ["Res2"] },
  },
  "no-dc-path": {
    input: "port a 0\nVs voltage in 0 = V\nRes1 resistor in a = R1\nCap1 capacitor a b = C1\nRes2 resistor b c = R2\nCap2 capacitor c 0 = C2\n",
    ok: true,
    expect: { nodes: ["b", "c"], elements: ["Cap1", "Cap2"] },
  },
  "voltage-source-loop": {
    input: "port a 0\nSrc1 voltage a 0 = Va\nSrc2 voltage a 0 = Vb\n",
    expect: { elements: ["Src1", "Src2"] },
  },
  "current-source-cutset": {
    input: "port a 0\nRes1 resistor a 0 = R\nFeed1 current 0 b = Ib\nRes2 resistor b c = R2\n",
    expect: { elements: ["Feed1"], nodes: ["b", "c"] },
  },
  "singular-system": {
    input: "port o 0\nVs voltage p 0 = V\nRes1 resistor n 0 = R1\nBuf1 opamp p n -> o\nRL resistor o 0 = RL\n",
  },
  "option-invalid": { input: "port a 0\nRes1 resistor a 0 = R\n", options: { values: { R: "4.7 kilo" } }, ok: false },
  "quantity-conflict": {
    input: "port b 0\nVs voltage a 0 = V\nRes1 resistor a 0 = R\nSrc1x voltage b 0 = R * across(a, 0)\n",
    ok: true,
    expect: { elements: ["Res1", "Src1x"] },
  },
  "dimension-mismatch": { input: "port a 0\nquantity V current\nVs voltage a 0 = V\n", ok: true },
  "cell-unknown": {
    input: "port c 0\nRL resistor c 0 = RL\nDev1 cell bjt-hybrid c=c b=0 e=0\n",
    expect: { elements: ["Dev1"], line: 3, path: ["cells", 0, "cell"] },
  },
  "cell-terminals": {
    input: "port c 0\nRL resistor c 0 = RL\nDev1 cell bjt-hybrid-pi c=c b=0\n",
    expect: { elements: ["Dev1"], line: 3, path: ["cells", 0, "terminals"] },
  },
  "cell-symbols": {
    input: "port c 0\nRL resistor c 0 = RL\nDev1 cell bjt-hybrid-pi c=c b=0 e=0 rename beta:beta1\n",
    expect: { elements: ["Dev1"], line: 3, path: ["cells", 0, "symbols"] },
  },
};

describe("diagnostics", () => {
  it("every code in DIAGNOSTIC_CODES has a trigger here", () => {
    expect(Object.keys(TRIGGERS).sort()).toEqual(Object.keys(DIAGNOSTIC_CODES).sort());
  });

  it.each(Object.entries(TRIGGERS))("%s is raised with what is involved", (code, t) => {
    const r = solveNetwork(t.input as string, t.options);
    const d = r.diagnostics.find((x) => x.code === code);
    expect(d, JSON.stringify(r.diagnostics)).toBeDefined();
    expect(d!.message.length).toBeGreaterThan(10);
    if (t.expect) expect(d).toMatchObject(t.expect);
    expect(r.ok).toBe(t.ok ?? false);
  });

  it("a well-posed network raises no diagnostic at all", () => {
    const r = solveNetwork("port a 0\nVs voltage in 0 = V\nRes1 resistor in a = R1\nRes2 resistor a 0 = R2\n");
    expect(r.diagnostics).toEqual([]);
    expect(r.ok).toBe(true);
  });

  it("a voltage source across the port is a degenerate port, not a loop error", () => {
    const r = solveNetwork("port a 0\nSrc1 voltage a 0 = Va\nRes1 resistor a 0 = R\n");
    expect(r.ok).toBe(true);
    expect(r.statements.map((s) => s.code)).toContain("rth-zero");
  });

  it("a current source alone at the port is a degenerate port, not a cutset error", () => {
    const r = solveNetwork("port a 0\nFeed1 current 0 a = I\n");
    expect(r.ok).toBe(true);
    expect(r.statements.map((s) => s.code)).toContain("rth-infinite");
  });

  it("a unity-gain current-controlled source feeding its own control names the elements and the node it leaves free", () => {
    // KCL at "sense": I(Rsense) − 1·I(Rsense) = 0 holds for any voltage there (common practice: a loop gain of exactly 1).
    const r = solveNetwork("port out 0\nSig voltage in 0 = Vs\nRo resistor in out = R2\nRsense resistor sense 0 = Rs\nMirror current 0 sense = 1 * through(Rsense)\n");
    const d = r.diagnostics.find((x) => x.code === "singular-system");
    expect(d?.elements).toEqual(["Rsense", "Mirror"]);
    expect(d?.nodes).toEqual(["sense"]);
    expect(d?.message).toMatch(/currents of "Rsense", "Mirror" and the voltage of node "sense" can take any value/);
    expect(d?.message).toMatch(/Controlled source "Mirror" = 1 \* through\(Rsense\) is among them/);
    // The same loop with gain 0.9 is well posed.
    expect(solveNetwork("port out 0\nSig voltage in 0 = Vs\nRo resistor in out = R2\nRsense resistor sense 0 = Rs\nMirror current 0 sense = 0.9 * through(Rsense)\n").ok).toBe(true);
  });

  it("a node seen only by op-amp inputs is floating, with the reason", () => {
    const r = solveNetwork("port o 0\nRes1 resistor n o = R\nRes2 resistor n 0 = R\nBuf1 opamp p n -> o\n");
    const d = r.diagnostics.find((x) => x.code === "floating-node");
    expect(d?.nodes).toEqual(["p"]);
    expect(d?.message).toMatch(/op-amp inputs draw no current/);
  });
});
