// The Portfold netlist: reading, printing, round trips with the JSON form, and errors that name
// the line and column. Fixtures are checked to be the same network in both forms.

import { readdirSync, readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { NETLIST_EXTENSION, parseNetwork, printNetlistText, solveNetwork, type Network } from "../../shared/engine";
import { mulberry32, randomNetwork } from "./circuit-generators";

const FIXTURES = new URL("../../fixtures/", import.meta.url).pathname;

describe("Portfold netlist", () => {
  it("reads every element kind, controls written as across(...) and through(...)", () => {
    const p = parseNetwork(`# front end
ground gnd
port out gnd   # the output
quantity mu dimensionless
Vin vsource in gnd = Vs
Rs resistor in a = 4.7k
Gp conductance a gnd = G1
Cf capacitor a gnd = 100n
Lb inductor a b = L1
Ib isource gnd b = I0
E1 vcvs x gnd = mu * across(in, out)
Ro resistor x out = R0
G1m vccs out gnd = across(a, gnd) * gm
H1 ccvs y gnd = (R1 + R2) * through(Ro)
Ry resistor y out = Ry
F1 cccs a b = -beta * through(Vin)
U1 opamp b y -> z
Rz resistor z out = Rz
`);
    expect(p.diagnostics).toEqual([]);
    const n = p.network!;
    expect(n.ground).toBe("gnd");
    expect(n.port).toEqual({ plus: "out", minus: "gnd" });
    expect(n.quantities).toEqual({ mu: "dimensionless" });
    const byName = Object.fromEntries(n.elements.map((e) => [e.name, e]));
    expect(byName.Rs).toEqual({ name: "Rs", kind: "resistor", nodes: ["in", "a"], value: "4.7k" });
    expect(byName.E1).toEqual({ name: "E1", kind: "vcvs", nodes: ["x", "gnd"], control: { nodes: ["in", "out"] }, value: "mu" });
    expect(byName.G1m).toMatchObject({ control: { nodes: ["a", "gnd"] }, value: "gm" });
    expect(byName.H1).toMatchObject({ control: { element: "Ro" }, value: "R1 + R2" });
    expect(byName.F1).toMatchObject({ control: { element: "Vin" }, value: "-beta" });
    expect(byName.U1).toEqual({ name: "U1", kind: "opamp", inputs: ["b", "y"], output: "z" });
  });

  it("prints what it reads: text -> network -> text -> network is the identity", () => {
    for (let seed = 1; seed <= 40; seed++) {
      const net = randomNetwork(mulberry32(seed), { numbers: true, reactive: true, force: seed % 5 === 0 ? "opamp" : undefined });
      const normalized: Network = { ground: "0", port: net.port, elements: net.elements };
      const text = printNetlistText(normalized);
      const back = parseNetwork(text);
      expect(back.diagnostics).toEqual([]);
      expect(back.network).toEqual(normalized);
      expect(printNetlistText(back.network!)).toBe(text);
    }
  });

  it("JSON text and the netlist give the same network", () => {
    const json = { port: { plus: "o", minus: "0" }, elements: [{ name: "A", kind: "vcvs", nodes: ["o", "0"], control: { nodes: ["i", "0"] }, value: "k1 + k2" }, { name: "Ri", kind: "resistor", nodes: ["i", "0"], value: "R" }] };
    const fromJson = parseNetwork(JSON.stringify(json));
    const fromText = parseNetwork(printNetlistText(fromJson.network!));
    expect(fromJson.format).toBe("json");
    expect(fromText.format).toBe("text");
    expect(fromText.network).toEqual(fromJson.network);
    expect(printNetlistText(fromJson.network!)).toContain("A vcvs o 0 = (k1 + k2) * across(i, 0)");
  });

  it.each([
    ["unknown kind", "port a 0\nR1 resister a 0 = R", 2, 4, /unknown element kind "resister"/],
    ["missing value", "port a 0\nR1 resistor a 0", 2, 16, /missing "= <value>"/],
    ["extra node", "port a 0\nR1 resistor a 0 b = R", 2, 17, /unexpected "b"/],
    ["bad op-amp", "port a 0\nU1 opamp p n o", 2, 14, /-> <output>/],
    ["control in a passive", "port a 0\nR1 resistor a 0 = 2 * across(a, 0)", 2, 23, /belongs in a vcvs/],
    ["gain that is a sum", "port a 0\nE1 vcvs a 0 = m + k * across(b, 0)", 2, 15, /put it in parentheses/],
    ["no control", "port a 0\nE1 vcvs a 0 = mu", 2, 15, /names its control/],
    ["two controls", "port a 0\nE1 vcvs a 0 = across(a, 0) * across(b, 0)", 2, 30, /exactly one control/],
    ["bad node in across", "port a 0\nE1 vcvs a 0 = mu * across(a, b-c)", 2, 30, /not a valid node name/],
    ["second port", "port a 0\nport b 0\nR1 resistor a b = R", 2, 1, /one port/],
    ["no port", "R1 resistor a 0 = R\n", 2, 1, /names no port/],
    ["unknown quantity", "port a 0\nquantity mu gain", 2, 13, /unknown quantity/],
    ["a line of only a value", "port a 0\n= R", 2, 1, /starts with its name/],
  ])("%s: a parse-error with its line and column", (_what, text, line, column, message) => {
    const r = parseNetwork(text);
    expect(r.network).toBeNull();
    const d = r.diagnostics[0];
    expect(d).toMatchObject({ code: "parse-error", line, column });
    expect(d.message).toMatch(message);
    expect(d.message).toMatch(new RegExp(`^line ${line}, column ${column}:`));
  });

  it("reports every bad line, not just the first", () => {
    const r = parseNetwork("port a 0\nR1 resistr a 0 = R\nR2 resistor a 0\n");
    expect(r.diagnostics.map((d) => d.line)).toEqual([2, 3]);
  });

  it("places a value syntax error at its column in the line", () => {
    const r = solveNetwork("port a 0\nE1 vcvs a 0 = (mu + ) * across(b, 0)\nRb resistor b 0 = R\n");
    expect(r.diagnostics[0]).toMatchObject({ code: "value-syntax", line: 2, elements: ["E1"] });
    expect(r.diagnostics[0].column).toBeGreaterThan(15);
  });

  const fixtures = readdirSync(FIXTURES).filter((f) => f.endsWith(NETLIST_EXTENSION));
  it("has fixtures in both forms", () => {
    expect(NETLIST_EXTENSION).toBe(".pfn");
    expect(fixtures.length).toBeGreaterThanOrEqual(6);
  });
  it.each(fixtures)("fixture %s: the .pfn and the .json are the same network, and it solves", (file) => {
    const text = parseNetwork(readFileSync(FIXTURES + file, "utf8"));
    const json = parseNetwork(readFileSync(FIXTURES + file.replace(/\.pfn$/, ".json"), "utf8"));
    expect(text.diagnostics).toEqual([]);
    expect(json.diagnostics).toEqual([]);
    expect(text.network).toEqual(json.network);
    const r = solveNetwork(text.network!, { steps: false });
    expect(r.ok).toBe(true);
    expect(r.numericCheck?.agree).toBe(true);
  });
});
