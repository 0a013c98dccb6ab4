import { useMemo, useState } from "react";
import { Button } from "@/components/ui/button";
import { ErrorState, Progress } from "@/components/ui/states";
import { ApiError } from "@/lib/api-client";
import type { CellDefinition, EngineNetwork } from "@/lib/engine-netlist";
import type { Diagnostic } from "@/lib/api-contract";
import { parseNetlistText } from "@/lib/engine-netlist";
import { keepTypedLines } from "../lib/keep-lines";
import { nodesOf, readNetlist, withPort } from "../lib/netlist";
import { mergeDiagnostics, useLiveCheck } from "../lib/use-live-check";
import { ElementTable } from "./element-table";
import { NetlistEditor, editorDiagnostics } from "./netlist-editor";
import { PortPicker } from "./port-picker";
import { Schematic, DrawingView, type Layout } from "@/features/canvas";

export type NetworkTab = "text" | "table" | "drawing";
type Tab = NetworkTab;
const TABS: Tab[] = ["text", "table", "drawing"];

// Diagnostics that name elements but no line (e.g. from the solve) are placed on those elements' lines.
function placeDiagnostics(diagnostics: Diagnostic[], text: string): Diagnostic[] {
  const lines = text.split("\n");
  const lineOf = (name: string) => {
    const index = lines.findIndex((l) => l.trim().split(/\s+/)[0] === name);
    return index >= 0 ? index + 1 : undefined;
  };
  return diagnostics.map((d) => (d.line !== undefined ? d : { ...d, line: d.elements.map(lineOf).find((l) => l !== undefined) }));
}

// Each element an error (or a warning, asked for) names, with what it says, for the drawings to mark.
function faultsOf(diagnostics: Diagnostic[], severity: "error" | "warning" = "error"): Map<string, string> {
  const faults = new Map<string, string>();
  for (const d of diagnostics) for (const name of d.elements ?? []) if (d.severity === severity && !faults.has(name)) faults.set(name, d.message);
  return faults;
}

export interface NetworkPanelProps {
  text: string;
  onTextChange: (text: string) => void;
  canEdit: boolean;
  dirty: boolean;
  onSave: () => void;
  onSolve: () => void;
  saving: boolean;
  solving: boolean;
  solveProgress?: "sending" | "queued" | "solving" | "done";
  saveError: unknown;
  solveError: unknown;
  /** What a printed page shows as the netlist: the revision's own circuit when one is shown. */
  printText?: string;
  /** The drawing's stored layout (the circuit's `layout` member, or as edited since). */
  layout?: unknown;
  onLayoutChange?: (layout: Layout) => void;
  onTabChange?: (tab: NetworkTab) => void;
  /** The team's own cells: the drawing's palette offers them beside the built-in ones, and the live check reads them. */
  teamCells?: CellDefinition[];
}

export function NetworkPanel({ text, onTextChange, canEdit, dirty, onSave, onSolve, saving, solving, saveError, solveError, printText, solveProgress = "sending", layout, onLayoutChange, onTabChange, teamCells }: NetworkPanelProps) {
  const [tab, setTabState] = useState<Tab>("text");
  const setTab = (next: Tab) => {
    setTabState(next);
    onTabChange?.(next);
  };
  const read = useMemo(() => readNetlist(text), [text]);
  const [lastGood, setLastGood] = useState<EngineNetwork | null>(read.network);
  if (read.network && read.network !== lastGood) setLastGood(read.network);
  const network = read.network ?? lastGood;
  // Everything a Solve would refuse, checked as the designer types (the engine runs in the browser too).
  const live = useLiveCheck(text, read.network !== null, teamCells);
  const local = mergeDiagnostics(read.diagnostics, placeDiagnostics(live?.diagnostics ?? [], text));
  const errors = local.filter((d) => d.severity === "error");
  const serverDiagnostics = [solveError, saveError].flatMap((e) => (e instanceof ApiError && e.diagnostics ? e.diagnostics : []));
  const shown = editorDiagnostics(mergeDiagnostics(local, placeDiagnostics(serverDiagnostics, text)));
  const unplaced = mergeDiagnostics(local, serverDiagnostics).filter((d) => d.line === undefined && !d.elements?.length);
  const faults = faultsOf(mergeDiagnostics(local, serverDiagnostics));
  const cautions = new Set([...faultsOf(mergeDiagnostics(local, serverDiagnostics), "warning").keys()].filter((name) => !faults.has(name)));
  // An edit made in the table or the drawing rewrites only the lines of the elements it touched.
  const editElsewhere = (next: EngineNetwork) => onTextChange(keepTypedLines(text, next));
  const nodes = nodesOf(read.network);

  const tabButton = (value: Tab, label: string) => (
    <button
      type="button"
      role="tab"
      aria-selected={tab === value}
      aria-controls={`network-${value}`}
      id={`network-tab-${value}`}
      tabIndex={tab === value ? 0 : -1}
      onClick={() => setTab(value)}
      onKeyDown={(event) => {
        // Arrow keys move between the tabs, as in any tab list.
        if (event.key === "ArrowRight" || event.key === "ArrowLeft") {
          const next = TABS[(TABS.indexOf(tab) + (event.key === "ArrowRight" ? 1 : TABS.length - 1)) % TABS.length];
          setTab(next);
          document.getElementById(`network-tab-${next}`)?.focus();
        }
      }}
      className={`border-b-2 px-2 py-1 text-sm ${tab === value ? "border-copper font-medium text-ink" : "border-transparent text-ink/60 hover:text-ink"}`}
    >
      {label}
    </button>
  );

  return (
    <div className="space-y-4">
      <pre className="hidden whitespace-pre-wrap font-mono text-[9pt] print:block">{printText ?? text}</pre>
      <div className="print:hidden">
        <div role="tablist" aria-label="Network form" className="mb-2 flex gap-1 border-b border-rule">
          {tabButton("text", "Netlist text")}
          {tabButton("table", "Element table")}
          {tabButton("drawing", "Drawing")}
        </div>
        <div role="tabpanel" id={`network-${tab}`} aria-labelledby={`network-tab-${tab}`}>
          {tab === "text" ? (
            <NetlistEditor value={text} onChange={onTextChange} diagnostics={shown} readOnly={!canEdit} />
          ) : tab === "drawing" ? (
            network ? (
              <>
                {!read.network && <p className="mb-1 text-xs text-signal">The text has errors; the drawing shows the last version that read without them.</p>}
                <DrawingView
                  network={network}
                  layout={layout}
                  teamCells={teamCells}
                  readOnly={!canEdit}
                  faults={faults}
                  onEdit={(nextText, nextLayout) => {
                    onLayoutChange?.(nextLayout);
                    const next = parseNetlistText(nextText).network;
                    if (next) editElsewhere(next);
                    else onTextChange(nextText);
                  }}
                />
              </>
            ) : (
              <p className="text-sm text-ink/60">Fix the netlist to see the drawing.</p>
            )
          ) : (
            <ElementTable network={read.network} readOnly={!canEdit} onChange={editElsewhere} />
          )}
        </div>
        {unplaced.map((d, i) => (
          <p key={i} role="alert" className="mt-1 text-xs text-signal">
            {d.message}
          </p>
        ))}
      </div>

      {read.network && (
        <div className="print:hidden">
          <PortPicker
            nodes={nodes}
            plus={read.network.port.plus}
            minus={read.network.port.minus}
            disabled={!canEdit}
            onChange={(plus, minus) => onTextChange(withPort(text, plus, minus))}
          />
        </div>
      )}

      <section aria-labelledby="schematic-heading" className={tab === "drawing" ? "hidden print:block" : undefined}>
        <h2 id="schematic-heading" className="mb-1 text-sm font-medium">
          Schematic preview {!read.network && network && <span className="font-normal text-ink/50">(last version that read without errors)</span>}
        </h2>
        <div className="rounded border border-rule bg-white/40 p-1">{network ? <Schematic network={network} faults={new Set(faults.keys())} cautions={cautions} /> : <p className="p-3 text-sm text-ink/60">Fix the netlist to see the drawing.</p>}</div>
      </section>

      {canEdit && (
        <div className="sticky bottom-0 -mx-1 flex flex-wrap items-center gap-2 border-t border-rule bg-paper px-1 py-2 print:hidden">
          <Button variant="primary" onClick={onSolve} disabled={solving || saving || errors.length > 0} aria-describedby="solve-note">
            {solving ? "Solving…" : "Solve"}
          </Button>
          <Button onClick={onSave} disabled={!dirty || saving || errors.length > 0}>
            {saving ? "Saving…" : dirty ? "Save" : "Saved"}
          </Button>
          <span id="solve-note" className="text-xs text-ink/60">
            {errors.length > 0 ? `${errors.length} error${errors.length > 1 ? "s" : ""} in the netlist` : dirty ? "Unsaved changes; Solve saves first." : "Solve stores a new derivation revision."}
          </span>
          {solving && (
            <Progress
              label={
                solveProgress === "queued"
                  ? "Queued: waiting for a free solver…"
                  : solveProgress === "done"
                    ? "Solved; loading the ledger…"
                    : "Solving: exact nodal analysis…"
              }
            />
          )}
        </div>
      )}
      {solveError != null && !(solveError instanceof ApiError && solveError.diagnostics?.length) && <ErrorState error={solveError} title="The network could not be solved" />}
      {saveError != null && <ErrorState error={saveError} title="The network could not be saved" />}
    </div>
  );
}
