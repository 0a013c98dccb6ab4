import { Caution } from "@/components/ui/caution";
import { Formula } from "@/components/ui/formula";
import { EmptyState } from "@/components/ui/states";
import { StepComments, type ReviewContext } from "@/features/review";
import { useState } from "react";
import type { Comment, NoteAnchor, Revision } from "@/lib/api-contract";
import { Equivalents } from "./equivalents";

// The ledger: every stored step, numbered and typeset, with its review notes in the margin.
export function Ledger({ revision, comments, review }: { revision: Revision; comments: Comment[]; review: ReviewContext }) {
  const { results, steps } = revision;
  // A stretch of a step's explanation the reader highlighted, offered as a note's anchor beside that step.
  const [highlight, setHighlight] = useState<{ stepId: string; anchor: NoteAnchor } | null>(null);
  const readHighlight = (stepId: string, explanation: string) => {
    const text = window.getSelection()?.toString().trim() ?? "";
    setHighlight(text && explanation.includes(text) ? { stepId, anchor: { part: "explanation", text } } : null);
  };
  return (
    <div>
      {results.statements.length > 0 && (
        <ul className="mt-2 space-y-0.5 text-sm" aria-label="Statements about the port">
          {results.statements.map((s) => (
            <li key={s.code} className={s.code === "rth-disagree" ? "text-signal" : "text-ink/80"}>
              {s.message}
            </li>
          ))}
        </ul>
      )}
      {steps.length === 0 ? (
        <div className="mt-4">
          <EmptyState title="No steps were stored with this revision." />
        </div>
      ) : (
        <ol className="mt-2" aria-label="Ledger">
          {steps.map((step, index) => (
            <li
              key={step.id}
              id={`step-${step.id}`}
              data-step-kind={step.kind}
              // Notes sit in a margin beside the step on wide screens and fold under it below ~1400 px.
              className="grid grid-cols-[1.5rem_minmax(0,1fr)] gap-x-3 border-b border-rule/70 py-3 min-[1400px]:grid-cols-[1.75rem_minmax(0,1fr)_11rem] print:break-inside-avoid"
            >
              <span className="pt-0.5 text-right font-mono text-xs text-ink/50">{index + 1}</span>
              <div className="min-w-0">
                <h3 className="text-sm font-medium">{step.title}</h3>
                {step.explanation && (
                  <p className="mt-0.5 text-xs leading-relaxed text-ink/70" onMouseUp={review.canComment ? () => readHighlight(step.id, step.explanation) : undefined}>
                    {step.explanation}
                  </p>
                )}
                {step.tex && <Formula tex={step.tex} label={`Step ${index + 1}`} className="ledger-tex mt-1.5 text-[0.88rem]" />}
              </div>
              <div className="col-start-2 mt-2 min-w-0 border-t border-dashed border-rule pt-1 empty:hidden min-[1400px]:col-start-3 min-[1400px]:mt-0 min-[1400px]:border-l min-[1400px]:border-t-0 min-[1400px]:pl-3 min-[1400px]:pt-0">
                <StepComments
                  stepId={step.id}
                  stepTitle={`step ${index + 1}, ${step.title}`}
                  formula={step.tex}
                  comments={comments}
                  // The way to comment is offered once, beside the first step, not in every margin.
                  review={index === 0 ? review : { ...review, commentPath: undefined }}
                  highlight={highlight?.stepId === step.id ? highlight.anchor : null}
                  onHighlightUsed={() => setHighlight(null)}
                />
              </div>
            </li>
          ))}
        </ol>
      )}
      <section aria-labelledby="equivalents-heading" className="mt-5 print:break-inside-avoid">
        <h3 id="equivalents-heading" className="mb-2 text-sm font-semibold">
          The equivalents at the port
        </h3>
        <Equivalents results={results} />
        <Caution className="mt-3" />
      </section>
    </div>
  );
}
