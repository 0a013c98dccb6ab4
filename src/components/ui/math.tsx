import { lazy, Suspense } from "react";

// KaTeX arrives with the first screen that typesets, not with the first page.
const KatexMath = lazy(() => import("./katex-math"));

// While KaTeX loads, a quiet bar holds the place: the raw TeX source is never shown.
function Placeholder({ block }: { block: boolean }) {
  return <span role="status" aria-label="Typesetting…" data-math-placeholder="" className={block ? "my-1 block h-8 w-2/3 rounded-sm bg-rule/50" : "inline-block h-[1.1em] w-20 rounded-sm bg-rule/50 align-middle"} />;
}

export function MathTex({ tex, block = false }: { tex: string; block?: boolean }) {
  return (
    <Suspense fallback={<Placeholder block={block} />}>
      <KatexMath tex={tex} block={block} />
    </Suspense>
  );
}
