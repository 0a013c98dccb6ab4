// The drawing's editing operations (edit.ts) checked against plane geometry and the conventions
// of schematic drawing (common practice): a quarter turn clockwise on a y-down screen sends an
// offset (x, y) to (−y, x), four of them are the identity, a mirror applied twice is the identity,
// and conductors attached to a pin travel with it, so the circuit the drawing stands for is the
// same; a pin joined only through the inside of a wire is left behind, and the circuit changes.
import { describe, expect, it } from "vitest";
import { BUILT_IN_CELLS } from "@/lib/engine-netlist";
import type { Element } from "@/lib/engine-netlist";
import { newCellPart } from "@/features/canvas/model/cell-part";
import { extractConnectivity } from "@/features/canvas/model/connectivity";
import { EMPTY_DRAWING, partPins, type Drawing, type Part } from "@/features/canvas/model/drawing";
import { addGround, addLabel, addPart, addWire, deleteSelection, mirrorSelection, moveSelection, NOTHING, selectAll, setPort, turnSelection, type Selection } from "@/features/canvas/model/edit";

const two = (name: string, kind: "resistor" | "voltage", value: string): Element => ({ name, kind, nodes: ["0", "0"], value });
const part = (element: Element, at: [number, number], turn: 0 | 1 | 2 | 3 = 0, mirror = false): Part => ({ element, at, turn, mirror });
const only = (...parts: string[]): Selection => ({ ...NOTHING, parts });
const pinsOf = (d: Drawing, name: string) => partPins(d.parts.find((p) => p.element.name === name)!);
const read = (d: Drawing) => {
  const x = extractConnectivity(d, "0");
  return { nodes: Object.fromEntries(x.elements.map((e) => [e.name, e.kind === "opamp" ? [...e.inputs, e.output] : [...e.nodes]])), port: x.port, diagnostics: x.diagnostics.map((g) => g.code) };
};

// A sensor front end of our own: the sensor source standing at x = 0 (+ at the top), a series
// resistor lying along y = −3, a load standing at x = 12, both grounds, "out" named, the port across the load.
//   (0,−3)──(3,−3)[Rs](9,−3)──(12,−3) "out"
//   Vs                          Rload
//   (0,3) ⏚                     (12,3) ⏚
function frontEnd(): Drawing {
  let d: Drawing = {
    ...EMPTY_DRAWING,
    parts: [part(two("Vs", "voltage", "Vs"), [0, 0], 1), part(two("Rs", "resistor", "Rs"), [6, -3]), part(two("Rload", "resistor", "RL"), [12, 0], 1)],
  };
  d = addWire(d, [0, -3], [3, -3]);
  d = addWire(d, [9, -3], [12, -3]);
  d = addGround(addGround(d, [0, 3]), [12, 3]);
  d = addLabel(d, [12, -3], "out");
  return setPort(d, [12, -3], [12, 3]);
}

describe("the front-end drawing reads as the circuit it shows", () => {
  it("Vs from n1 to ground, Rs from n1 to out, Rload across the port", () => {
    expect(read(frontEnd())).toEqual({ nodes: { Vs: ["n1", "0"], Rs: ["n1", "out"], Rload: ["out", "0"] }, port: { plus: "out", minus: "0" }, diagnostics: [] });
  });
});

describe("a quarter turn", () => {
  it("sends each pin offset (x, y) from the part's place to (−y, x): clockwise on a y-down screen", () => {
    const d = frontEnd();
    // Rs at (6, −3): offsets (−3, 0) and (3, 0) become (0, −3) and (0, 3).
    expect(pinsOf(turnSelection(d, only("Rs"), 1), "Rs")).toEqual([
      [6, -6],
      [6, 0],
    ]);
    // Back a quarter (Shift+Q) is three forward: (−3, 0) → (0, 3).
    expect(pinsOf(turnSelection(d, only("Rs"), 3), "Rs")).toEqual([
      [6, 0],
      [6, -6],
    ]);
    // An op-amp's offsets are not symmetric: (−3, −1) → (1, −3), (−3, 1) → (−1, −3), (3, 0) → (0, 3).
    const amp: Element = { name: "Buffer", kind: "opamp", inputs: ["0", "0"], output: "0" };
    const withAmp = addPart(EMPTY_DRAWING, amp, [20, 20], 0);
    expect(pinsOf(turnSelection(withAmp, only("Buffer"), 1), "Buffer")).toEqual([
      [21, 17],
      [19, 17],
      [20, 23],
    ]);
  });

  it("four quarter turns, or one forward and one back, return the drawing exactly", () => {
    const d = frontEnd();
    for (const name of ["Vs", "Rs", "Rload"]) {
      let turned = d;
      for (let k = 0; k < 4; k += 1) {
        turned = turnSelection(turned, only(name), 1);
        if (k < 3) expect(turned).not.toEqual(d);
      }
      expect(turned).toEqual(d);
      expect(turnSelection(turnSelection(d, only(name), 1), only(name), 3)).toEqual(d);
    }
    // A four-terminal cell too (its pins are not symmetric about the place).
    const cell = addPart(EMPTY_DRAWING, newCellPart(BUILT_IN_CELLS.get("mosfet")!, "M1", "0"), [5, 5], 0);
    let c = cell;
    for (let k = 0; k < 4; k += 1) c = turnSelection(c, only("M1"), 1);
    expect(c).toEqual(cell);
  });

  it("takes the wire end, node label, ground symbol and port terminals on its pins along, and the circuit is unchanged", () => {
    const d = frontEnd();
    const turned = turnSelection(d, only("Rload"), 1);
    // Rload at (12, 0), offsets (0, −3) and (0, 3) turned once more: (3, 0) and (−3, 0).
    expect(pinsOf(turned, "Rload")).toEqual([
      [15, 0],
      [9, 0],
    ]);
    expect(turned.wires[1]).toEqual([
      [9, -3],
      [15, 0],
    ]);
    expect(turned.wires[0]).toEqual(d.wires[0]);
    expect(turned.labels).toEqual([{ node: "out", at: [15, 0] }]);
    expect(turned.grounds).toEqual([
      [0, 3],
      [9, 0],
    ]);
    expect(turned.port).toEqual({ plus: [15, 0], minus: [9, 0] });
    expect(read(turned)).toEqual(read(d));
  });

  it("leaves behind a pin joined only through the inside of a wire, and the circuit changes", () => {
    // Rtap stands at (6, 3): its first pin (6, 0) lies inside the wire from Ra to Rb (a T joint).
    let d: Drawing = { ...EMPTY_DRAWING, parts: [part(two("Ra", "resistor", "Ra"), [0, 0]), part(two("Rb", "resistor", "Rb"), [12, 0]), part(two("Rtap", "resistor", "Rt"), [6, 3], 1)] };
    d = addWire(d, [3, 0], [9, 0]);
    const before = read(d);
    expect(before.nodes.Rtap[0]).toBe(before.nodes.Ra[1]);
    const turned = turnSelection(d, only("Rtap"), 1);
    expect(turned.wires).toEqual(d.wires);
    const after = read(turned);
    expect(after.nodes.Rtap[0]).not.toBe(after.nodes.Ra[1]);
    expect(after.nodes.Ra[1]).toBe(after.nodes.Rb[0]);
  });
});

describe("a mirror", () => {
  it("applied twice is the identity, on plain and turned parts", () => {
    const d = turnSelection(frontEnd(), only("Rs"), 1);
    for (const s of [only("Vs"), only("Rs"), only("Rload"), only("Vs", "Rs", "Rload")]) {
      const once = mirrorSelection(d, s);
      expect(once).not.toEqual(d);
      expect(mirrorSelection(once, s)).toEqual(d);
    }
  });

  it("flips the part across its own axis before the turn: an op-amp's inputs go to the other side", () => {
    const amp: Element = { name: "Buffer", kind: "opamp", inputs: ["0", "0"], output: "0" };
    const d = addPart(EMPTY_DRAWING, amp, [0, 0], 0);
    expect(pinsOf(mirrorSelection(d, only("Buffer")), "Buffer")).toEqual([
      [3, -1],
      [3, 1],
      [-3, 0],
    ]);
    // Standing (turn 1) the op-amp's axis is vertical: the mirror exchanges top and bottom.
    const standing = turnSelection(d, only("Buffer"), 1);
    expect(pinsOf(mirrorSelection(standing, only("Buffer")), "Buffer")).toEqual([
      [1, 3],
      [-1, 3],
      [0, -3],
    ]);
  });

  it("turns a standing source round in place: its wire and ground stay, so its polarity is reversed", () => {
    const d = frontEnd();
    const flipped = mirrorSelection(d, only("Vs"));
    expect(pinsOf(flipped, "Vs")).toEqual([
      [0, 3],
      [0, -3],
    ]);
    expect(flipped.wires).toEqual(d.wires);
    expect(flipped.grounds).toEqual(d.grounds);
    expect(read(flipped).nodes.Vs).toEqual([...read(d).nodes.Vs].reverse());
    expect(read(flipped).nodes.Rs).toEqual(read(d).nodes.Rs);
  });

  it("mirrors a resistor lying in a straight run of wire without shorting it", () => {
    const r: Element = { name: "Rser", kind: "resistor", nodes: ["a", "b"], value: "R" };
    let d = addPart(EMPTY_DRAWING, r, [6, 0], 0);
    const [p, q] = pinsOf(d, "Rser");
    d = addWire(addWire(d, [p[0] - 3, p[1]], p), q, [q[0] + 3, q[1]]);
    d = addLabel(addLabel(d, [p[0] - 3, p[1]], "left"), [q[0] + 3, q[1]], "right");
    const flipped = mirrorSelection(d, only("Rser"));
    expect(read(flipped).nodes.Rser).toEqual(["right", "left"]);
    expect(read(d).nodes.Rser).toEqual(["left", "right"]);
  });
});

describe("a move", () => {
  it("shifts the part's pins by the step; wire ends on them stretch, the far ends stay, the circuit is unchanged", () => {
    const d = frontEnd();
    const moved = moveSelection(d, only("Rs"), [0, -2]);
    expect(moved.parts.find((p) => p.element.name === "Rs")!.at).toEqual([6, -5]);
    expect(pinsOf(moved, "Rs")).toEqual([
      [3, -5],
      [9, -5],
    ]);
    expect(moved.wires).toEqual([
      [
        [0, -3],
        [3, -5],
      ],
      [
        [9, -5],
        [12, -3],
      ],
    ]);
    expect(moved.parts.filter((p) => p.element.name !== "Rs")).toEqual(d.parts.filter((p) => p.element.name !== "Rs"));
    expect(read(moved)).toEqual(read(d));
    // A step there and the step back is the identity; a zero step changes nothing.
    expect(moveSelection(moved, only("Rs"), [0, 2])).toEqual(d);
    expect(moveSelection(d, only("Rs"), [0, 0])).toBe(d);
  });

  it("moves a multi-selection together: every selected thing by the same step, the rest stays", () => {
    const d = frontEnd();
    const s: Selection = { parts: ["Rs", "Rload"], wires: [1], labels: [0], grounds: [1] };
    const moved = moveSelection(d, s, [5, 2]);
    const shift = ([x, y]: readonly [number, number]) => [x + 5, y + 2];
    expect(pinsOf(moved, "Rs")).toEqual(pinsOf(d, "Rs").map(shift));
    expect(pinsOf(moved, "Rload")).toEqual(pinsOf(d, "Rload").map(shift));
    expect(moved.wires[1]).toEqual(d.wires[1].map(shift));
    expect(moved.labels[0].at).toEqual(shift(d.labels[0].at));
    expect(moved.grounds).toEqual([d.grounds[0], shift(d.grounds[1])]);
    expect(moved.port).toEqual({ plus: shift(d.port!.plus), minus: shift(d.port!.minus) });
    // Vs stays; the wire from it to Rs stretches to Rs's new first pin.
    expect(pinsOf(moved, "Vs")).toEqual(pinsOf(d, "Vs"));
    expect(moved.wires[0]).toEqual([d.wires[0][0], shift(d.wires[0][1])]);
    expect(read(moved)).toEqual(read(d));
  });

  it("moves everything when everything is selected, a port terminal on the inside of a wire too", () => {
    // The − terminal sits inside a ground wire from the source's foot to the load's foot.
    let d = frontEnd();
    d = addWire(d, [0, 3], [12, 3]);
    d = setPort(d, [12, -3], [6, 3]);
    expect(read(d).port).toEqual({ plus: "out", minus: "0" });
    const moved = moveSelection(d, selectAll(d), [4, 4]);
    const shift = ([x, y]: readonly [number, number]) => [x + 4, y + 4];
    expect(moved.wires).toEqual(d.wires.map((w) => w.map(shift)));
    expect(moved.port).toEqual({ plus: shift(d.port!.plus), minus: shift(d.port!.minus) });
    expect(read(moved)).toEqual(read(d));
  });
});

describe("a delete", () => {
  it("removes the selected part from the drawing and its element from the network read back", () => {
    const d = frontEnd();
    const gone = deleteSelection(d, only("Rload"));
    expect(gone.parts.map((p) => p.element.name)).toEqual(["Vs", "Rs"]);
    expect(gone.wires).toEqual(d.wires);
    expect(gone.labels).toEqual(d.labels);
    expect(gone.grounds).toEqual(d.grounds);
    const back = read(gone);
    expect(Object.keys(back.nodes)).toEqual(["Vs", "Rs"]);
    // Rs's second pin still reaches the "out" label through the wire.
    expect(back.nodes.Rs).toEqual(["n1", "out"]);
  });

  it("removes exactly the selected wires, labels and ground symbols and keeps the rest in order", () => {
    const d = frontEnd();
    const gone = deleteSelection(d, { parts: [], wires: [0], labels: [], grounds: [1] });
    expect(gone.parts).toEqual(d.parts);
    expect(gone.wires).toEqual([d.wires[1]]);
    expect(gone.grounds).toEqual([d.grounds[0]]);
    const back = read(gone);
    // Without the wire Vs's + pin is no longer Rs's first node; without its ground Rload's foot floats.
    expect(back.nodes.Vs[0]).not.toBe(back.nodes.Rs[0]);
    expect(back.nodes.Rload[1]).not.toBe("0");
  });
});

describe("undo and redo", () => {
  // The canvas keeps the drawing before each edit and gives it back on undo; that is the exact
  // previous drawing only because no edit touches the drawing it is given.
  const deepFreeze = <T,>(value: T): T => {
    if (value && typeof value === "object" && !Object.isFrozen(value)) {
      Object.freeze(value);
      for (const v of Object.values(value)) deepFreeze(v);
    }
    return value;
  };
  const edits: [string, (d: Drawing) => Drawing][] = [
    ["turn", (d) => turnSelection(d, only("Rs"), 1)],
    ["turn back", (d) => turnSelection(d, only("Rload"), 3)],
    ["mirror", (d) => mirrorSelection(d, only("Vs"))],
    ["move", (d) => moveSelection(d, { parts: ["Rs"], wires: [1], labels: [0], grounds: [] }, [1, -1])],
    ["move all", (d) => moveSelection(d, selectAll(d), [-2, 3])],
    ["delete", (d) => deleteSelection(d, { parts: ["Rs"], wires: [0], labels: [0], grounds: [0] })],
  ];
  it.each(edits)("%s leaves the previous drawing untouched (undo restores it) and applies again the same way (redo)", (_, edit) => {
    const before = deepFreeze(frontEnd());
    const kept = structuredClone(before);
    const after = edit(before);
    expect(after).not.toEqual(before);
    expect(before).toEqual(kept);
    expect(edit(kept)).toEqual(after);
  });
});
