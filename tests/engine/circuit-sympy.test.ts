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

describe("sympy cross-check of generated networks", () => {
  const cases = buildCases(66);
  const report: { id: string; checks: Record<string, string>; theirs: Record<string, string | null> }[] = JSON.parse(
    execFileSync(PYTHON, [SCRIPT], { input: JSON.stringify(cases), encoding: "utf8", maxBuffer: 64 << 20 }),
  );

  it("covers at least 50 solved networks and every element kind among them", () => {
    const solved = cases.filter((c) => c.ours.vth !== null || c.ours.isc !== null);
    expect(solved.length).toBeGreaterThanOrEqual(50);
    const kinds = new Set(solved.flatMap((c) => c.kinds));
    for (const k of ELEMENT_KINDS) expect(kinds, `kind ${k}`).toContain(k);
  });

  it.each(cases.map((c, i) => [c.id, i] as const))("%s: Vth, Rth, Isc equal sympy's exactly", (_id, i) => {
    const verdict = report[i];
    expect(verdict.id).toBe(cases[i].id);
    expect(verdict.checks, JSON.stringify({ network: cases[i].network, ours: cases[i].ours, theirs: verdict.theirs })).toEqual({ vth: "ok", rth: "ok", isc: "ok" });
  });
});
