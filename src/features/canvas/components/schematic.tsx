import { useId } from "react";
import { isControlled, type Element, type EngineNetwork } from "@/lib/engine-netlist";
import { layoutSchematic, type PlacedOpamp, type PlacedPart } from "../model/schematic-layout";

const BODY = 20; // half-length of a symbol along its axis

function shorten(text: string, max = 16): string {
  return text.length > max ? `${text.slice(0, max - 1)}…` : text;
}

// Symbol bodies in a local frame: axis along +x from −BODY to +BODY (IEC 60617 / IEEE 315 shapes).
export function SymbolBody({ element, reversed }: { element: Element; reversed: boolean }) {
  const dir = reversed ? -1 : 1;
  switch (element.kind) {
    case "resistor":
    case "conductance":
      return (
        <>
          <path d={`M${-BODY} 0H-16M16 0H${BODY}`} />
          <rect x={-16} y={-6} width={32} height={12} fill="#FAF8F3" />
        </>
      );
    case "capacitor":
      return <path d={`M${-BODY} 0H-4M-4 -11V11M4 -11V11M4 0H${BODY}`} />;
    case "inductor":
      return <path d={`M${-BODY} 0H-16a4 4 0 0 1 8 0a4 4 0 0 1 8 0a4 4 0 0 1 8 0a4 4 0 0 1 8 0H${BODY}`} fill="none" />;
    case "voltage":
    case "current": {
      const current = element.kind === "current";
      const arrow = current && <path d={`M${-7 * dir} 0H${7 * dir}M${3 * dir} -3L${7 * dir} 0L${3 * dir} 3`} fill="none" />;
      if (!isControlled(element)) {
        return (
          <>
            <path d={`M${-BODY} 0H-12M12 0H${BODY}`} />
            <circle r={12} fill="#FAF8F3" />
            {arrow}
          </>
        );
      }
      // A controlled source is drawn as a diamond (IEC 60617 / IEEE 315).
      return (
        <>
          <path d={`M${-BODY} 0H-13M13 0H${BODY}`} />
          <path d="M-13 0L0 -13L13 0L0 13Z" fill="#FAF8F3" />
          {arrow}
        </>
      );
    }
  }
}

export function hasPolarity(e: Element) {
  return e.kind === "voltage";
}

type Mark = "fault" | "caution" | undefined;

// An element an error names is drawn in signal red, one a warning names in copper.
const markProps = (mark: Mark, name: string) => ({
  className: mark === "fault" ? "text-signal" : mark === "caution" ? "text-copper" : undefined,
  "data-fault": mark === "fault" ? name : undefined,
  "data-caution": mark === "caution" ? name : undefined,
});

function Part({ part, mark }: { part: PlacedPart; mark?: Mark }) {
  const { element: e, x1, y1, x2, y2, reversed } = part;
  const vertical = x1 === x2;
  const cx = (x1 + x2) / 2;
  const cy = (y1 + y2) / 2;
  const len = vertical ? Math.abs(y2 - y1) : Math.abs(x2 - x1);
  const lead = Math.max(0, len / 2 - BODY);
  // World position of a point at distance t along the local axis from the centre.
  const at = (t: number): [number, number] => (vertical ? [cx, cy + t] : [cx + t, cy]);
  const plusAt = at((reversed ? 1 : -1) * 6);
  const minusAt = at((reversed ? -1 : 1) * 6);
  const value = e.kind === "opamp" ? "" : e.value;
  return (
    <g {...markProps(mark, e.name)}>
      <title>{`${e.name}: ${e.kind}${value ? `, ${value}` : ""}`}</title>
      {vertical ? (
        <path d={`M${x1} ${y1}V${y1 + lead}M${x2} ${y2}V${y2 - lead}`} />
      ) : (
        <path d={`M${x1} ${y1}H${x1 + lead}M${x2} ${y2}H${x2 - lead}`} />
      )}
      <g transform={`translate(${cx} ${cy})${vertical ? " rotate(90)" : ""}`}>
        <SymbolBody element={e} reversed={reversed} />
      </g>
      {hasPolarity(e) && (
        <g stroke="none" fill="currentColor" fontSize="9" textAnchor="middle" dominantBaseline="central">
          <text x={plusAt[0]} y={plusAt[1]}>+</text>
          <text x={minusAt[0]} y={minusAt[1]}>−</text>
        </g>
      )}
      <g stroke="none" fill="currentColor" fontSize="10">
        {vertical ? (
          <>
            <text x={cx + 16} y={cy - 3} fontWeight="600">{e.name}</text>
            <text x={cx + 16} y={cy + 9} className="font-mono" fontSize="9">{shorten(value, 18)}</text>
          </>
        ) : (
          <>
            <text x={cx} y={cy - 16} textAnchor="middle" fontWeight="600">{e.name}</text>
            <text x={cx} y={cy + 24} textAnchor="middle" className="font-mono" fontSize="9">{shorten(value, 22)}</text>
          </>
        )}
      </g>
    </g>
  );
}

function Opamp({ opamp, mark }: { opamp: PlacedOpamp; mark?: Mark }) {
  const { x, y, element } = opamp;
  const base = y + 40;
  return (
    <g {...markProps(mark, element.name)}>
      <title>{`${element.name}: ideal op-amp, + ${element.inputs[0]}, − ${element.inputs[1]}, output ${element.output}`}</title>
      <path d={`M${x} ${y}L${x + 22} ${base}H${x - 22}Z`} fill="#FAF8F3" />
      <path d={`M${x - 10} ${base}V${base + 12}M${x + 10} ${base}V${base + 12}`} />
      <g stroke="none" fill="currentColor" fontSize="9" textAnchor="middle">
        <text x={x - 10} y={base - 4}>+</text>
        <text x={x + 10} y={base - 4}>−</text>
        <text x={x - 10} y={base + 22} className="font-mono">{shorten(element.inputs[0], 6)}</text>
        <text x={x + 10} y={base + 22} className="font-mono">{shorten(element.inputs[1], 6)}</text>
        <text x={x + 26} y={y + 24} textAnchor="start" fontWeight="600" fontSize="10">{element.name}</text>
      </g>
    </g>
  );
}

// The automatically drawn preview of what was entered: standard symbols on a faint dotted grid.
/** `faults`: names of elements an error points at, drawn in signal red; `cautions`: those a warning points at, in copper. */
export function Schematic({ network, title = "Schematic preview", faults, cautions }: { network: EngineNetwork; title?: string; faults?: ReadonlySet<string>; cautions?: ReadonlySet<string> }) {
  const markOf = (name: string): Mark => (faults?.has(name) ? "fault" : cautions?.has(name) ? "caution" : undefined);
  const gridId = useId().replace(/:/g, "");
  if (network.elements.length === 0) return <p className="text-sm text-ink/60">Nothing to draw yet.</p>;
  const layout = layoutSchematic(network);
  const { minX, minY, maxX, maxY } = layout.bounds;
  const width = maxX - minX;
  const height = maxY - minY;
  return (
    <svg
      role="img"
      aria-label={`${title}: ${network.elements.length} elements, port ${network.port.plus} to ${network.port.minus}`}
      viewBox={`${minX} ${minY} ${width} ${height}`}
      className="block h-auto w-full text-ink"
      style={{ maxHeight: 320 }}
    >
      <defs>
        <pattern id={gridId} width="10" height="10" patternUnits="userSpaceOnUse">
          <circle cx="0" cy="0" r="0.7" fill="#1E2430" opacity="0.18" />
        </pattern>
      </defs>
      <rect x={minX} y={minY} width={width} height={height} fill={`url(#${gridId})`} />
      <g fill="none" stroke="currentColor" strokeWidth="1.4" strokeLinecap="round" strokeLinejoin="round">
        {layout.wires.map(([x1, y1, x2, y2], i) => (
          <path key={i} d={`M${x1} ${y1}L${x2} ${y2}`} />
        ))}
        {layout.groundRail && <path d={`M${layout.groundRail[0]} ${layout.groundRail[1]}H${layout.groundRail[2]}`} />}
        {layout.groundSymbol && (
          <path
            d={`M${layout.groundSymbol.x} ${layout.groundSymbol.y}v10m-10 0h20m-16 4h12m-8 4h4`}
            transform={`translate(0 0)`}
          />
        )}
        {layout.parts.map((part, i) => (
          <Part key={i} part={part} mark={markOf(part.element.name)} />
        ))}
        {layout.opamps.map((opamp, i) => (
          <Opamp key={i} opamp={opamp} mark={markOf(opamp.element.name)} />
        ))}
      </g>
      <g fill="currentColor">
        {layout.junctions.map((j, i) => (
          <circle key={i} cx={j.x} cy={j.y} r={2.4} />
        ))}
      </g>
      <g fontSize="9" className="font-mono" fill="#1E2430" opacity="0.7">
        {layout.nodeLabels.map((n) => (
          <text key={n.name} x={n.x + 4} y={n.y - 6}>
            {n.name}
          </text>
        ))}
      </g>
      {layout.port && (
        <g>
          {!layout.port.bottom.connected && null}
          <circle cx={layout.port.top.x} cy={layout.port.top.y} r={4.5} fill="#FAF8F3" stroke="#B5562B" strokeWidth="1.6" />
          <circle cx={layout.port.bottom.x} cy={layout.port.bottom.y} r={4.5} fill="#FAF8F3" stroke="#B5562B" strokeWidth="1.6" />
          <g fontSize="10" fill="#B5562B" fontWeight="600">
            <text x={layout.port.top.x + 9} y={layout.port.top.y + 3.5}>{layout.port.top.label}</text>
            <text x={layout.port.bottom.x + 9} y={layout.port.bottom.y + 3.5}>{layout.port.bottom.label}</text>
          </g>
        </g>
      )}
    </svg>
  );
}
