import { useId, useMemo, useState } from "react";
import { MathTex } from "@/components/ui/math";
import { RationalFunction, type Limit } from "@/lib/engine";
import type { ResultName } from "@/lib/api-contract";
import type { ExactResults } from "../lib/exact-results";
import { limitWithSigns, positiveSymbols } from "../lib/limit-sign";
import { RESULT_NAMES, resultLabel, resultTex } from "@/lib/quantities";

type Point = "inf" | "zero";

function limitTex(limit: Limit): string {
  if (limit.kind === "finite") return limit.value.compactTex();
  if (limit.sign === 1) return "+\\infty";
  if (limit.sign === -1) return "-\\infty";
  return "\\pm\\infty";
}

interface LimitRow {
  name: ResultName;
  limit: Limit | null;
  leading: RationalFunction | null;
  error: string | null;
}

// Limits: one symbol to infinity or to zero; the exact limit and the leading-order form of each result.
export function LimitsPanel({ exact, symbols, initialSymbol, quantities = {} }: { exact: ExactResults; symbols: string[]; initialSymbol?: string; quantities?: Record<string, string | null> }) {
  const inS = symbols.includes("s");
  const positive = useMemo(() => positiveSymbols(quantities), [quantities]);
  const selectId = useId();
  const [symbol, setSymbol] = useState(initialSymbol && symbols.includes(initialSymbol) ? initialSymbol : (symbols[0] ?? ""));
  const [to, setTo] = useState<Point>("inf");
  const rows = useMemo<LimitRow[]>(
    () =>
      RESULT_NAMES.filter((n) => exact[n]).map((name) => {
        const rf = exact[name]!;
        if (!symbol) return { name, limit: null, leading: null, error: null };
        try {
          return { name, limit: limitWithSigns(rf, symbol, to, positive), leading: rf.leadingOrder(symbol, to), error: null };
        } catch (error) {
          return { name, limit: null, leading: null, error: error instanceof Error ? error.message : "no limit" };
        }
      }),
    [exact, symbol, to, positive],
  );
  if (symbols.length === 0) return <p className="text-sm text-ink/60">No symbols to take a limit in.</p>;
  const symbolTex = symbol ? RationalFunction.variable(symbol).toTex() : "";
  const pointTex = to === "inf" ? "\\infty" : "0";
  return (
    <div>
      <div className="flex flex-wrap items-end gap-3">
        <div>
          <label htmlFor={selectId} className="block text-xs font-medium">
            Symbol
          </label>
          <select id={selectId} value={symbol} onChange={(e) => setSymbol(e.target.value)} className="mt-0.5 rounded border border-rule bg-white px-2 py-1 font-mono text-xs">
            {symbols.map((s) => (
              <option key={s} value={s}>
                {s}
              </option>
            ))}
          </select>
        </div>
        <fieldset className="flex gap-2 text-xs">
          <legend className="mb-0.5 font-medium">Goes to</legend>
          {(["inf", "zero"] as Point[]).map((p) => (
            <label key={p} className="flex items-center gap-1">
              <input type="radio" name={`${selectId}-to`} value={p} checked={to === p} onChange={() => setTo(p)} className="accent-copper" />
              {p === "inf" ? "→ ∞" : "→ 0"}
            </label>
          ))}
        </fieldset>
      </div>
      <dl className="mt-3 space-y-2.5" aria-live="polite" aria-label={`Limits as ${symbol} goes to ${to === "inf" ? "infinity" : "zero"}`}>
        {rows.map((row) => (
          <div key={row.name} data-limit={row.name}>
            <dt className="text-xs text-ink/60">{resultLabel(row.name, inS)}</dt>
            <dd className="overflow-x-auto text-sm">
              {row.error ? (
                <span className="text-xs text-signal">{row.error}</span>
              ) : row.limit ? (
                <>
                  <MathTex tex={`\\lim_{${symbolTex} \\to ${pointTex}} ${resultTex(row.name, inS)} = ${limitTex(row.limit)}`} />
                  {row.limit.kind === "infinite" && (
                    <span className="block text-[11px] text-ink/60">
                      {row.limit.sign === 0 ? "unbounded; its sign is set by symbols whose sign is not known (gains, sources)" : "unbounded"}
                    </span>
                  )}
                  {row.leading && (
                    <div className="text-xs text-ink/70">
                      leading order: <MathTex tex={`${resultTex(row.name, inS)} \\sim ${row.leading.compactTex()}`} />
                      <code className="mt-0.5 block font-mono text-[10px] text-ink/50" data-leading-infix>
                        {row.leading.compactInfix()}
                      </code>
                    </div>
                  )}
                </>
              ) : null}
            </dd>
          </div>
        ))}
      </dl>
    </div>
  );
}
