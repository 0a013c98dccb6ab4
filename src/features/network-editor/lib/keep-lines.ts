import { parseNetlistText, printElementLine, printNetlistText, type Element, type EngineNetwork } from "@/lib/engine-netlist";
import { withPort } from "./netlist";

// The first word of a line, which names the element or directive it holds.
const headOf = (line: string) => line.replace(/#.*/, "").trim().split(/\s+/)[0] ?? "";

// The line with a new body and its own trailing comment kept.
function replaceBody(line: string, body: string): string {
  const hash = line.indexOf("#");
  if (hash < 0) return body;
  const gap = /\s*$/.exec(line.slice(0, hash))![0] || "  ";
  return `${body}${gap}${line.slice(hash)}`;
}

const sameJson = (a: unknown, b: unknown) => JSON.stringify(a ?? null) === JSON.stringify(b ?? null);

/**
 * The designer's text after an edit made elsewhere (element table, drawing): only the lines of the
 * elements that changed are rewritten, new elements are added after the last element line, removed
 * ones lose their line; comments, blank lines, spacing and order of everything else stay as typed.
 * Falls back to the printed form when the old text does not read or the edit is not one of elements and port.
 */
export function keepTypedLines(oldText: string, next: EngineNetwork): string {
  const old = parseNetlistText(oldText).network;
  if (!old || old.ground !== next.ground || !sameJson(old.quantities, next.quantities) || !sameJson(old.cells, next.cells) || !sameJson(old.assumptions, next.assumptions)) {
    return printNetlistText(next);
  }
  let lines = oldText.split("\n");
  const lineOf = (name: string) => lines.findIndex((l) => headOf(l) === name);
  // Pairs by name; an element whose name changed in its own place (a rename in the table) pairs by position.
  const nextNames = new Set(next.elements.map((e) => e.name));
  const oldNames = new Set(old.elements.map((e) => e.name));
  const pairs: [Element | undefined, Element | undefined][] = old.elements.map((e, i) => {
    if (nextNames.has(e.name)) return [e, next.elements.find((n) => n.name === e.name)];
    const inPlace = next.elements[i];
    return [e, inPlace && !oldNames.has(inPlace.name) ? inPlace : undefined];
  });
  const paired = new Set(pairs.map(([, after]) => after));
  for (const n of next.elements) if (!paired.has(n)) pairs.push([undefined, n]);
  const removed: number[] = [];
  for (const [before, after] of pairs) {
    if (before && after) {
      if (sameJson(before, after)) continue;
      const at = lineOf(before.name);
      if (at < 0) return printNetlistText(next);
      lines[at] = replaceBody(lines[at], printElementLine(after));
    } else if (before) {
      const at = lineOf(before.name);
      if (at >= 0) removed.push(at);
    }
  }
  lines = lines.filter((_, i) => !removed.includes(i));
  const added = pairs.flatMap(([before, after]) => (!before && after ? [printElementLine(after)] : []));
  if (added.length > 0) {
    const names = new Set(next.elements.map((e) => e.name));
    let last = -1;
    lines.forEach((l, i) => {
      if (names.has(headOf(l))) last = i;
    });
    if (last < 0) last = lines.length - (lines[lines.length - 1] === "" ? 2 : 1);
    lines.splice(last + 1, 0, ...added);
  }
  let text = lines.join("\n");
  if (old.port.plus !== next.port.plus || old.port.minus !== next.port.minus) text = withPort(text, next.port.plus, next.port.minus);
  return text;
}
