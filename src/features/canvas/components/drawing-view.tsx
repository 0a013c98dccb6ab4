import { useMemo } from "react";
import { printNetlistText, type CellDefinition, type EngineNetwork } from "@/lib/engine-netlist";
import { cellLibrary } from "../model/cell-part";
import { extractConnectivity, networkOfDrawing } from "../model/connectivity";
import { toLayout, type Drawing, type Layout } from "../model/drawing";
import { drawingFor } from "../model/sync";
import { SchematicCanvas } from "./schematic-canvas";

export interface DrawingViewProps {
  network: EngineNetwork;
  /** The circuit's stored `layout` member (or the one edited since); an automatic drawing when absent. */
  layout: unknown;
  readOnly?: boolean;
  /** Element names the engine's diagnostics name, with their messages. */
  faults?: Map<string, string>;
  /** A drawing edit: the netlist text it stands for and the new layout. */
  onEdit?: (text: string, layout: Layout) => void;
  height?: number;
  /** Whether to show the note that the text form does not keep the drawing. */
  note?: boolean;
  /** The team's own cells, offered in the palette beside the built-in ones. */
  teamCells?: readonly CellDefinition[];
}

// The drawing and the netlist as one model: the drawing is made from the netlist and its layout,
// and an edit to the drawing is read back into netlist text.
export function DrawingView({ network, layout, readOnly = false, faults, onEdit, height, note = true, teamCells }: DrawingViewProps) {
  const library = useMemo(() => cellLibrary(teamCells), [teamCells]);
  const drawing = useMemo(() => drawingFor(network, layout, library), [network, layout, library]);
  const extraction = useMemo(() => extractConnectivity(drawing, network.ground, network, library), [drawing, network, library]);
  const change = (next: Drawing) => {
    const read = networkOfDrawing(next, network, library);
    onEdit?.(printNetlistText(read.network), toLayout(next));
  };
  return (
    <div>
      <SchematicCanvas drawing={drawing} network={network} extraction={extraction} cells={[...library.values()]} onChange={readOnly ? undefined : change} readOnly={readOnly} faults={faults} height={height} />
      {extraction.diagnostics.length > 0 && !readOnly && (
        <ul aria-label="Drawing notes" className="mt-1 space-y-0.5 text-xs">
          {extraction.diagnostics.map((d, i) => (
            <li key={i} className={d.code === "port-unmarked" || d.code === "port-off-node" ? "text-copper" : "text-signal"}>
              {d.message}
            </li>
          ))}
        </ul>
      )}
      {note && !readOnly && (
        <p className="mt-1 text-[11px] text-ink/60">
          Drawing edits rewrite the netlist text in its standard layout (comments are not kept). The drawing is stored with the network and in its JSON export (the <code className="font-mono">layout</code> member); the text netlist does not carry it.
        </p>
      )}
    </div>
  );
}
