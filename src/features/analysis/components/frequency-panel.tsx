import { lazy, Suspense, useId, useMemo, useState } from "react";
import { Button } from "@/components/ui/button";
import { MathTex } from "@/components/ui/math";
import { Progress } from "@/components/ui/states";
import { formatSI, readExpression } from "@/lib/engine";
import type { Circuit } from "@/lib/api-contract";
import type { ChartSeries } from "./sweep-chart";
import { engineeringTick } from "../lib/axis-ticks";
import { readTypedValues, type ExactResults } from "../lib/exact-results";
import { POINTS_PER_DECADE } from "../lib/sweep";
import { readTypedNumber } from "../lib/typed-number";
import type { TypedValues } from "./values-panel";
import { downloadText } from "@/lib/download";
import { bodeCsv, bodeFunctions, magnitudeName, readFrequencyRange, toDb, type BodeFunction } from "../lib/bode";
import { frequencyLimit, frequencyResponse, frequencySpan, independentSourcesOf, logFrequencies, numericCoefficientsInS, openCircuitTransfer, polesAndZeros, type SRoot } from "@/lib/engine-frequency";

// uPlot arrives only when a Bode plot is first drawn.
const Chart = lazy(() => import("./sweep-chart"));

const LIMIT_LABEL = { dc: "DC (s → 0)", hf: "high frequency (s → ∞)" } as const;
const field = "mt-0.5 flex items-center rounded border border-rule bg-white focus-within:border-copper";
const fieldInput = "w-full min-w-0 bg-transparent px-1.5 py-1 font-mono text-xs focus:outline-none";

function rootText(r: SRoot): string {
  if (r.re === 0 && r.im === 0) return "s = 0";
  const re = r.re === 0 ? "" : formatSI(r.re, "rad/s");
  const im = r.im === 0 ? "" : `${r.im < 0 ? " − " : re ? " + " : ""}j${formatSI(Math.abs(r.im), "rad/s")}`;
  return `s = ${re}${im} (${formatSI(r.hz, "Hz")})`;
}

function RootList({ label, roots }: { label: string; roots: SRoot[] }) {
  return (
    <div>
      <dt className="text-xs text-ink/60">{label}</dt>
      <dd>
        {roots.length === 0 ? (
          <span className="text-xs text-ink/60">none</span>
        ) : (
          <ul className="font-mono text-xs" aria-label={label}>
            {roots.map((r, i) => (
              <li key={i}>{rootText(r)}</li>
            ))}
          </ul>
        )}
      </dd>
    </div>
  );
}

const noCursor = () => {};

// A limit is drawn dashed only where the magnitude axis can show it (above zero).
function limitText(which: string, value: number | null, unit: string): string {
  if (value === null) return `${which} limit: unbounded`;
  return `${which} limit (${formatSI(value, unit)}): ${value > 0 ? "dashed" : "not drawn"}`;
}

// Over frequency: the open-circuit transfer from the independent source (or Vth, said as such) and
// Zth(jω), magnitude in dB or linear and phase in degrees over a range the designer sets, with the
// exact DC and high-frequency limits, the poles and zeros, a readout at one frequency and a CSV.
export function FrequencyPanel({ exact, values, circuit }: { exact: ExactResults; values: TypedValues; circuit?: Circuit }) {
  const id = useId();
  const zth = exact.rth;
  const sources = useMemo(() => (circuit ? independentSourcesOf(circuit) : null), [circuit]);
  const { functions, sourceNote } = useMemo(() => bodeFunctions(zth, openCircuitTransfer(exact.vth, sources), exact.vth), [zth, exact.vth, sources]);
  const [chosen, setChosen] = useState<BodeFunction["key"]>(functions[0]?.key ?? "zth");
  const fn = functions.find((f) => f.key === chosen) ?? functions[0];
  const [db, setDb] = useState(true);
  const [range, setRange] = useState<{ start: string; stop: string } | null>(null);
  const [at, setAt] = useState("");

  // A typed value of s itself (for a DC reading in Values) must not flatten the plot.
  const given = useMemo(() => {
    const { s: _s, ...rest } = readTypedValues(values).exact;
    return rest;
  }, [values]);
  const zthLimits = useMemo(() => (zth ? { dc: frequencyLimit(zth, "zero"), hf: frequencyLimit(zth, "inf") } : null), [zth]);
  const numeric = useMemo(() => (fn ? numericCoefficientsInS(fn.f, given) : null), [fn, given]);
  const roots = useMemo(() => {
    if (!fn || !numeric || "missing" in numeric) return null;
    const pz = polesAndZeros(fn.f, given);
    return "missing" in pz ? null : pz;
  }, [fn, numeric, given]);
  // Until the designer types a range, two decades either side of every pole and zero.
  const auto = useMemo(() => (roots ? frequencySpan([roots]).map(engineeringTick) : ["1", "1M"]), [roots]);
  const startText = range?.start ?? auto[0];
  const stopText = range?.stop ?? auto[1];
  const span = useMemo(() => readFrequencyRange(startText, stopText), [startText, stopText]);

  const plot = useMemo(() => {
    if (!fn || !numeric || "missing" in numeric || "error" in span) return null;
    const f = logFrequencies(span.start, span.stop, Math.max(2, Math.round(Math.log10(span.stop / span.start) * POINTS_PER_DECADE) + 1));
    const { magnitude, phase } = frequencyResponse(numeric, f);
    const limitOf = (to: "zero" | "inf") => {
      const limit = frequencyLimit(fn.f, to);
      const c = limit.kind === "finite" ? readExpression(limit.value!).substitute(given).constantValue() : null;
      return c ? Math.abs(c.toNumber()) : null;
    };
    const [dc, hf] = [limitOf("zero"), limitOf("inf")];
    const shown = (m: number) => (db ? toDb(m) : m);
    const usable = (m: number) => Number.isFinite(m) && m > 0;
    const mag: ChartSeries[] = [{ label: magnitudeName(fn), values: magnitude.map((m) => (usable(m) ? shown(m) : null)), color: "#B5562B" }];
    if (dc !== null && dc > 0) mag.push({ label: "DC limit", values: f.map(() => shown(dc)), color: "#2F7D6D", dash: [5, 4] });
    if (hf !== null && hf > 0) mag.push({ label: "high-frequency limit", values: f.map(() => shown(hf)), color: "#1E2430", dash: [2, 3] });
    const ph: ChartSeries[] = [{ label: `phase of ${fn.name}`, values: phase.map((p) => (Number.isFinite(p) ? p : null)), color: "#B5562B" }];
    return { f, magnitude, phase, mag, ph, dc, hf };
  }, [fn, numeric, span, db, given]);

  if (!zth || !zthLimits || !fn) return <p className="text-sm text-ink/60">No Thevenin impedance for this port.</p>;
  const magUnit = db ? fn.dbUnit : fn.unit;
  const readAt = at.trim() ? readTypedNumber(at, "Hz") : null;
  const reading = readAt && "value" in readAt && numeric && !("missing" in numeric) ? (() => {
    const f = readAt.value.toNumber();
    if (!(f > 0)) return { error: "a frequency above 0 Hz" };
    const { magnitude, phase } = frequencyResponse(numeric, [f]);
    return { f, magnitude: magnitude[0], phase: phase[0] };
  })() : readAt && "error" in readAt ? { error: readAt.error } : null;

  return (
    <div className="space-y-3">
      <dl className="space-y-1.5" aria-label="Frequency limits of Zth">
        {(["dc", "hf"] as const).map((k) => (
          <div key={k} data-limit={k}>
            <dt className="text-xs text-ink/60">Zth at {LIMIT_LABEL[k]}</dt>
            <dd className="overflow-x-auto text-sm">
              {zthLimits[k].kind === "finite" ? <MathTex tex={`Z_{\\mathrm{th}} \\to ${zthLimits[k].tex}`} /> : <span className="text-xs">unbounded (the port is open there: no Thevenin form)</span>}
            </dd>
          </div>
        ))}
      </dl>
      <div className="grid grid-cols-2 gap-2">
        <div className="text-xs">
          <label className="block font-medium" htmlFor={`${id}-plot`}>
            Plot
          </label>
          <select id={`${id}-plot`} className="mt-0.5 w-full rounded border border-rule bg-white px-1.5 py-1 text-xs" value={fn.key} onChange={(e) => setChosen(e.target.value as BodeFunction["key"])}>
            {functions.map((f) => (
              <option key={f.key} value={f.key}>
                {f.name}
              </option>
            ))}
          </select>
        </div>
        <fieldset className="text-xs">
          <legend className="font-medium">Magnitude</legend>
          <div className="mt-1 flex gap-2">
            {([true, false] as const).map((inDb) => (
              <label key={String(inDb)} className="flex items-center gap-1">
                <input type="radio" name={`${id}-mag`} checked={db === inDb} onChange={() => setDb(inDb)} className="accent-copper" />
                {inDb ? "dB" : "linear"}
              </label>
            ))}
          </div>
        </fieldset>
        {(["start", "stop"] as const).map((end) => (
          <div key={end} className="text-xs">
            <label className="block font-medium" htmlFor={`${id}-${end}`}>
              {end === "start" ? "From" : "To"}
            </label>
            <span className={field}>
              <input
                id={`${id}-${end}`}
                value={end === "start" ? startText : stopText}
                onChange={(e) => setRange({ start: startText, stop: stopText, [end]: e.target.value })}
                autoComplete="off"
                spellCheck={false}
                aria-invalid={"error" in span && span.error.startsWith(end === "start" ? "Start" : "Stop") ? true : undefined}
                className={fieldInput}
              />
              <span className="pr-1.5 text-xs text-ink/60">Hz</span>
            </span>
          </div>
        ))}
      </div>
      <p className="text-[11px] text-ink/70" data-testid="frequency-source-note">
        {sourceNote}
      </p>
      {"error" in span && (
        <p role="alert" className="text-xs text-signal">
          {span.error}
        </p>
      )}
      {numeric && "missing" in numeric ? (
        <p className="text-xs text-ink/60" role="status">
          Give {numeric.missing.join(", ")} a value in Values to draw the Bode plot and list the poles and zeros.
        </p>
      ) : (
        plot && (
          <>
            <figure aria-label={`Bode plot of ${fn.name.replace("(s)", "")}`}>
              <Suspense fallback={<Progress label="Drawing the Bode plot" />}>
                <Chart x={plot.f} series={plot.mag} logX logY={!db} xLabel="frequency (Hz)" yLabel={`${magnitudeName(fn)} (${magUnit})`} onCursor={noCursor} keyboardIndex={null} />
                <Chart x={plot.f} series={plot.ph} logX logY={false} yInDegrees xLabel="frequency (Hz)" yLabel="phase (°)" onCursor={noCursor} keyboardIndex={null} />
              </Suspense>
              <figcaption className="mt-1 text-[11px] text-ink/60">
                {magnitudeName(fn).replace(/\|$/, "(j2πf)|")} {db ? `in ${fn.dbUnit} (20·log₁₀)` : `in ${fn.unit}`} and its phase. Exact {limitText("DC", plot.dc, fn.unit)}; {limitText("high-frequency", plot.hf, fn.unit)}.
              </figcaption>
            </figure>
            <div className="flex flex-wrap items-end gap-2">
              <div className="text-xs">
                <label className="block font-medium" htmlFor={`${id}-at`}>
                  Read at
                </label>
                <span className={field}>
                  <input id={`${id}-at`} value={at} onChange={(e) => setAt(e.target.value)} placeholder="e.g. 1k" autoComplete="off" spellCheck={false} className={`${fieldInput} w-24`} />
                  <span className="pr-1.5 text-xs text-ink/60">Hz</span>
                </span>
              </div>
              <Button onClick={() => downloadText(`bode-${fn.name.replace(/[^A-Za-z0-9]+/g, "-")}.csv`, bodeCsv(fn, plot.f, plot.magnitude, plot.phase), "text/csv")} className="px-2 py-1 text-xs">
                Download CSV
              </Button>
            </div>
            <p className="min-h-[1.25rem] font-mono text-[11px] text-ink/80" aria-live="polite" data-testid="bode-reading">
              {reading && "error" in reading ? (
                <span className="font-sans text-signal">Read at: {reading.error}</span>
              ) : reading ? (
                `f = ${formatSI(reading.f, "Hz")}: ${magnitudeName(fn)} = ${formatSI(reading.magnitude, fn.unit)} = ${toDb(reading.magnitude).toFixed(2)} ${fn.dbUnit}, phase ${reading.phase.toFixed(1)}°`
              ) : (
                <span className="font-sans text-ink/50">Type a frequency for a reading.</span>
              )}
            </p>
            {roots && (
              <dl className="space-y-1.5" aria-label={`Poles and zeros of ${fn.name.replace("(s)", "")}`}>
                <RootList label="Poles" roots={roots.poles} />
                <RootList label="Zeros" roots={roots.zeros} />
              </dl>
            )}
          </>
        )
      )}
    </div>
  );
}
