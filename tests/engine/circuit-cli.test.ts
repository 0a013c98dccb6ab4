// The command line: output keys and exit codes 0 (solved), 2 (invalid input), 1 (otherwise).

import { spawnSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";

const ROOT = new URL("../../", import.meta.url).pathname;

/** What `npm run -s solve -- ...` runs: the startup snapshot, rebuilt when a source is newer. */
function solve(...args: string[]) {
  const r = spawnSync("sh", ["scripts/solve.sh", ...args], { cwd: ROOT, encoding: "utf8" });
  return { code: r.status, out: r.stdout, err: r.stderr };
}

function solveFromSource(...args: string[]) {
  return spawnSync(process.execPath, ["--import", "tsx", "scripts/solve.ts", ...args], { cwd: ROOT, encoding: "utf8" }).stdout;
}

describe("solve CLI", { timeout: 120_000 }, () => {
  it("prints one JSON object with the documented keys and exits 0 when solved", () => {
    const r = solve("fixtures/sensor-buffer.pfn", "--limit", "A=inf", "--set", "Ro=4.7k,A=1e5,Vs=1", "--float");
    expect(r.code).toBe(0);
    const o = JSON.parse(r.out);
    for (const key of ["vth", "isc", "rth", "rthFromVocIsc", "agree", "compact", "tex", "limits", "values", "steps", "diagnostics"]) expect(o).toHaveProperty(key);
    expect(o.rth).toBe("Ro/(A + 1)");
    expect(o.agree).toBe(true);
    expect(o.limits["A=inf"].rth.leading).toBe("Ro/A");
    expect(o.values.exact.rth).toBe("4700/100001");
    expect(o.values.float.rth).toBeCloseTo(0.0469995, 6);
    expect(o.steps[0].id).toBe("port");
    expect(o.diagnostics).toEqual([]);
  });

  it("exits 0 for a degenerate port, with null where a result does not exist", () => {
    const r = solve("fixtures/current-loop-transmitter.json", "--no-steps");
    expect(r.code).toBe(0);
    const o = JSON.parse(r.out);
    expect(o.vth).toBeNull();
    expect(o.rth).toBeNull();
    expect(o.isc).toBe("Iloop");
    expect(o.steps).toEqual([]);
  });

  it("exits 2 for invalid input and prints the diagnostics", () => {
    const dir = mkdtempSync(join(tmpdir(), "portfold-cli-"));
    const file = join(dir, "bad.pfn");
    writeFileSync(file, "port a 0\nRload resistor a 0 = R\nSupplyA voltage a 0 = Va\nSupplyB voltage a 0 = Vb\n");
    const r = solve(file);
    expect(r.code).toBe(2);
    const o = JSON.parse(r.out);
    expect(o.diagnostics.map((d: { code: string }) => d.code)).toContain("voltage-source-loop");
    expect(o.vth).toBeNull();
  });

  it("exits 2 for a file in the earlier format, naming the word that replaced the old one", () => {
    const dir = mkdtempSync(join(tmpdir(), "portfold-cli-"));
    const file = join(dir, "earlier.json");
    writeFileSync(file, JSON.stringify({ port: { plus: "o", minus: "0" }, elements: [{ name: "Amp", kind: "vcvs", nodes: ["o", "0"], control: { nodes: ["i", "0"] }, value: "A" }] }));
    const r = solve(file);
    expect(r.code).toBe(2);
    const o = JSON.parse(r.out);
    expect(o.diagnostics[0]).toMatchObject({ code: "format-renamed", path: ["elements", 0, "kind"] });
    expect(o.diagnostics[0].message).toContain("`vcvs` is now `voltage` with a value such as `A * across(in, out)`");
  });

  it("exits 1 when the file cannot be read or the command is malformed", () => {
    const missing = solve("fixtures/no-such-network.pfn");
    expect(missing.code).toBe(1);
    expect(missing.err).toMatch(/cannot read/);
    const usage = solve("fixtures/sensor-buffer.pfn", "--limit", "A=5");
    expect(usage.code).toBe(1);
    expect(usage.err).toMatch(/SYMBOL=inf or SYMBOL=0/);
  });

  it("the startup snapshot prints exactly what the TypeScript source prints", () => {
    const args = ["fixtures/sensor-buffer.pfn", "--limit", "A=inf", "--set", "Ro=4.7k,A=1e5,Vs=1", "--float"];
    const fromSnapshot = solve(...args);
    expect(fromSnapshot.err).toBe("");
    expect(fromSnapshot.code).toBe(0);
    expect(fromSnapshot.out).toBe(solveFromSource(...args));
    // An option first is the command's, not node's.
    const usage = solve("--no-such-option");
    expect(usage.code).toBe(1);
    expect(usage.err).toMatch(/unknown option --no-such-option/);
  }, 120_000);
});
