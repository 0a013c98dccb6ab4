import { useMemo } from "react";
import type { Drawing, Part } from "../model/drawing";
import type { Selection } from "../model/edit";
import { GRID, type Point } from "../model/geometry";
import { junctionsOf } from "../model/junctions";
import type { Tool } from "../hooks/use-canvas-tools";
import { PartSymbol } from "./part-symbol";

const COPPER = "#B5562B";
const INK = "#1E2430";
const s = (p: Point) => [p[0] * GRID, p[1] * GRID] as const;

export interface CanvasSceneProps {
  shown: Drawing;
  selection: Selection;
  faults: Map<string, string>;
  tool: Tool;
  pointer: Point | null;
  ghost: Part | null;
  box: { from: Point; to: Point } | null;
}

// What the canvas draws in grid px: the drawing itself, then what the current tool is about to add.
export function CanvasScene({ shown, selection, faults, tool, pointer, ghost, box }: CanvasSceneProps) {
  const junctions = useMemo(() => junctionsOf(shown), [shown]);
  return (
    <>
      <g fill="none" stroke="currentColor" strokeWidth="1.4" strokeLinecap="round" strokeLinejoin="round">
        {shown.wires.map(([a, b], i) => (
          <path key={i} data-wire={i} d={`M${s(a)[0]} ${s(a)[1]}L${s(b)[0]} ${s(b)[1]}`} stroke={selection.wires.includes(i) ? COPPER : "currentColor"} strokeWidth={selection.wires.includes(i) ? 2.2 : 1.4} />
        ))}
        {shown.grounds.map((g, i) => (
          <path key={i} data-ground={i} d={`M${s(g)[0]} ${s(g)[1]}v8m-9 0h18m-13 4h8m-5 4h2`} stroke={selection.grounds.includes(i) ? COPPER : "currentColor"} />
        ))}
        {shown.parts.map((part) => (
          <PartSymbol key={part.element.name} part={part} selected={selection.parts.includes(part.element.name)} faulty={faults.has(part.element.name)} note={faults.get(part.element.name)} />
        ))}
        {ghost && (
          <g opacity={0.45}>
            <PartSymbol part={ghost} selected={false} faulty={false} />
          </g>
        )}
        {tool.kind === "connect" && tool.from && pointer && <path d={`M${s(tool.from)[0]} ${s(tool.from)[1]}H${s(pointer)[0]}V${s(pointer)[1]}`} stroke={COPPER} strokeDasharray="4 3" />}
      </g>
      <g fill="currentColor">
        {junctions.map((j, i) => (
          <circle key={i} data-junction="" cx={s(j)[0]} cy={s(j)[1]} r={3} />
        ))}
      </g>
      <g fontSize="10" className="font-mono">
        {shown.labels.map((l, i) => (
          <g key={i} data-label={l.node}>
            <path d={`M${s(l.at)[0]} ${s(l.at)[1]}l4 -5h${6 * l.node.length + 8}`} fill="none" stroke={selection.labels.includes(i) ? COPPER : INK} strokeOpacity={0.6} />
            <text x={s(l.at)[0] + 7} y={s(l.at)[1] - 8} fill={selection.labels.includes(i) ? COPPER : INK}>
              {l.node}
            </text>
          </g>
        ))}
      </g>
      {shown.port && (
        <g data-port="">
          {(["plus", "minus"] as const).map((which) => {
            const [x, y] = s(shown.port![which]);
            return (
              <g key={which}>
                <circle cx={x} cy={y} r={5} fill="#FAF8F3" stroke={COPPER} strokeWidth={1.8} />
                <text x={x + 8} y={y + 14} fontSize="11" fontWeight="600" fill={COPPER}>
                  {which === "plus" ? "+" : "−"}
                </text>
              </g>
            );
          })}
        </g>
      )}
      {tool.kind === "terminals" && tool.plus && <circle cx={s(tool.plus)[0]} cy={s(tool.plus)[1]} r={5} fill="none" stroke={COPPER} strokeDasharray="2 2" strokeWidth={1.8} />}
      {box && (
        <rect
          x={Math.min(box.from[0], box.to[0]) * GRID}
          y={Math.min(box.from[1], box.to[1]) * GRID}
          width={Math.abs(box.to[0] - box.from[0]) * GRID}
          height={Math.abs(box.to[1] - box.from[1]) * GRID}
          fill={COPPER}
          fillOpacity={0.05}
          stroke={COPPER}
          strokeDasharray="3 3"
        />
      )}
    </>
  );
}
