import "uplot/dist/uPlot.min.css";
import uPlot from "uplot";
import { useEffect, useRef } from "react";

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
  formatX: (v: number) => string;
  formatY: (v: number) => string;
  onCursor: (index: number | null) => void;
  /** A point chosen from the keyboard: the plot's cursor is moved there. */
  keyboardIndex: number | null;
}

// uPlot draws; React only hands it data. Recreated when the axes change, data-only updates otherwise.
export default function SweepChart({ x, series, logX, logY, xLabel, yLabel, formatX, formatY, onCursor, keyboardIndex }: SweepChartProps) {
  const host = useRef<HTMLDivElement>(null);
  const plotRef = useRef<uPlot | null>(null);
  const cursor = useRef(onCursor);
  cursor.current = onCursor;

  useEffect(() => {
    const el = host.current;
    if (!el) return;
    const width = Math.max(200, el.clientWidth);
    const font = '10px "IBM Plex Sans", sans-serif';
    const axis = { font, labelFont: '11px "IBM Plex Sans", sans-serif', stroke: "#1E2430", grid: { stroke: "#E4DED2", width: 1 }, ticks: { stroke: "#E4DED2" } };
    // On a log axis only the decades get a tick, a label and a grid line.
    const isDecade = (v: number) => Math.abs(Math.log10(Math.abs(v)) - Math.round(Math.log10(Math.abs(v)))) < 1e-9;
    const onlyDecades = (_u: uPlot, splits: number[]) => splits.map((v) => (isDecade(v) ? v : null));
    const decades = (log: boolean) =>
      log
        ? { filter: onlyDecades, grid: { ...axis.grid, filter: onlyDecades }, ticks: { ...axis.ticks, filter: onlyDecades } }
        : {};
    const labels = (format: (v: number) => string) => (_u: uPlot, ticks: number[]) => ticks.map((v) => (v == null ? "" : format(v)));
    const opts: uPlot.Options = {
      width,
      height: 210,
      legend: { show: false },
      cursor: { drag: { x: false, y: false }, points: { size: 6 } },
      scales: { x: { time: false, distr: logX ? 3 : 1 }, y: { distr: logY ? 3 : 1 } },
      axes: [
        { ...axis, ...decades(logX), label: xLabel, values: labels(formatX), size: 30, labelSize: 16 },
        { ...axis, ...decades(logY), label: yLabel, values: labels(formatY), size: 52, labelSize: 16 },
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
  }, [x, series, logX, logY, xLabel, yLabel, formatX, formatY]);

  useEffect(() => {
    const plot = plotRef.current;
    if (!plot || keyboardIndex === null || x[keyboardIndex] === undefined) return;
    const y = series[0]?.values[keyboardIndex];
    plot.setCursor({ left: plot.valToPos(x[keyboardIndex], "x"), top: y == null ? 0 : plot.valToPos(y, "y") });
  }, [keyboardIndex, x, series]);

  return <div ref={host} className="w-full" onMouseLeave={() => cursor.current(null)} />;
}
