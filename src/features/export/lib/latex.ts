import type { Revision, ValueSet } from "@/lib/api-contract";
import { compactTex } from "@/lib/printed-forms";
import { valueSetsLatex } from "@/features/value-sets";
import { latexText } from "@/lib/latex";

/** The whole ledger as a stand-alone LaTeX document (amsmath), one subsection per step. */
export function ledgerLatex(revision: Revision, valueSets: ValueSet[] = []): string {
  const lines = [
    "\\documentclass[11pt]{article}",
    "\\usepackage{amsmath,amssymb}",
    "\\usepackage[margin=2cm]{geometry}",
    `\\title{${latexText(revision.network.title)} --- derivation revision ${revision.number}}`,
    "\\date{}",
    "\\begin{document}",
    "\\maketitle",
    "\\noindent Results are linear, small-signal idealisations. Verify them against measurement, component ratings and the codes and licensed practice that apply before building hardware, above all at mains or high voltage.",
    "",
  ];
  revision.steps.forEach((step, i) => {
    lines.push(`\\subsection*{${i + 1}. ${latexText(step.title)}}`);
    if (step.explanation) lines.push(latexText(step.explanation), "");
    if (step.tex) lines.push("\\[", step.tex, "\\]", "");
  });
  const { vth, rth, isc } = revision.results;
  lines.push("\\subsection*{Equivalents at the port}");
  if (vth) lines.push(`\\[ V_{\\mathrm{th}} = ${compactTex(vth)} \\]`);
  if (rth) lines.push(`\\[ R_{\\mathrm{th}} = ${compactTex(rth)} \\]`);
  if (isc) lines.push(`\\[ I_{\\mathrm{sc}} = ${compactTex(isc)} \\]`);
  lines.push("", ...valueSetsLatex(valueSets));
  lines.push("\\end{document}", "");
  return lines.join("\n");
}
