import { lazy, Suspense, useMemo } from "react";
import { MathTex } from "@/components/ui/math";
import { Progress } from "@/components/ui/states";
import { formatSI, readExpression, type RationalFunction } from "@/lib/engine";
import type { ChartSeries } from "@/features/analysis/components/sweep-chart";
import { readTypedValues, type ExactResults } from "@/features/analysis/lib/exact-results";
import type { TypedValues } from "@/features/analysis/components/values-panel";
import { frequencyLimit, frequencyResponse, frequencySpan, logFrequencies, numericCoefficientsInS, polesAndZeros, type PolesZeros, type SRoot } from "../lib/frequency";

// uPlot arrives only when a Bode plot is first drawn.
const Chart = lazy(() => import("@/features/analysis/components/sweep-chart"));

const LIMIT_LABEL = { dc: "DC (s → 0)", hf: "high frequency (s → ∞)" } as const;

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
const formatHz = (v: number) => formatSI(v, "Hz");
const formatOhm = (v: number) => formatSI(v, "Ω");
const formatDeg = (v: number) => `${Math.round(v)}°`;

// Zth over frequency: |Zth(j2πf)| and its phase, with the exact DC and high-frequency limits marked.
export function FrequencyPanel({ exact, values }: { exact: ExactResults; values: TypedValues }) {
  const zth = exact.rth;
  // A typed value of s itself (for a DC reading in Values) must not flatten the plot.
  const given = useMemo(() => {
    const { s: _s, ...rest } = readTypedValues(values).exact;
    return rest;
  }, [values]);
  const limits = useMemo(() => (zth ? { dc: frequencyLimit(zth, "zero"), hf: frequencyLimit(zth, "inf") } : null), [zth]);
  const numeric = useMemo(() => (zth ? numericCoefficientsInS(zth, given) : null), [zth, given]);
  const roots = useMemo<PolesZeros | null>(() => {
    if (!zth || !numeric || "missing" in numeric) return null;
    const pz = polesAndZeros(zth, given);
    return "missing" in pz ? null : pz;
  }, [zth, numeric, given]);
  const plot = useMemo(() => {
    if (!numeric || "missing" in numeric || !roots) return null;
    const [lo, hi] = frequencySpan([roots]);
    const f = logFrequencies(lo, hi, 241);
    const { magnitude, phase } = frequencyResponse(numeric, f);
    const at = (limit: RationalFunction | null) => {
      const c = limit?.substitute(given).constantValue();
      return c ? Math.abs(c.toNumber()) : null;
    };
    const dc = limits?.dc.kind === "finite" ? at(readExpression(limits.dc.value!)) : null;
    const hf = limits?.hf.kind === "finite" ? at(readExpression(limits.hf.value!)) : null;
    const mag: ChartSeries[] = [{ label: "|Zth|", values: magnitude.map((m) => (Number.isFinite(m) && m > 0 ? m : null)), color: "#B5562B" }];
    if (dc !== null && dc > 0) mag.push({ label: "DC limit", values: f.map(() => dc), color: "#2F7D6D", dash: [5, 4] });
    if (hf !== null && hf > 0) mag.push({ label: "high-frequency limit", values: f.map(() => hf), color: "#1E2430", dash: [2, 3] });
    const ph: ChartSeries[] = [{ label: "phase of Zth", values: phase.map((p) => (Number.isFinite(p) ? p : null)), color: "#B5562B" }];
    return { f, mag, ph, dc, hf };
  }, [numeric, roots, limits, given]);

  if (!zth || !limits) return <p className="text-sm text-ink/60">No Thevenin impedance for this port.</p>;
  return (
    <div className="space-y-3">
      <dl className="space-y-1.5" aria-label="Frequency limits of Zth">
        {(["dc", "hf"] as const).map((k) => (
          <div key={k} data-limit={k}>
            <dt className="text-xs text-ink/60">Zth at {LIMIT_LABEL[k]}</dt>
            <dd className="overflow-x-auto text-sm">
              {limits[k].kind === "finite" ? <MathTex tex={`Z_{\\mathrm{th}} \\to ${limits[k].tex}`} /> : <span className="text-xs">unbounded (the port is open there: no Thevenin form)</span>}
            </dd>
          </div>
        ))}
      </dl>
      {numeric && "missing" in numeric ? (
        <p className="text-xs text-ink/60" role="status">
          Give {numeric.missing.join(", ")} a value in Values to draw the Bode plot and list the poles and zeros.
        </p>
      ) : (
        plot && (
          <>
            <figure aria-label="Bode plot of Zth">
              <Suspense fallback={<Progress label="Drawing the Bode plot" />}>
                <Chart x={plot.f} series={plot.mag} logX logY xLabel="frequency" yLabel="|Zth|" formatX={formatHz} formatY={formatOhm} onCursor={noCursor} keyboardIndex={null} />
                <Chart x={plot.f} series={plot.ph} logX logY={false} xLabel="frequency" yLabel="phase" formatX={formatHz} formatY={formatDeg} onCursor={noCursor} keyboardIndex={null} />
              </Suspense>
              <figcaption className="mt-1 text-[11px] text-ink/60">
                |Zth(j2πf)| and its phase. Dashed: the exact DC limit{plot.dc !== null ? ` (${formatSI(plot.dc, "Ω")})` : " (unbounded)"} and the high-frequency limit
                {plot.hf !== null ? ` (${formatSI(plot.hf, "Ω")})` : " (unbounded)"}.
              </figcaption>
            </figure>
            {roots && (
              <dl className="space-y-1.5" aria-label="Poles and zeros of Zth">
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
