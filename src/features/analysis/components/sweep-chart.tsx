import "uplot/dist/uPlot.min.css";
import uPlot from "uplot";
import { useEffect, useRef } from "react";
import { DEGREE_STEPS, ONE_TWO_FIVE, engineeringTick, logTicks } from "../lib/axis-ticks";

export interface ChartSeries {
  label: string;
  values: (number | null)[];
  color: string;
  dash?: number[];
}

export interface SweepChartProps {
  x: number[];
  series: ChartSeries[];
  logX: boolean;
  logY: boolean;
  xLabel: string;
  yLabel: string;
  /** Phase plots step in fractions of a turn (15°, 45°, 90°); others in 1-2-5. */
  yInDegrees?: boolean;
  onCursor: (index: number | null) => void;
  /** A point chosen from the keyboard: the plot's cursor is moved there. */
  keyboardIndex: number | null;
}

const LABEL_SPACE = { x: 30, y: 28 }; // px from one tick label to the next, at the least
const DECADE_SPACE = { x: 30, y: 18 }; // decades are few and short: closer on a log axis

// uPlot draws; React only hands it data. Recreated when the axes change, data-only updates otherwise.
export default function SweepChart({ x, series, logX, logY, xLabel, yLabel, yInDegrees = false, onCursor, keyboardIndex }: SweepChartProps) {
  const host = useRef<HTMLDivElement>(null);
  const plotRef = useRef<uPlot | null>(null);
  // The latest cursor callback, for uPlot's hook (set after each render, never during one).
  const cursor = useRef(onCursor);
  useEffect(() => {
    cursor.current = onCursor;
  });

  useEffect(() => {
    const el = host.current;
    if (!el) return;
    const width = Math.max(200, el.clientWidth);
    const font = '10px "IBM Plex Sans", sans-serif';
    const axis = { font, labelFont: '11px "IBM Plex Sans", sans-serif', stroke: "#1E2430", grid: { stroke: "#E4DED2", width: 1 }, ticks: { stroke: "#E4DED2" } };
    // uPlot's own axis options: log axes split at decades (1-2-5 within one), linear ones in 1-2-5 steps.
    const ticks = (log: boolean, along: "x" | "y", steps: number[]): Partial<uPlot.Axis> =>
      log
        ? {
            splits: (u, _i, min, max) => logTicks(min, max, (along === "x" ? u.width - 60 : u.height - 50) / DECADE_SPACE[along] + 1),
            // logTicks already spaced them: uPlot's own log filter would thin them again.
            filter: (_u, splits) => splits,
          }
        : { incrs: steps, space: LABEL_SPACE[along] };
    // The labels uPlot draws are also written on the host (data-ticks-x/-y), where a reader or a test can see them.
    const values = (_u: uPlot, splits: number[], axisIndex: number) => {
      const labels = splits.map((v) => (v == null ? "" : engineeringTick(v)));
      el.dataset[axisIndex === 0 ? "ticksX" : "ticksY"] = labels.filter(Boolean).join(" ");
      return labels;
    };
    const opts: uPlot.Options = {
      width,
      height: 210,
      legend: { show: false },
      cursor: { drag: { x: false, y: false }, points: { size: 6 } },
      scales: { x: { time: false, distr: logX ? 3 : 1 }, y: { distr: logY ? 3 : 1 } },
      axes: [
        { ...axis, ...ticks(logX, "x", ONE_TWO_FIVE), label: xLabel, values, size: 30, labelSize: 16 },
        { ...axis, ...ticks(logY, "y", yInDegrees ? DEGREE_STEPS : ONE_TWO_FIVE), label: yLabel, values, size: 52, labelSize: 16 },
      ],
      series: [{ label: xLabel }, ...series.map((s) => ({ label: s.label, stroke: s.color, width: s.dash ? 1 : 1.6, dash: s.dash, points: { show: false } }))],
      hooks: { setCursor: [(u) => cursor.current(u.cursor.idx ?? null)] },
    };
    const data = [x, ...series.map((s) => s.values)] as uPlot.AlignedData;
    const plot = new uPlot(opts, data, el);
    plotRef.current = plot;
    const observer = new ResizeObserver(() => plot.setSize({ width: Math.max(200, el.clientWidth), height: 210 }));
    observer.observe(el);
    return () => {
      observer.disconnect();
      plot.destroy();
      plotRef.current = null;
    };
  }, [x, series, logX, logY, xLabel, yLabel, yInDegrees]);

  useEffect(() => {
    const plot = plotRef.current;
    if (!plot || keyboardIndex === null || x[keyboardIndex] === undefined) return;
    const y = series[0]?.values[keyboardIndex];
    plot.setCursor({ left: plot.valToPos(x[keyboardIndex], "x"), top: y == null ? 0 : plot.valToPos(y, "y") });
  }, [keyboardIndex, x, series]);

  return <div ref={host} className="w-full" data-scale-x={logX ? "log" : "linear"} data-scale-y={logY ? "log" : "linear"} onMouseLeave={() => cursor.current(null)} />;
}
