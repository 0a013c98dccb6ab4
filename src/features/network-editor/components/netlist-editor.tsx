import { useEffect, useId, useLayoutEffect, useRef, useState } from "react";
import type { Diagnostic } from "@/lib/api-contract";
import { entryForDiagnostic } from "../lib/syntax-entries";
import { SyntaxReference } from "./syntax-reference";

const LINE_HEIGHT = 20; // px; gutter, text and diagnostic bands share it so they stay aligned
const PAD = 8; // px above the first line
const NOTE_GAP = 2; // px between two notes in the margin
const MARGIN = "relative min-w-[8rem] flex-1 border-l border-rule bg-paper/70 font-sans text-[11px] leading-snug";
const MARGIN_KEPT_MS = 600; // an emptied margin stays this long, so a re-check while typing does not make the text jump

/**
 * Where each margin note goes: level with its own line, or just below the note above it when that
 * one is taller than the lines between them (notes never overlap, and never cover the text).
 */
export function noteTops(lines: readonly number[], heights: readonly number[]): number[] {
  const tops: number[] = [];
  let bottom = -Infinity;
  lines.forEach((line, i) => {
    const top = Math.max(PAD + (line - 1) * LINE_HEIGHT, bottom + NOTE_GAP);
    tops.push(top);
    bottom = top + (heights[i] ?? LINE_HEIGHT);
  });
  return tops;
}

export interface EditorDiagnostic {
  line: number;
  column?: number;
  message: string;
  severity: "error" | "warning";
  /** The syntax reference entry that explains it. */
  entry?: string;
}

export function editorDiagnostics(diagnostics: readonly Diagnostic[]): EditorDiagnostic[] {
  return diagnostics
    .filter((d) => typeof d.line === "number")
    // The position is shown by the editor itself, so a "line 3, column 7:" lead-in is not repeated.
    .map((d) => ({ line: d.line!, column: d.column, message: d.message.replace(/^line \d+(, column \d+)?:\s*/i, ""), severity: d.severity === "warning" ? "warning" : "error", entry: entryForDiagnostic(d.code, d.message) }));
}

// A plain textarea with a line-numbered gutter; each diagnostic is a note in the margin beside the
// line it names (the line tinted, its number marked), never over the text.
export function NetlistEditor({
  value,
  onChange,
  diagnostics,
  readOnly = false,
  label = "Portfold netlist",
}: {
  value: string;
  onChange: (text: string) => void;
  diagnostics: EditorDiagnostic[];
  readOnly?: boolean;
  label?: string;
}) {
  const id = useId();
  const textarea = useRef<HTMLTextAreaElement>(null);
  const [help, setHelp] = useState<{ entry?: string } | null>(null);
  const lines = value.split("\n");
  const lineCount = Math.max(lines.length, 8);
  const byLine = new Map<number, EditorDiagnostic>();
  for (const d of diagnostics) if (!byLine.has(d.line) || d.severity === "error") byLine.set(d.line, d);

  // Notes in line order, measured after each render so a tall one pushes the next one down.
  const notes = [...diagnostics].sort((a, b) => a.line - b.line || (a.column ?? 0) - (b.column ?? 0));
  const noteList = useRef<HTMLUListElement>(null);
  const [heights, setHeights] = useState<number[]>([]);
  useLayoutEffect(() => {
    const measured = [...(noteList.current?.children ?? [])].map((li) => (li as HTMLElement).offsetHeight);
    setHeights((old) => (measured.length === old.length && measured.every((h, i) => h === old[i]) ? old : measured));
  }, [diagnostics]);
  const tops = noteTops(notes.map((d) => d.line), heights);
  // The messages go at once; the empty margin a little later (a live check of the new text may refill it).
  const [marginKept, setMarginKept] = useState(false);
  if (notes.length > 0 && !marginKept) setMarginKept(true);
  useEffect(() => {
    if (notes.length > 0) return;
    const timer = window.setTimeout(() => setMarginKept(false), MARGIN_KEPT_MS);
    return () => window.clearTimeout(timer);
  }, [notes.length]);
  const margin = notes.length > 0 || marginKept;
  const notesBottom = notes.length > 0 ? tops[tops.length - 1] + (heights[heights.length - 1] ?? LINE_HEIGHT) + PAD : 0;
  const textHeight = lineCount * LINE_HEIGHT + 2 * PAD;
  const longest = Math.max(...lines.map((l) => l.length));
  const textWidth = `max(100%, calc(${longest + 1}ch + 1rem))`;

  const goTo = (d: EditorDiagnostic) => {
    const el = textarea.current;
    if (!el) return;
    const offset = lines.slice(0, d.line - 1).reduce((sum, l) => sum + l.length + 1, 0) + Math.max(0, (d.column ?? 1) - 1);
    el.focus();
    el.setSelectionRange(offset, offset);
  };

  return (
    <div>
      <div className="flex items-baseline justify-between gap-2">
        <label htmlFor={id} className="block text-sm font-medium">
          {label}
        </label>
        <button type="button" className="text-xs text-copper hover:underline" onClick={() => setHelp({})}>
          Syntax reference
        </button>
      </div>
      <SyntaxReference open={help !== null} onClose={() => setHelp(null)} entry={help?.entry} />
      <div className="mt-1 flex rounded border border-rule bg-white font-mono text-[13px]" style={{ lineHeight: `${LINE_HEIGHT}px`, minHeight: Math.max(textHeight, notesBottom) }}>
        <div aria-hidden="true" className="select-none border-r border-rule bg-paper px-2 py-2 text-right text-ink/40">
          {Array.from({ length: lineCount }, (_, i) => {
            const d = byLine.get(i + 1);
            return (
              <div key={i} title={d?.message} className={d ? (d.severity === "error" ? "font-semibold text-signal" : "text-copper") : ""}>
                {d ? "▸" : ""}
                {i + 1}
              </div>
            );
          })}
        </div>
        {/* With notes, the text keeps the width of its longest line (never under 55%); the margin takes the rest.
            The textarea is as wide as its longest line, so a squeezed column scrolls sideways with a bar. */}
        <div className="relative min-w-0 flex-1 overflow-x-auto" style={margin ? { flex: `0 1 calc(${longest + 1}ch + 1rem)`, minWidth: "55%" } : undefined}>
          <div aria-hidden="true" className="pointer-events-none absolute inset-y-0 left-0 py-2" style={{ width: textWidth }}>
            {[...byLine.values()].map((d) => (
              <div
                key={d.line}
                className={`absolute inset-x-0 ${d.severity === "error" ? "bg-signal/10" : "bg-copper/10"}`}
                style={{ top: PAD + (d.line - 1) * LINE_HEIGHT, height: LINE_HEIGHT }}
              >
              </div>
            ))}
          </div>
          <textarea
            id={id}
            ref={textarea}
            value={value}
            readOnly={readOnly}
            onChange={(event) => onChange(event.target.value)}
            onKeyDown={(event) => {
              // Tab inserts two spaces; Escape then Tab leaves the editor, so the keyboard is never trapped.
              if (event.key === "Tab" && !event.shiftKey && !readOnly && !(event.currentTarget.dataset.escaped === "1")) {
                event.preventDefault();
                const el = event.currentTarget;
                const { selectionStart: start, selectionEnd: end } = el;
                onChange(`${value.slice(0, start)}  ${value.slice(end)}`);
                requestAnimationFrame(() => el.setSelectionRange(start + 2, start + 2));
              }
              event.currentTarget.dataset.escaped = event.key === "Escape" ? "1" : "0";
            }}
            spellCheck={false}
            autoCapitalize="off"
            autoComplete="off"
            wrap="off"
            rows={lineCount}
            aria-describedby={`${id}-help`}
            aria-invalid={diagnostics.some((d) => d.severity === "error") || undefined}
            className="relative block resize-none overflow-hidden whitespace-pre bg-transparent px-2 py-2 text-ink focus:outline-none"
            style={{ lineHeight: `${LINE_HEIGHT}px`, height: textHeight, width: textWidth }}
          />
        </div>
        {margin && notes.length === 0 && <div aria-hidden="true" className={MARGIN} />}
        {notes.length > 0 && (
          <ul ref={noteList} aria-label="Netlist diagnostics" className={MARGIN}>
            {notes.map((d, i) => (
              <li key={`${d.line}-${d.column ?? 0}-${i}`} data-diagnostic-line={d.line} className={`absolute inset-x-0 border-l-2 px-1.5 py-0.5 ${d.severity === "error" ? "border-signal" : "border-copper"}`} style={{ top: tops[i] }}>
                <button type="button" onClick={() => goTo(d)} className={`text-left hover:underline ${d.severity === "error" ? "text-signal" : "text-copper"}`}>
                  Line {d.line}
                  {d.column ? `, column ${d.column}` : ""}: {d.message}
                </button>
                {d.entry && (
                  <button type="button" className="ml-1.5 text-ink/60 underline decoration-dotted hover:text-copper" onClick={() => setHelp({ entry: d.entry })}>
                    syntax help
                  </button>
                )}
              </li>
            ))}
          </ul>
        )}
      </div>
      <p id={`${id}-help`} className="mt-1 text-xs text-ink/60">
        One element a line: <code className="font-mono">name kind node node = value</code>, controls as{" "}
        <code className="font-mono">across(a, b)</code> or <code className="font-mono">through(name)</code>; Tab indents, Escape then Tab
        moves on.
      </p>
    </div>
  );
}
