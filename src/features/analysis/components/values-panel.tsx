import { useDeferredValue, useId, useMemo } from "react";
import { MathTex } from "@/components/ui/math";
import { formatSI, RationalFunction } from "@/lib/engine";
import type { ResultName } from "@/lib/api-contract";
import { readTypedValues, type ExactResults } from "../lib/exact-results";
import { ApproximationControl } from "./approximation-control";
import { RESULT_NAMES, RESULT_UNIT, resultLabel, resultMeaning, resultTex, symbolLabel, symbolUnit } from "@/lib/quantities";

export type TypedValues = Record<string, string>;

interface Evaluated {
  name: ResultName;
  number: number | null;
  exact: string | null;
  remaining: RationalFunction | null;
}

function SymbolInput({ symbol, quantity, value, error, onChange }: { symbol: string; quantity: string | null; value: string; error?: string; onChange: (text: string) => void }) {
  const id = useId();
  const unit = symbolUnit(symbol, quantity);
  return (
    <div className="grid grid-cols-[5.5rem_minmax(0,1fr)] items-center gap-x-2 gap-y-0.5">
      <div className="min-w-0 leading-tight">
        <label htmlFor={id} className="block truncate font-mono text-xs" title={symbol}>
          {symbol}
        </label>
        <span id={`${id}-quantity`} className="block truncate text-[10px] text-ink/50">
          {symbolLabel(symbol, quantity)}
        </span>
      </div>
      <div className="flex items-center rounded border border-rule bg-white focus-within:border-copper">
        <input
          id={id}
          value={value}
          onChange={(e) => onChange(e.target.value)}
          placeholder="symbol"
          inputMode="decimal"
          autoComplete="off"
          spellCheck={false}
          aria-invalid={error ? true : undefined}
          aria-describedby={error ? `${id}-error ${id}-quantity` : `${id}-quantity`}
          className="w-full min-w-0 bg-transparent px-2 py-1 font-mono text-xs focus:outline-none"
        />
        <span className="pr-2 text-xs text-ink/60" aria-label={unit ? `unit ${unit}` : "no unit"}>
          {unit || "—"}
        </span>
      </div>
      {error && (
        <p id={`${id}-error`} className="col-start-2 text-[11px] text-signal">
          {error}
        </p>
      )}
    </div>
  );
}

// Values: numbers typed with SI prefixes, substituted exactly into the stored result in the browser.
export function ValuesPanel({
  exact,
  symbols,
  quantities,
  values,
  onChange,
}: {
  exact: ExactResults;
  symbols: string[];
  quantities: Record<string, string | null>;
  values: TypedValues;
  onChange: (values: TypedValues) => void;
}) {
  const inS = symbols.includes("s");
  const deferred = useDeferredValue(values);
  const parsed = useMemo(() => readTypedValues(deferred), [deferred]);
  const evaluated = useMemo<Evaluated[]>(
    () =>
      RESULT_NAMES.filter((name) => exact[name]).map((name) => {
        const rf = exact[name]!;
        let remaining: RationalFunction;
        try {
          remaining = rf.substitute(parsed.exact);
        } catch {
          return { name, number: Number.NaN, exact: null, remaining: null };
        }
        const constant = remaining.constantValue();
        if (constant) return { name, number: constant.toNumber(), exact: constant.toString(), remaining: null };
        return { name, number: null, exact: null, remaining };
      }),
    [exact, parsed],
  );

  if (symbols.length === 0 && evaluated.length === 0) {
    return <p className="text-sm text-ink/60">No symbols: the results are already numbers.</p>;
  }
  return (
    <div>
      <div className="space-y-1.5">
        {symbols.map((s) => (
          <SymbolInput key={s} symbol={s} quantity={quantities[s] ?? null} value={values[s] ?? ""} error={parsed.errors[s]} onChange={(text) => onChange({ ...values, [s]: text })} />
        ))}
      </div>
      <p className="mt-1.5 text-[11px] text-ink/60">SI prefixes after the digits: T G M k m u µ n p f (4.7k, 10u). Blank keeps the symbol.</p>
      <dl className="mt-3 space-y-2 border-t border-rule pt-2" aria-live="polite" aria-label="Results with these values">
        {evaluated.map((r) => (
          <div key={r.name} data-result={r.name}>
            <dt className="text-xs text-ink/60">
              {resultLabel(r.name, inS)} <span className="text-ink/40">({resultMeaning(r.name, inS)})</span>
            </dt>
            <dd className="min-w-0">
              {r.number !== null ? (
                <span className="font-mono text-base font-medium" title={r.exact ? `exactly ${r.exact} ${RESULT_UNIT[r.name]}` : undefined} data-testid={`value-${r.name}`}>
                  {Number.isFinite(r.number) ? formatSI(r.number, RESULT_UNIT[r.name]) : "not defined at these values"}
                </span>
              ) : r.remaining ? (
                <div className="overflow-x-auto text-sm">
                  <MathTex tex={`${resultTex(r.name, inS)} = ${r.remaining.compactTex()}`} />
                </div>
              ) : (
                <span className="text-xs text-signal">cannot be evaluated at these values (a denominator is zero)</span>
              )}
            </dd>
          </div>
        ))}
      </dl>
      <ApproximationControl exact={exact} point={parsed.exact} />
    </div>
  );
}
