// The drawing and the netlist are one model: a drawing made from a netlist reads back as that
// netlist (same elements on the same nodes, same port), edits in the text reach the drawing, and
// the stored layout travels through the engine's JSON reader unchanged.
import { readdirSync, readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { extractConnectivity } from "@/features/canvas/model/connectivity";
import { readLayout, toLayout } from "@/features/canvas/model/drawing";
import { drawingFor, layoutFor, syncDrawing } from "@/features/canvas/model/sync";
import { parseNetlistText, printNetlistText, validateNetworkJson, type EngineNetwork } from "@/lib/engine-netlist";
import { parseValue } from "../../shared/engine/algebra/index";
import { solveNetwork } from "../../shared/engine/index";
import { mulberry32, randomNetwork } from "../engine/circuit-generators";

const FOLLOWER = `ground 0
port out 0
Vs voltage in 0 = Vs
Amp voltage x 0 = mu * across(in, out)
Res0 resistor x out = R0
`;

const read = (text: string) => {
  const parsed = parseNetlistText(text);
  if (!parsed.network) throw new Error(parsed.diagnostics.map((d) => d.message).join("; "));
  return parsed.network;
};

// Node names of a network up to renaming: the partition of element pins into nodes, ground marked.
function shape(network: EngineNetwork, elements = network.elements) {
  const nodes = elements.map((e) => (e.kind === "opamp" ? [...e.inputs, e.output] : [...e.nodes]));
  return nodes.map((list) => list.map((n) => (n === network.ground ? "ground" : n)));
}

function readsBack(network: EngineNetwork, layout: unknown) {
  const drawing = drawingFor(network, layout);
  const x = extractConnectivity(drawing, network.ground, network);
  expect(shape(network, x.elements)).toEqual(shape(network));
  expect(x.port).toEqual(network.port);
  return drawing;
}

describe("a netlist drawn automatically reads back as the same netlist", () => {
  const fixtures = readdirSync("fixtures").filter((f) => f.endsWith(".pfn"));
  it.each(fixtures)("%s", (file) => {
    const network = read(readFileSync(`fixtures/${file}`, "utf8"));
    const drawing = readsBack(network, undefined);
    // Syncing an in-step drawing changes nothing.
    expect(toLayout(syncDrawing(drawing, network))).toEqual(toLayout(drawing));
  });

  it("for 60 generated networks of every element kind", () => {
    const rand = mulberry32(8);
    for (let i = 0; i < 60; i += 1) {
      const input = randomNetwork(rand);
      const network = validateNetworkJson(input).network!;
      readsBack(network, undefined);
    }
  });
});

describe("text edits reach the drawing", () => {
  it("places an element added in the text, on its nodes, and keeps the other parts where they were", () => {
    const before = read(FOLLOWER);
    const layout = layoutFor(before, undefined);
    const after = read(`${FOLLOWER}Load resistor out 0 = RL\n`);
    const drawing = readsBack(after, layout);
    const old = readLayout(layout, before.elements)!;
    for (const p of old.parts) expect(drawing.parts.find((q) => q.element.name === p.element.name)!.at).toEqual(p.at);
    expect(drawing.parts.map((p) => p.element.name)).toContain("Load");
  });

  it("moves a pin to another node when the text says so", () => {
    const before = read(FOLLOWER);
    const layout = layoutFor(before, undefined);
    readsBack(read(FOLLOWER.replace("Res0 resistor x out", "Res0 resistor in out")), layout);
    readsBack(read(FOLLOWER.replace("port out 0", "port x 0")), layout);
  });

  it("drops a part deleted in the text", () => {
    const layout = layoutFor(read(FOLLOWER), undefined);
    const drawing = readsBack(read(FOLLOWER.replace("Res0 resistor x out = R0\n", "Rb resistor x out = R0\n")), layout);
    expect(drawing.parts.map((p) => p.element.name)).toEqual(["Vs", "Amp", "Rb"]);
  });
});

describe("the layout member of our JSON", () => {
  it("survives the engine's JSON reader unchanged and the drawing still solves to R0/(1 + mu)", () => {
    // Finite-gain follower, Rout = Ro/(1 + A) (Sedra & Smith, Microelectronic Circuits, from memory).
    const network = read(FOLLOWER);
    const layout = layoutFor(network, undefined);
    const exported = JSON.stringify({ ...network, layout });
    const imported = validateNetworkJson(JSON.parse(exported));
    expect(imported.diagnostics).toEqual([]);
    expect(imported.network!.layout).toEqual(layout);
    const x = extractConnectivity(drawingFor(imported.network!, imported.network!.layout), "0", imported.network!);
    const solved = solveNetwork({ ...network, elements: x.elements, port: x.port! });
    expect(parseValue(solved.rth!.infix).equals(parseValue("R0/(1 + mu)"))).toBe(true);
  });

  it("is not part of the text netlist (the text form drops it)", () => {
    const network = read(FOLLOWER);
    const text = printNetlistText({ ...network, layout: layoutFor(network, undefined) });
    expect(parseNetlistText(text).network!.layout).toBeUndefined();
  });

  it("is refused when it is not an object", () => {
    const bad = validateNetworkJson({ ...read(FOLLOWER), layout: [1, 2] });
    expect(bad.network).toBeNull();
  });
});
