// Cross-check against sympy: generated networks covering every element kind, each solved by
// Portfold and by an independent sympy formulation (tests/engine/sympy/port_reference.py);
// the difference of each result must cancel to 0. One python process for the whole batch.

import { execFileSync } from "node:child_process";
import { describe, expect, it } from "vitest";
import { ELEMENT_KINDS, solveNetwork, type ElementKind, type NetworkInput } from "../../shared/engine";
import { generatedCorpus } from "./circuit-generators";

const PYTHON = "/usr/bin/python3";
const SCRIPT = new URL("./sympy/port_reference.py", import.meta.url).pathname;

interface Case {
  id: string;
  network: NetworkInput;
  ours: { vth: string | null; rth: string | null; isc: string | null };
  kinds: ElementKind[];
}

function buildCases(count: number): Case[] {
  const cases: Case[] = [];
  const networks = generatedCorpus(count);
  for (let i = 0; i < count; i++) {
    const network = networks[i];
    const r = solveNetwork(network, { steps: false, sensitivities: false, dimensions: false });
    cases.push({
      id: `net-${i}`,
      network,
      ours: { vth: r.vth?.infix ?? null, rth: r.rth?.infix ?? null, isc: r.isc?.infix ?? null },
      kinds: [...new Set(network.elements.map((e) => e.kind))],
    });
  }
  return cases;
}

// Sources whose value names several controls, one element each: a transistor with body effect and
// a source controlled by a voltage and a current at once.
const MULTI_CONTROL: { id: string; network: NetworkInput }[] = [
  {
    id: "common-gate-body-effect",
    network: {
      port: { plus: "d", minus: "0" },
      elements: [
        { name: "Gm1", kind: "current", nodes: ["d", "s"], value: "gm*across(0, s) + gmb*across(0, s)" },
        { name: "Ro1", kind: "resistor", nodes: ["d", "s"], value: "ro" },
        { name: "Rdegen", kind: "resistor", nodes: ["s", "0"], value: "RS" },
      ],
    },
  },
  {
    id: "mixed-controls",
    network: {
      port: { plus: "o", minus: "0" },
      elements: [
        { name: "Drive", kind: "voltage", nodes: ["i", "0"], value: "Vs" },
        { name: "Rsense", kind: "resistor", nodes: ["i", "x"], value: "R1" },
        { name: "Rload", kind: "resistor", nodes: ["x", "0"], value: "R2" },
        { name: "Mix", kind: "voltage", nodes: ["y", "0"], value: "Vb + A*across(x, 0) - rm*through(Rsense)" },
        { name: "Rout", kind: "resistor", nodes: ["y", "o"], value: "Ro" },
        { name: "Gain", kind: "current", nodes: ["0", "o"], value: "beta*through(Rsense) - k*across(o, 0)" },
      ],
    },
  },
];

function namedCases(): Case[] {
  return MULTI_CONTROL.map(({ id, network }) => {
    const r = solveNetwork(network, { steps: false, sensitivities: false, dimensions: false });
    return { id, network, ours: { vth: r.vth?.infix ?? null, rth: r.rth?.infix ?? null, isc: r.isc?.infix ?? null }, kinds: [...new Set(network.elements.map((e) => e.kind))] };
  });
}

describe("sympy cross-check of generated networks", () => {
  const cases = [...buildCases(66), ...namedCases()];
  const report: { id: string; checks: Record<string, string>; theirs: Record<string, string | null> }[] = JSON.parse(
    execFileSync(PYTHON, [SCRIPT], { input: JSON.stringify(cases), encoding: "utf8", maxBuffer: 64 << 20 }),
  );

  it("covers at least 50 solved networks and every element kind among them", () => {
    const solved = cases.filter((c) => c.ours.vth !== null || c.ours.isc !== null);
    expect(solved.length).toBeGreaterThanOrEqual(50);
    const kinds = new Set(solved.flatMap((c) => c.kinds));
    for (const k of ELEMENT_KINDS) expect(kinds, `kind ${k}`).toContain(k);
    // Controlled sources of every sort: by a voltage, by a current, and by several controls at once.
    const values = solved.flatMap((c) => c.network.elements.flatMap((e) => ("value" in e ? [e.value] : [])));
    expect(values.some((v) => /across\(/.test(v) && !/through\(/.test(v))).toBe(true);
    expect(values.some((v) => /through\(/.test(v) && !/across\(/.test(v))).toBe(true);
    expect(values.some((v) => (v.match(/across\(|through\(/g) ?? []).length > 1)).toBe(true);
  });

  it.each(cases.map((c, i) => [c.id, i] as const))("%s: Vth, Rth, Isc equal sympy's exactly", (_id, i) => {
    const verdict = report[i];
    expect(verdict.id).toBe(cases[i].id);
    expect(verdict.checks, JSON.stringify({ network: cases[i].network, ours: cases[i].ours, theirs: verdict.theirs })).toEqual({ vth: "ok", rth: "ok", isc: "ok" });
  });
});
