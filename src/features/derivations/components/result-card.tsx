import { useState, type ReactNode } from "react";
import { Formula } from "@/components/ui/formula";
import { resultLabel, resultMeaning, resultTex, resultsInS } from "@/lib/quantities";
import type { ExactExpression, ResultName, RevisionResults } from "@/lib/api-contract";
import { compactTex, compactText, expandedTex } from "@/lib/printed-forms";
import { CheckBadge, DimensionCheck } from "./check-badge";

function CopyButton({ text, label }: { text: string; label: string }) {
  const [copied, setCopied] = useState(false);
  return (
    <button
      type="button"
      className="rounded-sm border border-rule px-1.5 py-0.5 text-[11px] text-ink/70 hover:border-ink/40 hover:text-ink"
      aria-label={label}
      onClick={() =>
        void navigator.clipboard?.writeText(text).then(
          () => {
            setCopied(true);
            window.setTimeout(() => setCopied(false), 1500);
          },
          () => undefined,
        )
      }
    >
      {copied ? "Copied" : label.startsWith("Copy TeX") ? "TeX" : "Text"}
    </button>
  );
}

// One result: its compact form typeset, the expanded form on demand, copy as TeX or plain text.
function ResultLine({ name, form, inS, expanded }: { name: ResultName; form: ExactExpression; inS: boolean; expanded: boolean }) {
  const tex = resultTex(name, inS);
  const plain = resultLabel(name, inS);
  const shownTex = expanded ? expandedTex(form) : compactTex(form);
  const shownPlain = expanded ? form.infix : compactText(form);
  return (
    <div data-result-line={name} className="min-w-0">
      <div className="flex items-baseline justify-between gap-2">
        <span className="text-xs text-ink/60">
          {plain} · {resultMeaning(name, inS)}
        </span>
        <span className="flex shrink-0 gap-1 print:hidden">
          <CopyButton text={`${tex} = ${shownTex}`} label={`Copy TeX of ${plain}`} />
          <CopyButton text={`${plain} = ${shownPlain}`} label={`Copy text of ${plain}`} />
        </span>
      </div>
      <Formula lhs={tex} tex={shownTex} label={plain} className="text-[0.95rem]" />
    </div>
  );
}

function Column({ title, children }: { title: string; children: ReactNode }) {
  return (
    <section aria-label={title} className="min-w-0 space-y-2 rounded border border-rule bg-white/60 p-3">
      <h3 className="text-sm font-medium">{title}</h3>
      {children}
    </section>
  );
}

/**
 * The answer first: Thevenin and Norton equivalents side by side at the top of the page, with the
 * check badge. `older` marks the card when it shows a revision from before a failed solve.
 */
export function ResultCard({ results, portLabel, older, aside }: { results: RevisionResults; portLabel?: string; older?: ReactNode; aside?: ReactNode }) {
  const [expanded, setExpanded] = useState(false);
  const inS = resultsInS(results);
  const { vth, rth, isc } = results;
  const line = (name: ResultName, form: ExactExpression | null) => form && <ResultLine name={name} form={form} inS={inS} expanded={expanded} />;
  return (
    <section aria-label="Result" data-result-card="" className={`rounded border ${older ? "border-copper/50 bg-copper/5" : "border-rule bg-paper"} p-3`}>
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h2 className="text-sm font-semibold tracking-tight">
          Result{portLabel ? <span className="font-normal text-ink/60"> at the port {portLabel}</span> : null}
        </h2>
        <div className="flex flex-wrap items-center gap-3">
          <CheckBadge results={results} />
          <button type="button" className="text-xs text-copper hover:underline print:hidden" aria-pressed={expanded} onClick={() => setExpanded((e) => !e)}>
            {expanded ? "Compact form" : "Expanded form"}
          </button>
        </div>
      </div>
      {older && <div className="mt-2 text-xs text-copper" role="status">{older}</div>}
      <div className="mt-2 grid gap-3 md:grid-cols-2">
        <Column title="Thevenin equivalent">
          {vth && rth ? (
            <>
              {line("vth", vth)}
              {line("rth", rth)}
            </>
          ) : (
            <p className="text-sm text-ink/70">No Thevenin form: {rth ? "" : `the port is an ideal current source (${resultLabel("rth", inS)} unbounded).`}</p>
          )}
        </Column>
        <Column title="Norton equivalent">
          {isc && rth ? (
            <>
              {line("isc", isc)}
              {line("rth", rth)}
            </>
          ) : (
            <p className="text-sm text-ink/70">No Norton form: {isc ? "" : `the port is an ideal voltage source (${resultLabel("rth", inS)} = 0).`}</p>
          )}
        </Column>
      </div>
      <div className="mt-2 flex flex-wrap items-start justify-between gap-2">
        <DimensionCheck results={results} />
        {aside}
      </div>
    </section>
  );
}
