import type { Element } from "@/lib/engine-netlist";
import { hasPolarity, SymbolBody } from "./schematic";
import { cellHalfHeight, isCellPart, type CellPartElement } from "../model/cell-part";
import { partPins, type Part } from "../model/drawing";
import { GRID, orient, place, type Point } from "../model/geometry";

const px = (p: Point): [number, number] => [p[0] * GRID, p[1] * GRID];

function valueText(e: Element): string {
  if (e.kind === "opamp") return "ideal";
  return e.value;
}

// The op-amp in its local frame: a triangle pointing along +x, inputs on the left.
function OpampBody() {
  return (
    <>
      <path d="M-30 -10H-20M-30 10H-20M20 0H30" />
      <path d="M-20 -20L20 0L-20 20Z" fill="#FAF8F3" />
    </>
  );
}

/** A cell instance: a box, each pin named by its terminal, the instance and cell names beside it. */
function CellSymbol({ part, e, selected, faulty, note }: { part: Part; e: CellPartElement; selected: boolean; faulty: boolean; note?: string }) {
  const [cx, cy] = px(part.at);
  const h = cellHalfHeight(e.pins.length) * GRID;
  const along = orient([1, 0], part.turn, false);
  const vertical = along[0] === 0;
  const [w2, h2] = vertical ? [h, 30] : [30, h];
  const stroke = faulty ? "#B3261E" : "currentColor";
  const pins = partPins(part).map(px);
  const label = `${e.name}: cell ${e.cell}, terminals ${e.pins.map((t) => `${t}=${e.terminals[t]}`).join(" ")}`;
  return (
    <g data-part={e.name} data-kind="cell" data-cell={e.cell} aria-label={label} role="img">
      <title>{`${label}${note ? ` — ${note}` : ""}`}</title>
      {selected && <rect x={cx - w2 - 12} y={cy - h2 - 12} width={2 * w2 + 24} height={2 * h2 + 24} fill="#B5562B" fillOpacity={0.06} stroke="#B5562B" strokeDasharray="3 3" strokeWidth={1} />}
      <rect x={cx - w2} y={cy - h2} width={2 * w2} height={2 * h2} fill="#FAF8F3" stroke={stroke} />
      {pins.map(([x, y], j) => {
        // The pin's stub runs from the box edge out to the pin; its terminal name sits just inside the box.
        const dx = Math.sign(x - cx) * (Math.abs(x - cx) > w2 - 0.5 ? 1 : 0);
        const dy = Math.sign(y - cy) * (Math.abs(y - cy) > h2 - 0.5 ? 1 : 0);
        const edge: [number, number] = [x - dx * 10, y - dy * 10];
        const inside: [number, number] = [x - dx * 16, y - dy * 16];
        return (
          <g key={j}>
            <path d={`M${edge[0]} ${edge[1]}L${x} ${y}`} stroke={stroke} />
            <text x={inside[0]} y={inside[1]} fontSize="8" stroke="none" fill={stroke} textAnchor={dx > 0 ? "end" : dx < 0 ? "start" : "middle"} dominantBaseline="central" className="font-mono">
              {e.pins[j]}
            </text>
            <circle cx={x} cy={y} r={1.6} fill="currentColor" stroke="none" opacity={0.55} />
          </g>
        );
      })}
      <g stroke="none" fill={stroke} fontSize="10" textAnchor="middle">
        <text x={cx} y={cy - h2 - 5} fontWeight="600">
          {e.name}
        </text>
        <text x={cx} y={cy + h2 + 11} className="font-mono" fontSize="9">
          {e.cell}
        </text>
      </g>
    </g>
  );
}

/** One part at its place, turned and mirrored; texts stay upright beside it. */
export function PartSymbol({ part, selected, faulty, note }: { part: Part; selected: boolean; faulty: boolean; note?: string }) {
  const e = part.element;
  if (isCellPart(e)) return <CellSymbol part={part} e={e} selected={selected} faulty={faulty} note={note} />;
  const [cx, cy] = px(part.at);
  const angle = part.turn * 90;
  const along = orient([1, 0], part.turn, false);
  const vertical = along[0] === 0;
  const local = (p: Point) => px(place(p, part.at, part.turn, part.mirror));
  const stroke = faulty ? "#B3261E" : "currentColor";
  const name: [number, number] = vertical ? [cx + 14, cy - 3] : [cx, cy - 17];
  const value: [number, number] = vertical ? [cx + 14, cy + 10] : [cx, cy + 25];
  const pins = partPins(part).map(px);
  return (
    <g data-part={e.name} data-kind={e.kind} aria-label={`${e.name}: ${e.kind}, ${valueText(e)}`} role="img">
      <title>{`${e.name}: ${e.kind}, ${valueText(e)}${note ? ` — ${note}` : ""}`}</title>
      {selected && <rect x={cx - 34} y={cy - 34} width={68} height={68} fill="#B5562B" fillOpacity={0.06} stroke="#B5562B" strokeDasharray="3 3" strokeWidth={1} />}
      <g transform={`translate(${cx} ${cy}) rotate(${angle}) scale(${part.mirror ? -1 : 1} 1)`} stroke={stroke}>
        {e.kind === "opamp" ? (
          <OpampBody />
        ) : (
          <>
            <path d="M-30 0H-20M20 0H30" />
            {/* The preview's symbol bodies, one way to draw each kind; a mirrored part flips its arrow with the frame. */}
            <SymbolBody element={e} reversed={false} />
          </>
        )}
      </g>
      <g stroke="none" fill={faulty ? "#B3261E" : "currentColor"} fontSize="9" textAnchor="middle" dominantBaseline="central">
        {hasPolarity(e) && (
          <>
            <text x={local([-0.55, 0])[0]} y={local([-0.55, 0])[1]}>+</text>
            <text x={local([0.55, 0])[0]} y={local([0.55, 0])[1]}>−</text>
          </>
        )}
        {e.kind === "opamp" && (
          <>
            <text x={local([-1.4, -1])[0]} y={local([-1.4, -1])[1]}>+</text>
            <text x={local([-1.4, 1])[0]} y={local([-1.4, 1])[1]}>−</text>
          </>
        )}
      </g>
      <g stroke="none" fill={faulty ? "#B3261E" : "currentColor"} fontSize="10" textAnchor={vertical ? "start" : "middle"}>
        <text x={name[0]} y={name[1]} fontWeight="600">
          {e.name}
        </text>
        <text x={value[0]} y={value[1]} className="font-mono" fontSize="9">
          {valueText(e)}
        </text>
      </g>
      {pins.map(([x, y], j) => (
        <circle key={j} cx={x} cy={y} r={1.6} fill="currentColor" stroke="none" opacity={0.55} />
      ))}
    </g>
  );
}
