// The element vocabulary (kinds `voltage` and `current`, controls named in the value): every fixture
// and the demo solve to the same results as they did in the earlier format. The reference file holds
// the results the engine printed for the same networks written in the earlier format, just before the
// change; they are compared here by value at random points, not by printed form.

import { readdirSync, readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { solveNetwork } from "../../shared/engine";
import { demoNetworks } from "../../server/db/demo-data";
import { mulberry32 } from "./circuit-generators";
import { evaluateInfix } from "../support/expressions";

const FIXTURES = new URL("../../fixtures/", import.meta.url).pathname;
const before: Record<string, Record<"vth" | "rth" | "isc", string | null>> = JSON.parse(
  readFileSync(new URL("./reference/results-before-vocabulary.json", import.meta.url), "utf8"),
);

const symbolsOf = (...texts: string[]) => [...new Set(texts.flatMap((t) => t.match(/[A-Za-z_][A-Za-z0-9_]*/g) ?? []))];

function expectSameResults(key: string, input: unknown): void {
  const ours = solveNetwork(input as string, { steps: false, sensitivities: false, dimensions: false });
  const reference = before[key];
  expect(reference, `a reference for ${key}`).toBeDefined();
  const rand = mulberry32(key.length * 7919 + 17);
  for (const r of ["vth", "rth", "isc"] as const) {
    const now = ours[r]?.infix ?? null;
    expect(now === null, `${key}: ${r} exists now exactly when it did before`).toBe(reference[r] === null);
    if (now === null || reference[r] === null) continue;
    for (let trial = 0; trial < 3; trial++) {
      const point = Object.fromEntries(symbolsOf(now, reference[r]!).map((s) => [s, 0.5 + 1.5 * rand()]));
      const a = evaluateInfix(now, point);
      const b = evaluateInfix(reference[r]!, point);
      expect(Math.abs(a - b), `${key} ${r}: ${now} vs ${reference[r]}`).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(b)));
    }
  }
}

describe("results are those of the earlier format", () => {
  const fixtures = readdirSync(FIXTURES).sort();
  it("has a reference for every fixture and demo network", () => {
    for (const f of fixtures) expect(before[`fixtures/${f}`], f).toBeDefined();
    for (const n of demoNetworks) expect(before[`demo/${n.slug}`], n.slug).toBeDefined();
  });
  it.each(fixtures)("fixture %s", (file) => expectSameResults(`fixtures/${file}`, readFileSync(FIXTURES + file, "utf8")));
  it.each(demoNetworks.map((n) => [n.slug, n] as const))("demo network %s", (slug, n) => expectSameResults(`demo/${slug}`, n.circuit));
});

describe("a controlled source in the ledger", () => {
  it("the network as given names each controlled source with its controls", () => {
    const r = solveNetwork("port d 0\nGm1 current d s = gm*across(g, s) + gmb*across(b, s)\nRo1 resistor d s = ro\nRdegen resistor s 0 = RS\nVg voltage g 0 = Vin\nVb voltage b 0 = 0\n");
    const network = r.steps.find((s) => s.kind === "network")!;
    expect(network.explanation).toContain('"Gm1", a voltage-controlled current source, by across(g, s) and across(b, s)');
    expect(network.data.controls).toEqual({ Gm1: ["across(g, s)", "across(b, s)"] });
    const control = r.steps.find((s) => s.id === "vth.control.Gm1")!;
    expect(control.data.equations).toEqual(["v_Gm1_1 = V_g - V_s", "v_Gm1_2 = V_b - V_s"]);
  });

  it("a source with an independent part beside its control keeps the control when sources are zeroed", () => {
    // Common practice: zeroing independent sources leaves dependent sources in place.
    const r = solveNetwork("port o 0\nMix voltage o 0 = Vb + A*across(i, 0)\nDrive current 0 i = Is\nRi resistor i o = R\n");
    const zero = r.steps.find((s) => s.kind === "zeroing")!;
    expect(zero.data).toEqual({ shorted: [], opened: ["Drive"], partly: ["Mix"] });
    expect(r.ok).toBe(true);
  });
});
