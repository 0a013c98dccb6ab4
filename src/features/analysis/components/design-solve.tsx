import { useId, useMemo, useState } from "react";
import { Button } from "@/components/ui/button";
import { MathTex } from "@/components/ui/math";
import { formatSI, readExpression } from "@/lib/engine";
import { readTypedNumber } from "../lib/typed-number";
import { readTypedValues, type ExactResults } from "../lib/exact-results";
import { RESULT_LABEL, RESULT_NAMES, RESULT_UNIT, symbolUnit } from "@/lib/quantities";
import type { TypedValues } from "./values-panel";
import type { Quantity } from "@/lib/engine-netlist";
import type { ResultName } from "@/lib/api-contract";
import { designSolve, type DesignSolveAnswer } from "@/lib/engine-frequency";

const select = "mt-0.5 w-full rounded border border-rule bg-white px-1.5 py-1 text-xs";

// Design solve: which value of one symbol makes a result meet a target, the other symbols at their typed values.
export function DesignSolve({ exact, symbols, quantities, values }: { exact: ExactResults; symbols: string[]; quantities: Record<string, string | null>; values: TypedValues }) {
  const id = useId();
  const available = RESULT_NAMES.filter((n) => exact[n]);
  const choices = symbols.filter((s) => s !== "s");
  const [result, setResult] = useState<ResultName>(available.includes("rth") ? "rth" : (available[0] ?? "rth"));
  const [symbol, setSymbol] = useState(choices[choices.length - 1] ?? "");
  const [target, setTarget] = useState("");
  const [answer, setAnswer] = useState<{ answer: DesignSolveAnswer; symbol: string; unit: string } | { error: string } | null>(null);
  const given = useMemo(() => readTypedValues(values).exact, [values]);
  const unit = RESULT_UNIT[result];

  if (available.length === 0 || choices.length === 0) return null;
  const solve = () => {
    const rf = exact[result];
    if (!rf || !symbol) return;
    const t = readTypedNumber(target, unit);
    if ("error" in t) return setAnswer({ error: `Target: ${t.error}` });
    const quantity = (quantities[symbol] ?? null) as Quantity | null;
    const a = designSolve({ result: rf, label: RESULT_LABEL[result], symbol, target: readExpression(t.value.toString()), values: given, quantity });
    setAnswer({ answer: a, symbol, unit: symbolUnit(symbol, quantity) });
  };
  return (
    <form
      className="mt-3 space-y-1.5 border-t border-rule pt-2"
      aria-label="Design solve"
      onSubmit={(e) => {
        e.preventDefault();
        solve();
      }}
    >
      <h3 className="text-xs font-semibold">Design solve</h3>
      <div className="grid grid-cols-2 gap-2">
        <label className="text-xs" htmlFor={`${id}-result`}>
          Result
          <select id={`${id}-result`} className={select} value={result} onChange={(e) => setResult(e.target.value as ResultName)}>
            {available.map((n) => (
              <option key={n} value={n}>
                {RESULT_LABEL[n]}
              </option>
            ))}
          </select>
        </label>
        <label className="text-xs" htmlFor={`${id}-symbol`}>
          Solve for
          <select id={`${id}-symbol`} className={select} value={symbol} onChange={(e) => setSymbol(e.target.value)}>
            {choices.map((s) => (
              <option key={s} value={s}>
                {s}
              </option>
            ))}
          </select>
        </label>
      </div>
      <label className="block text-xs" htmlFor={`${id}-target`}>
        Target
        <span className="mt-0.5 flex items-center rounded border border-rule bg-white focus-within:border-copper">
          <input id={`${id}-target`} value={target} onChange={(e) => setTarget(e.target.value)} placeholder="e.g. 50" autoComplete="off" spellCheck={false} className="w-full min-w-0 bg-transparent px-2 py-1 font-mono text-xs focus:outline-none" />
          <span className="pr-2 text-xs text-ink/60">{unit}</span>
        </span>
      </label>
      <Button type="submit" className="px-2 py-1 text-xs">
        Solve for {symbol}
      </Button>
      <div role="status" aria-label="Design solve answer" className="text-sm">
        {answer && "error" in answer && <p className="text-xs text-signal">{answer.error}</p>}
        {answer && "answer" in answer && <AnswerView {...answer} />}
      </div>
    </form>
  );
}

function AnswerView({ answer, symbol, unit }: { answer: DesignSolveAnswer; symbol: string; unit: string }) {
  if (answer.kind === "none") return <p className="text-xs">No value meets it: {answer.reason}.</p>;
  if (answer.kind === "numeric") {
    return (
      <p className="font-mono text-xs">
        {symbol} = {answer.numbers.map((x) => formatSI(x, unit)).join(" or ")} <span className="text-ink/60">(numeric roots)</span>
      </p>
    );
  }
  return (
    <div>
      <div className="overflow-x-auto">
        <MathTex tex={`${readExpression(symbol).toTex()} = ${answer.value.compactTex()}`} />
      </div>
      {answer.number !== null && (
        <p className="font-mono text-base font-medium" data-testid="design-solve-number">
          {formatSI(answer.number, unit)}
        </p>
      )}
    </div>
  );
}
