import type { CellDefinition, EngineNetwork } from "@/lib/engine-netlist";
import { PALETTE } from "../model/edit";
import type { CanvasTools } from "../hooks/use-canvas-tools";

export interface CanvasToolbarsProps {
  tools: CanvasTools;
  network: EngineNetwork;
  cells: readonly CellDefinition[];
  onShowKeys: () => void;
}

function ToolButton({ label, shortcut, active, onClick }: { label: string; shortcut: string; active: boolean; onClick: () => void }) {
  return (
    <button type="button" aria-pressed={active} onClick={onClick} title={`${label} (${shortcut})`} className={`rounded border px-2 py-0.5 text-xs ${active ? "border-copper bg-copper/10 text-ink" : "border-rule bg-white/60 text-ink/80 hover:border-ink/40"}`}>
      {label} <kbd className="font-mono text-[10px] text-ink/50">{shortcut}</kbd>
    </button>
  );
}

// The palette of parts and cells to place, and the drawing tools with their keys.
export function CanvasToolbars({ tools, network, cells, onShowKeys }: CanvasToolbarsProps) {
  const { tool } = tools;
  return (
    <div className="space-y-1.5">
      <div role="toolbar" aria-label="Palette" className="flex flex-wrap gap-1">
        {PALETTE.map((preset) => (
          <button
            key={preset.label}
            type="button"
            aria-pressed={tool.kind === "place" && tool.preset === preset}
            title={preset.value ? `${preset.kind} = ${preset.value.replaceAll("{ground}", network.ground).replaceAll("{first}", "…")}` : "ideal op-amp"}
            onClick={() => tools.place(preset)}
            className={`rounded border px-1.5 py-0.5 font-mono text-[11px] ${tool.kind === "place" && tool.preset === preset ? "border-copper bg-copper/10" : "border-rule bg-white/60 hover:border-ink/40"}`}
          >
            {preset.label}
          </button>
        ))}
        <span className="mx-1 self-center text-[11px] text-ink/50">cells:</span>
        {cells.map((cell) => (
          <button
            key={cell.id}
            type="button"
            title={`${cell.title} (terminals ${cell.terminals.join(", ")})`}
            aria-pressed={tool.kind === "place-cell" && tool.cell.id === cell.id}
            onClick={() => tools.placeCell(cell)}
            className={`rounded border px-1.5 py-0.5 font-mono text-[11px] ${tool.kind === "place-cell" && tool.cell.id === cell.id ? "border-copper bg-copper/10" : "border-dashed border-rule bg-white/60 hover:border-ink/40"}`}
          >
            {cell.id}
          </button>
        ))}
      </div>
      <div role="toolbar" aria-label="Drawing tools" className="flex flex-wrap items-center gap-1">
        <ToolButton label="Select" shortcut="Esc" active={tool.kind === "select"} onClick={() => tools.pick("select")} />
        <ToolButton label="Connect" shortcut="C" active={tool.kind === "connect"} onClick={() => tools.pick("connect")} />
        <ToolButton label="Name node" shortcut="N" active={tool.kind === "name"} onClick={() => tools.pick("name")} />
        <label className="flex items-center gap-1 text-xs">
          <span className="sr-only">Node name</span>
          <input aria-label="Node name" value={tools.nodeName} onChange={(e) => tools.setNodeName(e.target.value.replace(/[^\p{L}\p{N}_]/gu, ""))} className="w-16 rounded border border-rule bg-white px-1 py-0.5 font-mono text-xs" />
        </label>
        <ToolButton label="Ground" shortcut="Z" active={tool.kind === "zero"} onClick={() => tools.pick("zero")} />
        <ToolButton label="Port" shortcut="T" active={tool.kind === "terminals"} onClick={() => tools.pick("terminals")} />
        <span className="mx-1 h-4 border-l border-rule" />
        <button type="button" className="rounded border border-rule bg-white/60 px-2 py-0.5 text-xs" onClick={onShowKeys}>
          Keys <kbd className="font-mono text-[10px] text-ink/50">?</kbd>
        </button>
      </div>
    </div>
  );
}
