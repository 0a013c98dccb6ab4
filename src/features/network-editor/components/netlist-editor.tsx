import { useId, useRef, useState } from "react";
import type { Diagnostic } from "@/types/api";
import { entryForDiagnostic } from "../lib/syntax-entries";
import { SyntaxReference } from "./syntax-reference";

const LINE_HEIGHT = 20; // px; gutter, text and diagnostic bands share it so they stay aligned

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

// A plain textarea with a line-numbered gutter; each diagnostic is shown on the line it names.
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
      <div className="mt-1 flex overflow-x-auto rounded border border-rule bg-white font-mono text-[13px]" style={{ lineHeight: `${LINE_HEIGHT}px` }}>
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
        <div className="relative min-w-0 flex-1">
          <div aria-hidden="true" className="pointer-events-none absolute inset-0 py-2">
            {[...byLine.values()].map((d) => (
              <div
                key={d.line}
                className={`absolute inset-x-0 ${d.severity === "error" ? "bg-signal/10" : "bg-copper/10"}`}
                style={{ top: 8 + (d.line - 1) * LINE_HEIGHT, height: LINE_HEIGHT }}
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
            className="relative block w-full resize-none overflow-hidden whitespace-pre bg-transparent px-2 py-2 text-ink focus:outline-none"
            style={{ lineHeight: `${LINE_HEIGHT}px`, height: lineCount * LINE_HEIGHT + 16 }}
          />
        </div>
      </div>
      <p id={`${id}-help`} className="mt-1 text-xs text-ink/60">
        One element a line: <code className="font-mono">name kind node node = value</code>, controls as{" "}
        <code className="font-mono">across(a, b)</code> or <code className="font-mono">through(name)</code>; Tab indents, Escape then Tab
        moves on.
      </p>
      {diagnostics.length > 0 && (
        <ul className="mt-2 space-y-1 text-xs" aria-label="Netlist diagnostics">
          {diagnostics.map((d, i) => (
            <li key={i} data-diagnostic-line={d.line}>
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
  );
}
