import { lazy, Suspense, useId, useMemo, useState } from "react";
import { Button } from "@/components/ui/button";
import { Progress } from "@/components/ui/states";
import { formatSI } from "@/lib/engine";
import { downloadText } from "@/lib/download";
import type { ResultName } from "@/lib/api-contract";
import { readTypedValues, type ExactResults } from "../lib/exact-results";
import { RESULT_NAMES, RESULT_UNIT, resultLabel, symbolUnit } from "@/lib/quantities";
import { notLogRange, sweepCsv, sweepResult } from "../lib/sweep";
import { readTypedNumber } from "../lib/typed-number";
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
  inS = false,
}: {
  exact: ExactResults;
  symbols: string[];
  quantities: Record<string, string | null>;
  values: TypedValues;
  initialSymbol?: string;
  /** Whether the results depend on s (L or C in the network): Rth is then named Zth(s). */
  inS?: boolean;
}) {
  const id = useId();
  const available = RESULT_NAMES.filter((n) => exact[n]);
  const [result, setResult] = useState<ResultName>(available.includes("rth") ? "rth" : (available[0] ?? "rth"));
  const [symbol, setSymbol] = useState(initialSymbol && symbols.includes(initialSymbol) ? initialSymbol : (symbols[0] ?? ""));
  const [fromText, setFromText] = useState("1");
  const [toText, setToText] = useState("1M");
  const [logX, setLogX] = useState(true);
  const [logY, setLogY] = useState(true);
  // Why a log box was unticked (or refused): said beside the boxes until the next change.
  const [axisNotes, setAxisNotes] = useState<{ x?: string; y?: string }>({});
  const [cursor, setCursor] = useState<number | null>(null);
  const [keyboardIndex, setKeyboardIndex] = useState<number | null>(null);

  const unit = RESULT_UNIT[result];
  const xUnit = symbolUnit(symbol, quantities[symbol]);
  const { range, rangeError } = useMemo(() => {
    const from = readTypedNumber(fromText, xUnit);
    const to = readTypedNumber(toText, xUnit);
    if ("error" in from) return { range: null, rangeError: `From: ${from.error}.` };
    if ("error" in to) return { range: null, rangeError: `To: ${to.error}.` };
    return { range: { from: from.value.toNumber(), to: to.value.toNumber() }, rangeError: null };
  }, [fromText, toText, xUnit]);
  const notLogX = range ? notLogRange(range.from, range.to) : null;

  // A log box never stays ticked on a range a log axis cannot show (state adjusted while rendering,
  // so the unticked box and its note show in the same paint as the new range).
  if (logX && notLogX) {
    setLogX(false);
    setAxisNotes((n) => ({ ...n, x: `${notLogX} Log ${symbol} unticked.` }));
  } else if (!notLogX && axisNotes.x) setAxisNotes((n) => ({ ...n, x: undefined })); // the reason is gone: so is the note

  const fixed = useMemo(() => readTypedValues(values).exact, [values]);
  const rf = exact[result];
  const scale = logX && !notLogX ? "log" : "linear";
  const outcome = useMemo(() => {
    if (!rf || !symbol || !range) return null;
    return sweepResult(rf, { symbol, from: range.from, to: range.to, scale }, fixed);
  }, [rf, symbol, range, scale, fixed]);

  const positive = outcome?.kind === "ok" && outcome.y.every((v) => Number.isNaN(v) || v > 0);
  const yName = resultLabel(result, inS);
  if (logY && outcome?.kind === "ok" && !positive) {
    setLogY(false);
    setAxisNotes((n) => ({ ...n, y: `${yName} is not positive over this range: a log axis cannot show it. Log ${yName} unticked.` }));
  } else if (positive && axisNotes.y) setAxisNotes((n) => ({ ...n, y: undefined }));
  const useLogY = logY && positive;
  // Why a log box cannot be ticked now, or null when it can.
  const refusal = (axis: "x" | "y"): string | null => {
    if (axis === "x") return notLogX ? `${notLogX} Log ${symbol} stays unticked.` : null;
    return outcome?.kind === "ok" && !positive ? `${yName} is not positive over this range: log stays unticked.` : null;
  };
  const tick = (axis: "x" | "y", checked: boolean) => {
    const reason = checked ? refusal(axis) : null;
    setAxisNotes((n) => ({ ...n, [axis]: reason ?? undefined }));
    if (!reason) (axis === "x" ? setLogX : setLogY)(checked);
  };

  // A log axis cannot show a zero or negative asymptote.
  const drawn = (limit: number) => !useLogY || limit > 0;
  const series = useMemo<ChartSeries[]>(() => {
    if (outcome?.kind !== "ok") return [];
    const list: ChartSeries[] = [{ label: yName, values: outcome.y.map((v) => (Number.isNaN(v) ? null : v)), color: "#B5562B" }];
    if (outcome.atInfinity !== null && (!useLogY || outcome.atInfinity > 0))
      list.push({ label: `limit as ${symbol} → ∞`, values: outcome.x.map(() => outcome.atInfinity), color: "#2F7D6D", dash: [5, 4] });
    if (outcome.atZero !== null && (!useLogY || outcome.atZero > 0))
      list.push({ label: `limit as ${symbol} → 0`, values: outcome.x.map(() => outcome.atZero), color: "#1E2430", dash: [2, 3] });
    return list;
  }, [outcome, yName, symbol, useLogY]);

  const download = () => {
    if (outcome?.kind !== "ok") return;
    downloadText(`sweep-${yName}-${symbol}.csv`, sweepCsv(symbol, yName, unit, outcome.x, outcome.y), "text/csv");
  };

  if (symbols.length === 0 || available.length === 0) return <p className="text-sm text-ink/60">Nothing to sweep: the results hold no symbols.</p>;

  return (
    <div>
      <div className="grid grid-cols-2 gap-2">
        <div>
          <label htmlFor={`${id}-result`} className="block text-xs font-medium">Plot</label>
          <select id={`${id}-result`} className={select} value={result} onChange={(e) => setResult(e.target.value as ResultName)}>
            {available.map((n) => (
              <option key={n} value={n}>{resultLabel(n, inS)} ({RESULT_UNIT[n]})</option>
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
          <label htmlFor={`${id}-from`} className="block text-xs font-medium">From</label>
          <span className="mt-0.5 flex items-center rounded border border-rule bg-white focus-within:border-copper">
            <input id={`${id}-from`} value={fromText} onChange={(e) => setFromText(e.target.value)} autoComplete="off" spellCheck={false} className="w-full min-w-0 bg-transparent px-1.5 py-1 font-mono text-xs focus:outline-none" />
            {xUnit && <span className="pr-1.5 text-xs text-ink/60">{xUnit}</span>}
          </span>
        </div>
        <div>
          <label htmlFor={`${id}-to`} className="block text-xs font-medium">To</label>
          <span className="mt-0.5 flex items-center rounded border border-rule bg-white focus-within:border-copper">
            <input id={`${id}-to`} value={toText} onChange={(e) => setToText(e.target.value)} autoComplete="off" spellCheck={false} className="w-full min-w-0 bg-transparent px-1.5 py-1 font-mono text-xs focus:outline-none" />
            {xUnit && <span className="pr-1.5 text-xs text-ink/60">{xUnit}</span>}
          </span>
        </div>
      </div>
      <div className="mt-1.5 flex gap-3 text-xs">
        <label className="flex items-center gap-1">
          <input type="checkbox" checked={logX} onChange={(e) => tick("x", e.target.checked)} className="accent-copper" /> log {symbol || "x"}
        </label>
        <label className="flex items-center gap-1">
          <input type="checkbox" checked={logY} onChange={(e) => tick("y", e.target.checked)} className="accent-copper" /> log {yName}
        </label>
      </div>
      {(axisNotes.x || axisNotes.y) && (
        <p role="status" aria-label="Sweep axes" className="mt-1 text-[11px] text-copper">
          {[axisNotes.x, axisNotes.y].filter(Boolean).join(" ")}
        </p>
      )}
      <div className="mt-2">
        {outcome?.kind === "missing" && (
          <p className="text-xs text-ink/70">
            Give a number in Values for {outcome.symbols.map((s, i) => (
              <span key={s}>
                {i > 0 ? (i === outcome.symbols.length - 1 ? " and " : ", ") : ""}
                <code className="font-mono">{s}</code>
              </span>
            ))}{" "}
            to sweep {yName} against {symbol}.
          </p>
        )}
        {rangeError && <p className="text-xs text-signal">{rangeError}</p>}
        {outcome?.kind === "invalid" && <p className="text-xs text-signal">{outcome.reason}</p>}
        {outcome?.kind === "ok" && (
          <>
            <figure aria-label={`Sweep of ${yName} against ${symbol}`} data-testid="sweep-plot">
              <Suspense fallback={<Progress label="Drawing the sweep…" />}>
                <SweepChart x={outcome.x} series={series} logX={scale === "log"} logY={useLogY} xLabel={xUnit ? `${symbol} (${xUnit})` : symbol} yLabel={unit ? `${yName} (${unit})` : yName} onCursor={setCursor} keyboardIndex={keyboardIndex} />
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
                    {symbol} = {formatSI(outcome.x[cursor], xUnit)}, {yName} = {Number.isNaN(outcome.y[cursor]) ? "not defined" : formatSI(outcome.y[cursor], unit)}
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
