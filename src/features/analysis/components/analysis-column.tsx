import { useMemo, useState, type ReactNode } from "react";
import { Caution } from "@/components/ui/caution";
import type { Circuit, RevisionResults, ValueSet } from "@/lib/api-contract";
import { useValueSets, ValueSetsBar } from "@/features/value-sets";
import { readExactResults, symbolsOf } from "../lib/exact-results";
import { LimitsPanel } from "./limits-panel";
import { SweepPanel } from "./sweep-panel";
import { ValuesPanel, type TypedValues } from "./values-panel";
import { DesignSolve } from "./design-solve";
import { FrequencyPanel } from "./frequency-panel";

function Panel({ title, children }: { title: string; children: ReactNode }) {
  const id = `panel-${title.toLowerCase()}`;
  return (
    <section aria-labelledby={id} className="border-b border-rule pb-4 pt-3 first:pt-0">
      <h2 id={id} className="mb-2 text-sm font-semibold tracking-tight">
        {title}
      </h2>
      {children}
    </section>
  );
}

// The narrow right column: Values, Limits and Sweep, all computed in the browser from the stored exact result.
export function AnalysisColumn({ results, circuit, networkId, canSaveValues = false, valueSets }: { results: RevisionResults; circuit?: Circuit; networkId?: string; canSaveValues?: boolean; valueSets?: ValueSet[] }) {
  const exact = useMemo(() => readExactResults(results), [results]);
  const symbols = useMemo(() => symbolsOf(exact), [exact]);
  const [values, setValues] = useState<TypedValues>({});
  // The network's saved sets: fetched for members, given by the share page otherwise.
  const fetched = useValueSets(valueSets ? undefined : networkId);
  const sets = valueSets ?? fetched.data ?? [];
  const quantities = results.dimensions?.quantities ?? {};
  const gain = symbols.find((s) => quantities[s] === "dimensionless" || quantities[s] === "transconductance");
  return (
    <div className="print:hidden">
      <Panel title="Values">
        <ValueSetsBar networkId={networkId} sets={sets} canSave={canSaveValues} values={values} onChoose={(chosen) => setValues(Object.fromEntries(symbols.map((s) => [s, chosen[s] ?? ""])))} />
        <ValuesPanel exact={exact} symbols={symbols} quantities={quantities} values={values} onChange={setValues} />
        <DesignSolve exact={exact} symbols={symbols} quantities={quantities} values={values} />
      </Panel>
      {/* Only when a result depends on the Laplace variable s. */}
      {symbols.includes("s") && (
        <Panel title="Frequency">
          <FrequencyPanel exact={exact} values={values} circuit={circuit} />
        </Panel>
      )}
      <Panel title="Limits">
        <LimitsPanel exact={exact} symbols={symbols} initialSymbol={gain} quantities={quantities} />
      </Panel>
      <Panel title="Sweep">
        <SweepPanel exact={exact} symbols={symbols} quantities={quantities} values={values} initialSymbol={gain} inS={symbols.includes("s")} />
      </Panel>
      <Caution className="mt-3" />
    </div>
  );
}
