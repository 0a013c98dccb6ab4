import "katex/dist/katex.min.css";
import katex from "katex";
import { useMemo } from "react";

// Engine TeX only, typeset with trust off and hard limits so no stored string can grow or link out.
const settings = {
  trust: false,
  throwOnError: false,
  strict: "ignore" as const,
  maxSize: 10,
  // Results of hundreds of terms expand \, and \mathrm thousands of times; the TeX is the engine's own, never user macros.
  maxExpand: 100_000,
  output: "htmlAndMathml" as const,
};

export default function KatexMath({ tex, block = false }: { tex: string; block?: boolean }) {
  const html = useMemo(() => katex.renderToString(tex, { ...settings, displayMode: block }), [tex, block]);
  // KaTeX's own escaped output, never user text.
  return <span className={block ? "block py-1" : ""} dangerouslySetInnerHTML={{ __html: html }} />;
}
