import { lazy, Suspense } from "react";

// KaTeX arrives with the first screen that typesets, not with the first page.
const KatexMath = lazy(() => import("./katex-math"));

export function MathTex({ tex, block = false }: { tex: string; block?: boolean }) {
  return (
    <Suspense fallback={<code className="font-mono text-xs text-ink/60">{tex}</code>}>
      <KatexMath tex={tex} block={block} />
    </Suspense>
  );
}
