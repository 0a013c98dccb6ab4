import { useId, useMemo, useState } from "react";
import { MathTex } from "@/components/ui/math";
import { boundedApproximation, parseSI, readExpression, type BoundedApproximation, type Rational } from "@/lib/engine";
import type { ResultName } from "@/lib/api-contract";
import type { ExactResults } from "../lib/exact-results";
import { RESULT_LABEL, RESULT_NAMES, RESULT_TEX } from "@/lib/quantities";

type Lock = "in" | "out";

const percent = (x: number) => `${(x * 100).toPrecision(3)} %`;

function NumberField({ label, value, onChange, unit, placeholder }: { label: string; value: string; onChange: (v: string) => void; unit: string; placeholder?: string }) {
  const id = useId();
  return (
    <div className="flex items-center gap-1.5">
      <label htmlFor={id} className="w-24 shrink-0 text-xs text-ink/70">
        {label}
      </label>
      <input
        id={id}
        value={value}
        placeholder={placeholder}
        onChange={(e) => onChange(e.target.value)}
        inputMode="decimal"
        autoComplete="off"
        spellCheck={false}
        className="w-20 rounded border border-rule bg-white px-2 py-0.5 font-mono text-xs focus:border-copper focus:outline-none"
      />
      <span className="text-xs text-ink/60">{unit}</span>
    </div>
  );
}

function readNumber(text: string): number | null {
  try {
    return text.trim() === "" ? null : parseSI(text).toNumber();
  } catch {
    return null;
  }
}

// Approximate results within a stated error at the design point typed above (simplification after
// generation): terms are dropped, the largest error actually incurred is shown, the exact form stays.
export function ApproximationControl({ exact, point }: { exact: ExactResults; point: Record<string, Rational> }) {
  const [on, setOn] = useState(false);
  const [epsilon, setEpsilon] = useState("5");
  const [tolerance, setTolerance] = useState("");
  const [bandFrom, setBandFrom] = useState("");
  const [bandTo, setBandTo] = useState("");
  const [locks, setLocks] = useState<Record<string, Lock>>({});
  const inS = RESULT_NAMES.some((n) => exact[n]?.variables().includes("s"));
  const nominal = useMemo(() => Object.fromEntries(Object.entries(point).map(([k, v]) => [k, v.toNumber()])), [point]);
  const eps = readNumber(epsilon);
  const tol = readNumber(tolerance);
  const from = readNumber(bandFrom);
  const to = readNumber(bandTo);
  const results = useMemo(() => {
    if (!on || eps === null || eps <= 0) return [];
    const band: [number, number] | undefined = from !== null && to !== null && to > from ? [from, to] : undefined;
    return (["vth", "rth", "isc"] as ResultName[]).flatMap((name) => {
      const f = exact[name];
      if (!f || f.isZero()) return [];
      const keep = Object.keys(locks).filter((t) => locks[t] === "in");
      const drop = Object.keys(locks).filter((t) => locks[t] === "out");
      const a = boundedApproximation(f, nominal, { epsilon: eps / 100, tolerance: tol ? tol / 100 : undefined, band, keep, drop });
      return [{ name, a }];
    });
  }, [on, exact, nominal, eps, tol, from, to, locks]);
  // A free term is locked the other way from where the bound put it; a locked term is freed again.
  const toggle = (term: string, dropped: boolean) =>
    setLocks(({ [term]: current, ...rest }) => (current ? rest : { ...rest, [term]: dropped ? "in" : "out" }));
  const missing = on && results.some((r) => r.a === null);
  return (
    <section aria-label="Approximate" className="mt-3 border-t border-rule pt-2">
      <label className="flex items-center gap-2 text-xs font-medium">
        <input type="checkbox" checked={on} onChange={(e) => setOn(e.target.checked)} className="accent-copper" />
        Approximate within a stated error
      </label>
      {on && (
        <div className="mt-2 space-y-1">
          <NumberField label="Error bound" value={epsilon} onChange={setEpsilon} unit="%" />
          <NumberField label="Tolerance ±" value={tolerance} onChange={setTolerance} unit="% on every value" placeholder="none" />
          {inS && (
            <>
              <NumberField label="Band from" value={bandFrom} onChange={setBandFrom} unit="Hz" />
              <NumberField label="Band to" value={bandTo} onChange={setBandTo} unit="Hz" />
            </>
          )}
          {missing && <p className="text-[11px] text-ink/60">Give every symbol a value above (the design point){inS ? " and a band" : ""} to approximate.</p>}
          <dl className="space-y-2 pt-1">
            {results.map(({ name, a }) => a && <ApproximateResult key={name} name={name} a={a} locks={locks} onToggle={toggle} />)}
          </dl>
        </div>
      )}
    </section>
  );
}

/** Terms listed as buttons up to this many; past it only the dropped and locked ones are. */
const LISTED_TERMS = 40;

function termTitle(lock: Lock | undefined, dropped: boolean): string {
  if (lock === "in") return "locked in: click to free it";
  if (lock === "out") return "locked out: click to free it";
  return dropped ? "dropped: click to lock it in" : "kept: click to lock it out";
}

function ApproximateResult({ name, a, locks, onToggle }: { name: ResultName; a: BoundedApproximation; locks: Record<string, Lock>; onToggle: (term: string, dropped: boolean) => void }) {
  const dropped = new Set([...a.dropped.numerator, ...a.dropped.denominator]);
  const kept = [...new Set([...a.kept.numerator, ...a.kept.denominator])].filter((t) => !dropped.has(t));
  const all = [...dropped, ...kept];
  const listed = all.length <= LISTED_TERMS ? all : all.filter((t) => dropped.has(t) || locks[t]);
  const tex = useMemo(() => readExpression(a.approximate).compactTex(), [a.approximate]);
  return (
    <div data-approximation={name}>
      <dt className="text-xs text-ink/60">
        {RESULT_LABEL[name]} approximately <span data-testid={`approx-error-${name}`}>(largest error {percent(a.maxError)}{a.over === "point" ? " at the design point" : ` over the ${a.over}`})</span>
      </dt>
      <dd className="min-w-0">
        <div className="overflow-x-auto text-sm" data-testid={`approx-${name}`} data-infix={a.approximate}>
          <MathTex tex={`${RESULT_TEX[name]} \\approx ${tex}`} />
        </div>
        {listed.length > 1 && (
          <>
            <div className="mt-1 flex flex-wrap gap-1" role="group" aria-label={`Terms of ${RESULT_LABEL[name]}`}>
              {listed.map((term) => {
                const lock = locks[term];
                const isDropped = dropped.has(term);
                return (
                  <button
                    key={term}
                    type="button"
                    aria-pressed={lock !== undefined}
                    data-lock={lock ?? "free"}
                    onClick={() => onToggle(term, isDropped)}
                    title={termTitle(lock, isDropped)}
                    className={`rounded border px-1.5 py-0.5 font-mono text-[11px] ${isDropped ? "text-ink/60 line-through" : "text-ink"} ${lock ? "border-copper bg-copper/10 font-semibold" : "border-rule"}`}
                  >
                    {term}
                  </button>
                );
              })}
            </div>
            <p className="mt-0.5 text-[10px] text-ink/50">
              Struck-through terms are dropped. Click a term to lock it in or out; click a locked term to free it.
              {listed.length < all.length && ` ${all.length - listed.length} kept terms are not listed.`}
            </p>
          </>
        )}
      </dd>
    </div>
  );
}
