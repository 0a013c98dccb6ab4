import type { DrawingTool } from "../hooks/use-canvas-tools";
import type { Point } from "../model/geometry";

/** What of a key event the shortcuts read (a KeyboardEvent has all of it). */
export interface KeyPress {
  key: string;
  ctrlKey: boolean;
  metaKey: boolean;
  shiftKey: boolean;
  altKey: boolean;
}

/** What the canvas does for its keys. */
export interface CanvasCommands {
  showKeys(): void;
  zoom(factor: number): void;
  fit(): void;
  pickTool(tool: DrawingTool): void;
  turn(by: 1 | 3): void;
  mirror(): void;
  remove(): void;
  /** Moves the selection a grid step; false when there is nothing to move. */
  nudge(delta: Point): boolean;
  undo(): void;
  redo(): void;
  selectAll(): void;
}

export interface Shortcut {
  keys: string;
  does: string;
  /** Whether the key changes the drawing (a read-only drawing ignores it). */
  edits: boolean;
  matches(event: KeyPress): boolean;
  /** Runs the command; false when the key did nothing (the browser then keeps it). */
  run(commands: CanvasCommands, event: KeyPress): void | boolean;
}

const withCtrl = (e: KeyPress) => e.ctrlKey || e.metaKey;
// A letter with or without Shift (Ctrl+letter is another shortcut, or the browser's).
const letter = (...letters: string[]) => (e: KeyPress) => !withCtrl(e) && letters.includes(e.key.toLowerCase());
const ctrlLetter = (...letters: string[]) => (e: KeyPress) => withCtrl(e) && letters.includes(e.key.toLowerCase());
const named = (...keys: string[]) => (e: KeyPress) => keys.includes(e.key);
const plainNamed = (...keys: string[]) => (e: KeyPress) => !withCtrl(e) && keys.includes(e.key);

const ARROWS: Record<string, Point> = { ArrowLeft: [-1, 0], ArrowRight: [1, 0], ArrowUp: [0, -1], ArrowDown: [0, 1] };

// Portfold's own keys for the drawing, chosen from our words (Connect, Name, zero node, Terminals,
// Quarter turn, eXchange sides). The canvas runs its keys from this table and the help sheet lists it.
export const SHORTCUTS: readonly Shortcut[] = [
  { keys: "C", does: "Connect: draw wires (click point to point; Escape ends)", edits: true, matches: letter("c"), run: (c) => c.pickTool("connect") },
  { keys: "N", does: "Name a node: click a point to put the node label there", edits: true, matches: letter("n"), run: (c) => c.pickTool("name") },
  { keys: "Z", does: "Zero node: put a ground symbol (node 0)", edits: true, matches: letter("z"), run: (c) => c.pickTool("zero") },
  { keys: "T", does: "Terminals of the port: click the + terminal, then the − terminal", edits: true, matches: letter("t"), run: (c) => c.pickTool("terminals") },
  { keys: "Escape", does: "Back to selecting; drops a wire or port in progress", edits: false, matches: named("Escape"), run: (c) => c.pickTool("select") },
  { keys: "Q / Shift+Q", does: "Quarter turn clockwise / back", edits: true, matches: letter("q"), run: (c, e) => c.turn(e.shiftKey ? 3 : 1) },
  { keys: "X", does: "Exchange sides (mirror)", edits: true, matches: letter("x"), run: (c) => c.mirror() },
  { keys: "Delete or Backspace", does: "Remove what is selected", edits: true, matches: plainNamed("Delete", "Backspace"), run: (c) => c.remove() },
  { keys: "Arrow keys", does: "Nudge the selection one grid step", edits: true, matches: plainNamed(...Object.keys(ARROWS)), run: (c, e) => c.nudge(ARROWS[e.key]) },
  { keys: "Ctrl+Z / Ctrl+Shift+Z or Ctrl+Y", does: "Undo / redo", edits: true, matches: ctrlLetter("z", "y"), run: (c, e) => (e.key.toLowerCase() === "z" && !e.shiftKey ? c.undo() : c.redo()) },
  { keys: "Ctrl+A", does: "Select everything", edits: true, matches: ctrlLetter("a"), run: (c) => c.selectAll() },
  { keys: "= / -", does: "Zoom in / out (the wheel zooms at the pointer)", edits: false, matches: named("=", "+", "-"), run: (c, e) => c.zoom(e.key === "-" ? 0.8 : 1.25) },
  { keys: "Home", does: "Fit the drawing in view", edits: false, matches: named("Home"), run: (c) => c.fit() },
  { keys: "?", does: "This sheet", edits: false, matches: named("?"), run: (c) => c.showKeys() },
];

/** Pointer gestures, listed on the help sheet after the keys. */
export const GESTURES: readonly { keys: string; does: string }[] = [
  { keys: "Alt+drag or middle drag", does: "Pan" },
  { keys: "Shift+click or drag a box", does: "Select several" },
];

export const shortcutFor = (event: KeyPress) => SHORTCUTS.find((s) => s.matches(event));

/** Runs the shortcut of a key press; true when one ran and the key is used up. */
export function runShortcut(event: KeyPress, commands: CanvasCommands, readOnly: boolean): boolean {
  const shortcut = shortcutFor(event);
  if (!shortcut || (readOnly && shortcut.edits)) return false;
  return shortcut.run(commands, event) !== false;
}
