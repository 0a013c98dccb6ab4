// The canvas's keys run from the SHORTCUTS table the help sheet lists: every row is reachable by some
// key press and runs a command, and the keys the sheet names do what it says.
import { describe, expect, it } from "vitest";
import { runShortcut, shortcutFor, SHORTCUTS, type CanvasCommands, type KeyPress } from "@/features/canvas/components/shortcuts";

const press = (key: string, mods: Partial<Omit<KeyPress, "key">> = {}): KeyPress => ({ key, ctrlKey: false, metaKey: false, shiftKey: false, altKey: false, ...mods });

// Every command records its name and arguments; nudge reports whether something was selected.
function recorder(selected = true) {
  const calls: string[] = [];
  const note =
    (name: string) =>
    (...args: unknown[]) => {
      calls.push(args.length ? `${name}(${args.map((a) => JSON.stringify(a)).join(", ")})` : name);
    };
  const commands: CanvasCommands = {
    showKeys: note("showKeys"),
    zoom: note("zoom"),
    fit: note("fit"),
    pickTool: note("pickTool"),
    turn: note("turn"),
    mirror: note("mirror"),
    remove: note("remove"),
    nudge: (delta) => {
      note("nudge")(delta);
      return selected;
    },
    undo: note("undo"),
    redo: note("redo"),
    selectAll: note("selectAll"),
  };
  return { calls, commands };
}

// Key presses a keyboard makes: printable keys and the named keys, each bare and with modifiers.
const KEYS = [..."abcdefghijklmnopqrstuvwxyz", ..."ABCDEFGHIJKLMNOPQRSTUVWXYZ", ..."0123456789", ..."?=+-_/.,", "Escape", "Delete", "Backspace", "Home", "End", "Enter", "Tab", " ", "ArrowLeft", "ArrowRight", "ArrowUp", "ArrowDown"];
const MODIFIERS: Partial<Omit<KeyPress, "key">>[] = [{}, { shiftKey: true }, { ctrlKey: true }, { ctrlKey: true, shiftKey: true }, { metaKey: true }, { altKey: true }];
const ALL_PRESSES = KEYS.flatMap((key) => MODIFIERS.map((mods) => press(key, mods)));

// Typical key presses and the one command each runs, as the help sheet describes them.
const TYPICAL: [KeyPress, string][] = [
  [press("c"), 'pickTool("connect")'],
  [press("C", { shiftKey: true }), 'pickTool("connect")'],
  [press("n"), 'pickTool("name")'],
  [press("z"), 'pickTool("zero")'],
  [press("t"), 'pickTool("terminals")'],
  [press("Escape"), 'pickTool("select")'],
  [press("q"), "turn(1)"],
  [press("Q", { shiftKey: true }), "turn(3)"],
  [press("x"), "mirror"],
  [press("Delete"), "remove"],
  [press("Backspace"), "remove"],
  [press("ArrowUp"), "nudge([0,-1])"],
  [press("ArrowRight"), "nudge([1,0])"],
  [press("z", { ctrlKey: true }), "undo"],
  [press("z", { metaKey: true }), "undo"],
  [press("Z", { ctrlKey: true, shiftKey: true }), "redo"],
  [press("y", { ctrlKey: true }), "redo"],
  [press("a", { ctrlKey: true }), "selectAll"],
  [press("="), "zoom(1.25)"],
  [press("+", { shiftKey: true }), "zoom(1.25)"],
  [press("-"), "zoom(0.8)"],
  [press("Home"), "fit"],
  [press("?", { shiftKey: true }), "showKeys"],
];

const describeKey = (e: KeyPress) => [e.ctrlKey && "Ctrl", e.metaKey && "Meta", e.shiftKey && "Shift", JSON.stringify(e.key)].filter(Boolean).join("+");

const commandOf = (event: KeyPress, readOnly = false) => {
  const { calls, commands } = recorder();
  const handled = runShortcut(event, commands, readOnly);
  return { handled, calls };
};

describe("the canvas's shortcut table", () => {
  it.each(SHORTCUTS.map((s) => [s.keys, s] as const))("%s is the shortcut of some key press and runs a command", (_, shortcut) => {
    const presses = ALL_PRESSES.filter((event) => shortcutFor(event) === shortcut);
    expect(presses.length).toBeGreaterThan(0);
    for (const event of presses) expect(commandOf(event).calls).toHaveLength(1);
  });

  it.each(TYPICAL.map(([event, command]) => [describeKey(event), command, event] as const))("%s runs %s", (_, command, event) => {
    expect(commandOf(event)).toEqual({ handled: true, calls: [command] });
  });

  it("leaves other keys, and Ctrl with a tool's letter, to the browser", () => {
    for (const event of [press("c", { ctrlKey: true }), press("v", { ctrlKey: true }), press("Delete", { ctrlKey: true }), press("k"), press("Enter"), press("Tab")]) {
      expect(commandOf(event)).toEqual({ handled: false, calls: [] });
    }
  });

  it("keeps an arrow key when nothing is selected to nudge", () => {
    const { calls, commands } = recorder(false);
    expect(runShortcut(press("ArrowLeft"), commands, false)).toBe(false);
    expect(calls).toEqual(["nudge([-1,0])"]);
  });

  it("on a read-only drawing, runs only the keys that look and leaves the editing ones", () => {
    expect(commandOf(press("="), true)).toEqual({ handled: true, calls: ["zoom(1.25)"] });
    expect(commandOf(press("Home"), true).calls).toEqual(["fit"]);
    expect(commandOf(press("?"), true).calls).toEqual(["showKeys"]);
    for (const event of [press("c"), press("q"), press("Delete"), press("z", { ctrlKey: true }), press("ArrowUp")]) {
      expect(commandOf(event, true)).toEqual({ handled: false, calls: [] });
    }
  });
});
