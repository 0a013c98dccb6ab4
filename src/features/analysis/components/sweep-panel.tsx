import { lazy, Suspense, useCallback, useId, useMemo, useState } from "react";
import { Button } from "@/components/ui/button";
import { Progress } from "@/components/ui/states";
import { formatSI } from "@/lib/engine";
import type { ResultName } from "@/types/api";
import { readTypedValues, type ExactResults } from "../lib/exact-results";
import { RESULT_LABEL, RESULT_NAMES, RESULT_UNIT, symbolUnit } from "../lib/quantities";
import { sweepCsv, sweepResult } from "../lib/sweep";
import type { ChartSeries } from "./sweep-chart";
import type { TypedValues } from "./values-panel";

// uPlot arrives only when a sweep is first drawn.
const SweepChart = lazy(() => import("./sweep-chart"));

const select = "mt-0.5 w-full rounded border border-rule bg-white px-1.5 py-1 text-xs";

export function SweepPanel({
  exact,
  symbols,
  quantities,
  values,
  initialSymbol,
}: {
  exact: ExactResults;
  symbols: string[];
  quantities: Record<string, string | null>;
  values: TypedValues;
  initialSymbol?: string;
}) {
  const id = useId();
  const available = RESULT_NAMES.filter((n) => exact[n]);
  const [result, setResult] = useState<ResultName>(available.includes("rth") ? "rth" : (available[0] ?? "rth"));
  const [symbol, setSymbol] = useState(initialSymbol && symbols.includes(initialSymbol) ? initialSymbol : (symbols[0] ?? ""));
  const [fromDecade, setFromDecade] = useState("0");
  const [toDecade, setToDecade] = useState("6");
  const [logX, setLogX] = useState(true);
  const [logY, setLogY] = useState(true);
  const [cursor, setCursor] = useState<number | null>(null);
  const [keyboardIndex, setKeyboardIndex] = useState<number | null>(null);

  const fixed = useMemo(() => readTypedValues(values).exact, [values]);
  const rf = exact[result];
  const outcome = useMemo(() => {
    if (!rf || !symbol) return null;
    return sweepResult(rf, { symbol, fromDecade: Number(fromDecade), toDecade: Number(toDecade), pointsPerDecade: 40 }, fixed);
  }, [rf, symbol, fromDecade, toDecade, fixed]);

  const unit = RESULT_UNIT[result];
  const xUnit = symbolUnit(symbol, quantities[symbol]);
  const positive = outcome?.kind === "ok" && outcome.y.every((v) => Number.isNaN(v) || v > 0);
  const useLogY = logY && positive;

  // A log axis cannot show a zero or negative asymptote.
  const drawn = (limit: number) => !useLogY || limit > 0;
  const series = useMemo<ChartSeries[]>(() => {
    if (outcome?.kind !== "ok") return [];
    const list: ChartSeries[] = [{ label: RESULT_LABEL[result], values: outcome.y.map((v) => (Number.isNaN(v) ? null : v)), color: "#B5562B" }];
    if (outcome.atInfinity !== null && (!useLogY || outcome.atInfinity > 0))
      list.push({ label: `limit as ${symbol} → ∞`, values: outcome.x.map(() => outcome.atInfinity), color: "#2F7D6D", dash: [5, 4] });
    if (outcome.atZero !== null && (!useLogY || outcome.atZero > 0))
      list.push({ label: `limit as ${symbol} → 0`, values: outcome.x.map(() => outcome.atZero), color: "#1E2430", dash: [2, 3] });
    return list;
  }, [outcome, result, symbol, useLogY]);

  const formatX = useCallback((v: number) => formatSI(v, xUnit), [xUnit]);
  const formatY = useCallback((v: number) => formatSI(v, unit), [unit]);

  const download = () => {
    if (outcome?.kind !== "ok") return;
    const blob = new Blob([sweepCsv(symbol, RESULT_LABEL[result], unit, outcome.x, outcome.y)], { type: "text/csv" });
    const url = URL.createObjectURL(blob);
    const a = document.createElement("a");
    a.href = url;
    a.download = `sweep-${RESULT_LABEL[result]}-${symbol}.csv`;
    a.click();
    URL.revokeObjectURL(url);
  };

  if (symbols.length === 0 || available.length === 0) return <p className="text-sm text-ink/60">Nothing to sweep: the results hold no symbols.</p>;

  return (
    <div>
      <div className="grid grid-cols-2 gap-2">
        <div>
          <label htmlFor={`${id}-result`} className="block text-xs font-medium">Plot</label>
          <select id={`${id}-result`} className={select} value={result} onChange={(e) => setResult(e.target.value as ResultName)}>
            {available.map((n) => (
              <option key={n} value={n}>{RESULT_LABEL[n]} ({RESULT_UNIT[n]})</option>
            ))}
          </select>
        </div>
        <div>
          <label htmlFor={`${id}-symbol`} className="block text-xs font-medium">Against</label>
          <select id={`${id}-symbol`} className={`${select} font-mono`} value={symbol} onChange={(e) => setSymbol(e.target.value)}>
            {symbols.map((s) => (
              <option key={s} value={s}>{s}</option>
            ))}
          </select>
        </div>
        <div>
          <label htmlFor={`${id}-from`} className="block text-xs font-medium">From 10^</label>
          <input id={`${id}-from`} type="number" step={1} min={-15} max={15} className={select} value={fromDecade} onChange={(e) => setFromDecade(e.target.value)} />
        </div>
        <div>
          <label htmlFor={`${id}-to`} className="block text-xs font-medium">To 10^</label>
          <input id={`${id}-to`} type="number" step={1} min={-15} max={15} className={select} value={toDecade} onChange={(e) => setToDecade(e.target.value)} />
        </div>
      </div>
      <div className="mt-1.5 flex gap-3 text-xs">
        <label className="flex items-center gap-1">
          <input type="checkbox" checked={logX} onChange={(e) => setLogX(e.target.checked)} className="accent-copper" /> log {symbol || "x"}
        </label>
        <label className="flex items-center gap-1">
          <input type="checkbox" checked={logY} onChange={(e) => setLogY(e.target.checked)} className="accent-copper" /> log {RESULT_LABEL[result]}
        </label>
      </div>
      <div className="mt-2">
        {outcome?.kind === "missing" && (
          <p className="text-xs text-ink/70">
            Give a number in Values for {outcome.symbols.map((s, i) => (
              <span key={s}>
                {i > 0 ? (i === outcome.symbols.length - 1 ? " and " : ", ") : ""}
                <code className="font-mono">{s}</code>
              </span>
            ))}{" "}
            to sweep {RESULT_LABEL[result]} against {symbol}.
          </p>
        )}
        {outcome?.kind === "invalid" && <p className="text-xs text-signal">{outcome.reason}</p>}
        {outcome?.kind === "ok" && (
          <>
            {logY && !positive && <p className="mb-1 text-[11px] text-copper">{RESULT_LABEL[result]} is not positive over this range: linear axis shown.</p>}
            <figure aria-label={`Sweep of ${RESULT_LABEL[result]} against ${symbol}`} data-testid="sweep-plot">
              <Suspense fallback={<Progress label="Drawing the sweep…" />}>
                <SweepChart x={outcome.x} series={series} logX={logX} logY={useLogY} xLabel={symbol} yLabel={`${RESULT_LABEL[result]} (${unit})`} formatX={formatX} formatY={formatY} onCursor={setCursor} keyboardIndex={keyboardIndex} />
              </Suspense>
              <label className="mt-1 block text-[11px] text-ink/60">
                Read at a point (arrow keys)
                <input
                  type="range"
                  min={0}
                  max={outcome.x.length - 1}
                  value={cursor ?? 0}
                  onChange={(e) => {
                    const index = Number(e.target.value);
                    setKeyboardIndex(index);
                    setCursor(index);
                  }}
                  className="block w-full accent-copper"
                />
              </label>
              <figcaption className="mt-1 min-h-[2.5rem] font-mono text-[11px] text-ink/80" aria-live="polite">
                {cursor !== null && outcome.x[cursor] !== undefined ? (
                  <>
                    {symbol} = {formatSI(outcome.x[cursor], xUnit)}, {RESULT_LABEL[result]} = {Number.isNaN(outcome.y[cursor]) ? "not defined" : formatSI(outcome.y[cursor], unit)}
                  </>
                ) : (
                  <span className="font-sans text-ink/50">Point at the plot for a readout.</span>
                )}
                {outcome.atInfinity !== null && (
                  <span className="block font-sans text-verdigris">
                    {drawn(outcome.atInfinity) ? "dashed: " : ""}limit as {symbol} → ∞ = {formatSI(outcome.atInfinity, unit)}
                  </span>
                )}
                {outcome.atZero !== null && (
                  <span className="block font-sans text-ink/70">
                    {drawn(outcome.atZero) ? "dotted: " : ""}limit as {symbol} → 0 = {formatSI(outcome.atZero, unit)}
                  </span>
                )}
              </figcaption>
            </figure>
            <Button onClick={download} className="mt-1 px-2 py-1 text-xs">
              Download CSV
            </Button>
          </>
        )}
      </div>
    </div>
  );
}
