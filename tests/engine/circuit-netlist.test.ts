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
Vin voltage in gnd = Vs
Rs resistor in a = 4.7k
Gp conductance a gnd = G1
Cf capacitor a gnd = 100n
Lb inductor a b = L1
Ib current gnd b = I0
Amp voltage x gnd = mu * across(in, out)
Ro resistor x out = R0
Gm1 current out gnd = across(a, gnd) * gm
Sense voltage y gnd = (R1 + R2) * through(Ro)
Ry resistor y out = Ry
Mirror current a b = -beta * through(Vin)
Body current b gnd = gm2*across(a, b) + gmb*across(gnd, b)
Buf opamp b y -> z
Rz resistor z out = Rz
`);
    expect(p.diagnostics).toEqual([]);
    const n = p.network!;
    expect(n.ground).toBe("gnd");
    expect(n.port).toEqual({ plus: "out", minus: "gnd" });
    expect(n.quantities).toEqual({ mu: "dimensionless" });
    const byName = Object.fromEntries(n.elements.map((e) => [e.name, e]));
    expect(byName.Rs).toEqual({ name: "Rs", kind: "resistor", nodes: ["in", "a"], value: "4.7k" });
    expect(byName.Amp).toEqual({ name: "Amp", kind: "voltage", nodes: ["x", "gnd"], value: "mu * across(in, out)" });
    expect(byName.Gm1).toEqual({ name: "Gm1", kind: "current", nodes: ["out", "gnd"], value: "across(a, gnd) * gm" });
    expect(byName.Sense).toEqual({ name: "Sense", kind: "voltage", nodes: ["y", "gnd"], value: "(R1 + R2) * through(Ro)" });
    expect(byName.Mirror).toEqual({ name: "Mirror", kind: "current", nodes: ["a", "b"], value: "-beta * through(Vin)" });
    expect(byName.Body).toEqual({ name: "Body", kind: "current", nodes: ["b", "gnd"], value: "gm2*across(a, b) + gmb*across(gnd, b)" });
    expect(byName.Buf).toEqual({ name: "Buf", kind: "opamp", inputs: ["b", "y"], output: "z" });
    expect(solveNetwork(n).ok).toBe(true);
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
    const json = { port: { plus: "o", minus: "0" }, elements: [{ name: "A", kind: "voltage", nodes: ["o", "0"], value: "(k1 + k2) * across(i, 0)" }, { name: "Ri", kind: "resistor", nodes: ["i", "0"], value: "R" }] };
    const fromJson = parseNetwork(JSON.stringify(json));
    const fromText = parseNetwork(printNetlistText(fromJson.network!));
    expect(fromJson.format).toBe("json");
    expect(fromText.format).toBe("text");
    expect(fromText.network).toEqual(fromJson.network);
    expect(printNetlistText(fromJson.network!)).toContain("A voltage o 0 = (k1 + k2) * across(i, 0)");
  });

  it.each([
    ["unknown kind", "port a 0\nRload resister a 0 = R", 2, 7, /unknown element kind "resister"/],
    ["missing value", "port a 0\nRload resistor a 0", 2, 19, /missing "= <value>"/],
    ["extra node", "port a 0\nRload resistor a 0 b = R", 2, 20, /unexpected "b"/],
    ["bad op-amp", "port a 0\nBuf opamp p n o", 2, 15, /-> <output>/],
    ["control in a passive", "port a 0\nRload resistor a 0 = 2 * across(a, 0)", 2, 26, /belongs in the value of a voltage or current source/],
    ["an earlier kind word (vcvs)", "port a 0\nAmp vcvs a 0 = mu * across(b, 0)", 2, 5, /`vcvs` is now `voltage` with a value such as `A \* across\(in, out\)`/],
    ["an earlier kind word (cccs)", "port a 0\nMirror cccs a 0 = beta * through(Rb)", 2, 8, /`cccs` is now `current`/],
    ["an earlier kind word (vsource)", "port a 0\nDrive vsource a 0 = Vs", 2, 7, /`vsource` is now `voltage`/],
    ["the earlier cell option include", "port c 0\nRL resistor c 0 = RL\nQbias cell bjt-hybrid-pi c=c b=0 e=0 include ro", 3, 38, /`include` is now `with`/],
    ["second port", "port a 0\nport b 0\nRload resistor a b = R", 2, 1, /one port/],
    ["no port", "Rload resistor a 0 = R\n", 2, 1, /names no port/],
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
    const r = parseNetwork("port a 0\nRload resistr a 0 = R\nRtop resistor a 0\n");
    expect(r.diagnostics.map((d) => d.line)).toEqual([2, 3]);
  });

  it("places a value syntax error at its column in the line", () => {
    const r = solveNetwork("port a 0\nAmp voltage a 0 = (mu + ) * across(b, 0)\nRb resistor b 0 = R\n");
    expect(r.diagnostics[0]).toMatchObject({ code: "value-syntax", line: 2, elements: ["Amp"], column: 25 });
  });

  it.each([
    ["a control squared", "k * across(a, 0)^2", /across\(a, 0\) is raised to a power/, 22],
    ["a control in a denominator", "1/through(Rb)", /through\(Rb\) is in a denominator/, 20],
    ["two controls multiplied", "across(a, 0) * across(b, 0)", /are multiplied together/, 18],
  ])("a value not linear in its controls (%s) is refused with line and column", (_what, value, message, column) => {
    const r = solveNetwork(`port a 0\nGm current a 0 = ${value}\nRb resistor b 0 = R\nRab resistor a b = R\n`);
    const d = r.diagnostics.find((x) => x.code === "control-nonlinear");
    expect(d, JSON.stringify(r.diagnostics)).toMatchObject({ line: 2, column, elements: ["Gm"] });
    expect(d!.message).toMatch(message);
    expect(r.ok).toBe(false);
  });

  it("refuses every word of the earlier JSON shape, naming the word that replaced it", () => {
    const r = parseNetwork({
      port: { plus: "a", minus: "0" },
      elements: [
        { name: "Amp", kind: "vcvs", nodes: ["a", "0"], control: { nodes: ["b", "0"] }, value: "A" },
        { name: "Drive", kind: "isource", nodes: ["0", "b"], value: "Is" },
      ],
      cells: [{ name: "Qin", cell: "bjt-hybrid-pi", terminals: { b: "b", c: "a", e: "0" }, include: [] }],
    });
    expect(r.network).toBeNull();
    expect(r.diagnostics.map((d) => [d.code, d.path])).toEqual([
      ["format-renamed", ["elements", 0, "kind"]],
      ["format-renamed", ["elements", 0, "control"]],
      ["format-renamed", ["elements", 1, "kind"]],
      ["format-renamed", ["cells", 0, "include"]],
    ]);
    expect(r.diagnostics[0].message).toBe("elements[0].kind: `vcvs` is now `voltage` with a value such as `A * across(in, out)`");
    expect(r.diagnostics[1].message).toMatch(/the `control` member is gone/);
    expect(r.diagnostics[2].message).toMatch(/`isource` is now `current`/);
    expect(r.diagnostics[3].message).toMatch(/`include` is now `with`/);
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
