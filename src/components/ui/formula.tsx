import { useLayoutEffect, useRef, useState } from "react";
import { MathTex } from "./math";
import { breakEquation, breakExpression } from "./tex-lines";

// Characters of typeset math per em of font size, measured on KaTeX's fonts for our results (about 0.6).
const EM_PER_CHARACTER = 0.62;

/** One equation of the form `lhs = rhs`, or a bare expression when lhs is omitted. */
export interface FormulaProps {
  tex: string;
  lhs?: string;
  className?: string;
  label?: string;
}

// Typeset display math that never gets cut off: long sums are broken into lines to fit the box;
// what still does not fit scrolls inside its own box, with a visible cue at the edge.
export function Formula({ tex, lhs, className = "", label }: FormulaProps) {
  const box = useRef<HTMLDivElement>(null);
  // Null until the box is measured (before the first paint), so each formula is typeset once, already broken.
  const [budget, setBudget] = useState<number | null>(null);
  const [scrolls, setScrolls] = useState(false);
  const [atEnd, setAtEnd] = useState(false);

  useLayoutEffect(() => {
    const element = box.current;
    if (!element) return;
    const measure = () => {
      const font = parseFloat(getComputedStyle(element).fontSize) || 16;
      // KaTeX display math is set at 1.21em.
      const next = Math.max(16, Math.floor(element.clientWidth / (font * 1.21 * EM_PER_CHARACTER)));
      setBudget((current) => (current === next ? current : next));
      setScrolls(element.scrollWidth > element.clientWidth + 1);
    };
    measure();
    const observer = new ResizeObserver(measure);
    observer.observe(element);
    // KaTeX arrives lazily; measure again once it has typeset.
    const mutations = new MutationObserver(measure);
    mutations.observe(element, { childList: true, subtree: true });
    return () => {
      observer.disconnect();
      mutations.disconnect();
    };
  }, []);

  const typeset = budget === null ? null : lhs === undefined ? breakExpression(tex, budget) : breakEquation(lhs, tex, budget);
  return (
    <div className={`relative min-w-0 ${className}`} data-formula="">
      <div
        ref={box}
        className="overflow-x-auto"
        data-scrolls={scrolls ? "true" : undefined}
        tabIndex={scrolls ? 0 : undefined}
        aria-label={scrolls ? `${label ?? "Formula"}, wider than its box: scroll sideways` : undefined}
        onScroll={(event) => {
          const el = event.currentTarget;
          setAtEnd(el.scrollLeft + el.clientWidth >= el.scrollWidth - 2);
        }}
      >
        {typeset !== null && <MathTex tex={typeset} block />}
      </div>
      {scrolls && !atEnd && (
        <div aria-hidden="true" className="pointer-events-none absolute inset-y-0 right-0 flex w-10 items-center justify-end bg-gradient-to-l from-paper to-transparent pr-0.5 text-xs text-copper">
          →
        </div>
      )}
    </div>
  );
}
