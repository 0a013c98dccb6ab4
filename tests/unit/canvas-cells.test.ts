// A cell instance on the drawing is one part: its pins are the cell's terminals, wires decide the
// instance's `terminals`, and the drawing and the netlist keep it as a `cells` entry.
import { describe, expect, it } from "vitest";
import { cellLibrary, cellLocalPins, isCellPart, newCellPart } from "@/features/canvas/model/cell-part";
import { extractConnectivity, networkOfDrawing } from "@/features/canvas/model/connectivity";
import { partPins, readLayout, toLayout } from "@/features/canvas/model/drawing";
import { addPart, addWire } from "@/features/canvas/model/edit";
import { drawingFor, syncDrawing } from "@/features/canvas/model/sync";
import { BUILT_IN_CELLS, parseNetlistText, printNetlistText, validateNetworkJson, type CellDefinition, type EngineNetwork } from "@/lib/engine-netlist";
import { solveNetwork } from "../../shared/engine/index";
import { evaluateInfix } from "../support/expressions";

// A sensor amplifier's gain stage (our scenario): the sensor drives the gate, RD loads the drain.
// The terminals are listed out of the cell's own order on purpose.
const CS_STAGE = `ground 0
port out 0
Vsense voltage in 0 = Vs
RD resistor out 0 = RD
Dev1 cell mosfet d=out g=in s=0 b=0 rename gm:gm1
`;

const read = (text: string): EngineNetwork => {
  const parsed = parseNetlistText(text);
  if (!parsed.network) throw new Error(parsed.diagnostics.map((d) => d.message).join("; "));
  return parsed.network;
};

const at = evaluateInfix;

describe("a cell instance on the drawing", () => {
  it("is one part with a pin per terminal, in the cell's terminal order", () => {
    const network = read(CS_STAGE);
    const drawing = drawingFor(network, undefined);
    const cellParts = drawing.parts.filter((p) => isCellPart(p.element));
    expect(cellParts).toHaveLength(1);
    const part = cellParts[0].element;
    if (!isCellPart(part)) throw new Error("not a cell part");
    expect(part.name).toBe("Dev1");
    expect(part.pins).toEqual(BUILT_IN_CELLS.get("mosfet")!.terminals);
    expect(partPins(cellParts[0])).toHaveLength(4);
    // Pins on distinct grid points: two on each side of the box.
    expect(new Set(cellLocalPins(4).map((p) => p.join(","))).size).toBe(4);
    expect(cellLocalPins(3).filter(([x]) => x < 0)).toHaveLength(2);
  });

  it("reads back from the drawing as the same cells entry, and the text prints the same instance", () => {
    const network = read(CS_STAGE);
    const drawing = drawingFor(network, undefined);
    const x = extractConnectivity(drawing, network.ground, network);
    expect(x.cells).toEqual(network.cells);
    expect(x.elements.map((e) => e.name)).toEqual(["Vsense", "RD"]);
    const back = networkOfDrawing(drawing, network).network;
    expect(read(printNetlistText(back)).cells).toEqual(network.cells);
    // Sync twice is sync once.
    expect(syncDrawing(drawing, network)).toEqual(drawing);
  });

  it("keeps its place in the layout, keyed by the instance name, through the engine's JSON reader", () => {
    const network = read(CS_STAGE);
    const drawing = drawingFor(network, undefined);
    const layout = toLayout(drawing);
    expect(layout.parts.map((p) => p.element)).toContain("Dev1");
    const json = validateNetworkJson(JSON.parse(JSON.stringify({ ...network, layout })));
    expect(json.network?.cells).toEqual(network.cells);
    const moved = { ...layout, parts: layout.parts.map((p) => (p.element === "Dev1" ? { ...p, at: [p.at[0] + 20, p.at[1]] as [number, number] } : p)) };
    const again = drawingFor(json.network!, moved);
    const m1 = again.parts.find((p) => p.element.name === "Dev1")!;
    expect(m1.at[0]).toBe(drawing.parts.find((p) => p.element.name === "Dev1")!.at[0] + 20);
    expect(extractConnectivity(again, network.ground, network).cells).toEqual(network.cells);
    expect(readLayout(moved, [])?.parts).toEqual([]);
  });

  it("follows a rename and a rewiring in the text", () => {
    const network = read(CS_STAGE);
    const drawing = drawingFor(network, undefined);
    const renamed = read(CS_STAGE.replace("Dev1 cell mosfet d=out g=in", "Dev2 cell mosfet d=out g=in"));
    const after = syncDrawing(drawing, renamed);
    const m2 = after.parts.find((p) => p.element.name === "Dev2")!;
    expect(m2.at).toEqual(drawing.parts.find((p) => p.element.name === "Dev1")!.at);
    const rewired = read(CS_STAGE.replace("s=0 b=0", "s=0 b=sub").replace("RD resistor out 0 = RD", "RD resistor out 0 = RD\nRsub resistor sub 0 = Rb"));
    expect(extractConnectivity(syncDrawing(after, rewired), rewired.ground, rewired).cells).toEqual(rewired.cells);
  });

  it("placed from the palette, takes the nodes its wires reach; the stage then solves to the textbook gain", () => {
    // Start from the source and the load only; place the cell and wire its pins to their nodes.
    const network = read(CS_STAGE.replace(/^Dev1.*\n/m, ""));
    let drawing = drawingFor(network, undefined);
    const library = cellLibrary();
    const fresh = newCellPart(library.get("mosfet")!, "Dev1", network.ground);
    drawing = addPart(drawing, fresh, [40, -20], 0);
    const pins = partPins(drawing.parts[drawing.parts.length - 1]);
    const x0 = extractConnectivity(drawing, network.ground, network);
    const pinOf = (node: string) => {
      const i = drawing.parts.findIndex((p) => p.element.name === (node === "in" ? "Vsense" : "RD"));
      return partPins(drawing.parts[i])[x0.pinNodes[i].indexOf(node)];
    };
    const ground = drawing.grounds[0] ?? pinOf("0");
    const [g, d, s, b] = pins;
    drawing = addWire(drawing, g, pinOf("in"));
    drawing = addWire(drawing, d, pinOf("out"));
    drawing = { ...drawing, grounds: [...drawing.grounds, s, b] };
    void ground;
    const back = networkOfDrawing(drawing, network).network;
    expect(back.cells).toEqual([{ name: "Dev1", cell: "mosfet", terminals: { g: "in", d: "out", s: "0", b: "0" } }]);

    // Common-source stage: Av = −gm·(RD ‖ ro), Rout = RD ‖ ro
    // (Razavi, Design of Analog CMOS Integrated Circuits, 2nd ed., ch. 3; from memory).
    const result = solveNetwork(back);
    expect(result.diagnostics.filter((d) => d.severity === "error")).toEqual([]);
    const v = { gm: 3e-3, ro: 40e3, RD: 8e3, Vs: 0.02, gmb: 4e-4 };
    const parallel = (v.ro * v.RD) / (v.ro + v.RD);
    expect(at(result.rth!.infix, v) / parallel).toBeCloseTo(1, 12);
    expect(at(result.vth!.infix, v) / (-v.gm * parallel * v.Vs)).toBeCloseTo(1, 12);
  });

  it("lists a team's cell beside the built-in ones and draws its terminals", () => {
    const divider: CellDefinition = {
      id: "bias-divider",
      title: "Bias divider",
      terminals: ["top", "mid", "bottom"],
      symbols: ["Ra", "Rb"],
      elements: [
        { name: "Ra", kind: "resistor", nodes: ["top", "mid"], value: "Ra" },
        { name: "Rb", kind: "resistor", nodes: ["mid", "bottom"], value: "Rb" },
      ],
    };
    const library = cellLibrary([divider]);
    expect([...library.keys()]).toEqual(["bjt-hybrid-pi", "mosfet", "amplifier", "bias-divider"]);
    const network = read(`ground 0\nport m 0\nVref voltage t 0 = Vr\nbias cell bias-divider bottom=0 top=t mid=m\n`);
    const drawing = drawingFor(network, undefined, library);
    const part = drawing.parts.find((p) => p.element.name === "bias")!.element;
    expect(isCellPart(part) && part.pins).toEqual(["top", "mid", "bottom"]);
    const back = networkOfDrawing(drawing, network).network;
    // A resistive divider: Vth = Vr·Rb/(Ra + Rb), Rth = Ra·Rb/(Ra + Rb) (common practice).
    const result = solveNetwork({ ...back, cellDefinitions: [divider] });
    expect(result.diagnostics.filter((d) => d.severity === "error")).toEqual([]);
    const v = { Vr: 5, Ra: 3, Rb: 7 };
    expect(at(result.vth!.infix, v)).toBeCloseTo((5 * 7) / 10, 12);
    expect(at(result.rth!.infix, v)).toBeCloseTo(21 / 10, 12);
  });
});
