// Connectivity read from a drawing: the conventions of schematic drawing (IEEE 315 / IEC 60617,
// common practice) are that a wire joins everything at its ends and at a T joint, that two wires
// crossing without a junction dot are not joined, that one node label name is one node wherever it
// stands, and that every ground symbol is the one reference node.
import { describe, expect, it } from "vitest";
import { extractConnectivity, networkOfDrawing } from "@/features/canvas/model/connectivity";
import { EMPTY_DRAWING, type Drawing, type Part } from "@/features/canvas/model/drawing";
import { addGround, addLabel, addWire, setPort } from "@/features/canvas/model/edit";
import { junctionsOf } from "@/features/canvas/model/junctions";
import type { Element } from "@/lib/engine-netlist";
import { parseValue } from "../../shared/engine/algebra/index";
import { solveNetwork } from "../../shared/engine/index";

const resistor = (name: string, value = name): Element => ({ name, kind: "resistor", nodes: ["0", "0"], value });
const part = (element: Element, at: [number, number], turn: 0 | 1 | 2 | 3 = 0): Part => ({ element, at, turn, mirror: false });
const nodesOf = (d: Drawing, previous?: Parameters<typeof extractConnectivity>[2]) =>
  Object.fromEntries(extractConnectivity(d, "0", previous).elements.map((e) => [e.name, e.kind === "opamp" ? [...e.inputs, e.output] : e.nodes]));

describe("wires merge nodes", () => {
  it("joins the pins at the two ends of a wire and leaves a loose pin on its own node", () => {
    // Ra spans x -3..3, Rb spans x 7..13, both on y = 0.
    let d: Drawing = { ...EMPTY_DRAWING, parts: [part(resistor("Ra"), [0, 0]), part(resistor("Rb"), [10, 0])] };
    d = addWire(d, [3, 0], [7, 0]);
    const n = nodesOf(d);
    expect(n.Ra[1]).toBe(n.Rb[0]);
    expect(new Set([n.Ra[0], n.Ra[1], n.Rb[1]]).size).toBe(3);
  });

  it("joins a pin that sits on the inside of a wire (a T joint) and draws a junction dot there", () => {
    let d: Drawing = { ...EMPTY_DRAWING, parts: [part(resistor("Ra"), [0, 0]), part(resistor("Rb"), [10, 0]), part(resistor("Rc"), [5, 3], 1)] };
    d = addWire(d, [3, 0], [7, 0]); // Rc's first pin is at (5, 0), inside this wire
    const n = nodesOf(d);
    expect(n.Rc[0]).toBe(n.Ra[1]);
    expect(n.Rc[0]).toBe(n.Rb[0]);
    expect(junctionsOf(d)).toEqual([[5, 0]]);
  });

  it("does not join two wires that cross without a common point", () => {
    let d: Drawing = { ...EMPTY_DRAWING, parts: [part(resistor("Ra"), [0, 0]), part(resistor("Rb"), [10, 0]), part(resistor("Rc"), [5, -6], 1), part(resistor("Rd"), [5, 6], 1)] };
    d = addWire(d, [3, 0], [7, 0]); // Ra to Rb, horizontal through (5, 0)
    d = addWire(d, [5, -3], [5, 3]); // Rc to Rd, vertical through (5, 0)
    const n = nodesOf(d);
    expect(n.Ra[1]).toBe(n.Rb[0]);
    expect(n.Rc[1]).toBe(n.Rd[0]);
    expect(n.Ra[1]).not.toBe(n.Rc[1]);
    expect(junctionsOf(d)).toEqual([]);
  });

  it("joins wires chained end to end through corners", () => {
    let d: Drawing = { ...EMPTY_DRAWING, parts: [part(resistor("Ra"), [0, 0]), part(resistor("Rb"), [10, 8])] };
    d = addWire(d, [3, 0], [7, 8]); // an L: across, then down
    expect(d.wires).toHaveLength(2);
    const n = nodesOf(d);
    expect(n.Ra[1]).toBe(n.Rb[0]);
  });
});

describe("labels and ground name nodes", () => {
  it("names a node by its label and joins two places that carry the same label", () => {
    let d: Drawing = { ...EMPTY_DRAWING, parts: [part(resistor("Ra"), [0, 0]), part(resistor("Rb"), [20, 0])] };
    d = addLabel(d, [3, 0], "mid");
    d = addLabel(d, [17, 0], "mid");
    const n = nodesOf(d);
    expect(n.Ra[1]).toBe("mid");
    expect(n.Rb[0]).toBe("mid");
  });

  it("makes every ground symbol the ground node 0, joined even without a wire between them", () => {
    let d: Drawing = { ...EMPTY_DRAWING, parts: [part(resistor("Ra"), [0, 0]), part(resistor("Rb"), [20, 0])] };
    d = addGround(d, [-3, 0]);
    d = addGround(d, [23, 0]);
    const n = nodesOf(d);
    expect(n.Ra[0]).toBe("0");
    expect(n.Rb[1]).toBe("0");
  });

  it("reports one node carrying two names, and the parts on it", () => {
    let d: Drawing = { ...EMPTY_DRAWING, parts: [part(resistor("Ra"), [0, 0]), part(resistor("Rb"), [10, 0])] };
    d = addWire(d, [3, 0], [7, 0]);
    d = addLabel(addLabel(d, [3, 0], "x"), [7, 0], "y");
    const x = extractConnectivity(d, "0");
    expect(x.diagnostics.map((g) => g.code)).toContain("node-two-names");
    expect(x.diagnostics[0].parts.sort()).toEqual(["Ra", "Rb"]);
  });

  it("keeps the netlist's name for an unlabelled node when the drawing changes elsewhere", () => {
    let d: Drawing = { ...EMPTY_DRAWING, parts: [part(resistor("Ra"), [0, 0]), part(resistor("Rb"), [10, 0])] };
    d = addWire(d, [3, 0], [7, 0]);
    const previous = { ground: "0", port: { plus: "mid", minus: "0" }, elements: [{ ...resistor("Ra"), nodes: ["a", "mid"] as [string, string] }, { ...resistor("Rb"), nodes: ["mid", "b"] as [string, string] }] };
    const n = nodesOf(d, previous);
    expect(n.Ra).toEqual(["a", "mid"]);
    expect(n.Rb).toEqual(["mid", "b"]);
  });
});

describe("a drawn network solves to the textbook result", () => {
  // The finite-gain voltage follower: Rout = Ro/(1 + A) (Sedra & Smith, Microelectronic Circuits, from memory).
  it("gives Rth = R0/(1 + mu) for the follower drawn with wires, labels, ground and a port", () => {
    const vs: Element = { name: "Vs", kind: "voltage", nodes: ["0", "0"], value: "Vs" };
    const amp: Element = { name: "Amp", kind: "voltage", nodes: ["0", "0"], value: "mu * across(in, out)" };
    let d: Drawing = {
      ...EMPTY_DRAWING,
      // Vs vertical at x = 0 (+ at the top), Amp vertical at x = 10, R0 horizontal from (10, -3) to the right.
      parts: [part(vs, [0, 0], 1), part(amp, [10, 0], 1), part(resistor("R0"), [16, -3])],
    };
    d = addLabel(d, [0, -3], "in");
    d = addGround(addGround(d, [0, 3]), [10, 3]);
    d = addWire(d, [10, -3], [13, -3]);
    d = addWire(d, [19, -3], [24, -3]);
    d = addLabel(d, [24, -3], "out");
    d = setPort(d, [24, -3], [10, 3]);
    // The port's − terminal needs the ground node: (10, 3) carries a ground symbol.
    const base = { ground: "0", port: { plus: "out", minus: "0" }, elements: [] };
    const { network, extraction } = networkOfDrawing(d, base);
    expect(extraction.port).toEqual({ plus: "out", minus: "0" });
    const result = solveNetwork(network);
    expect(result.ok).toBe(true);
    expect(parseValue(result.rth!.infix).equals(parseValue("R0/(1 + mu)"))).toBe(true);
  });
});
