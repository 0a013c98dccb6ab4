// Plain text into LaTeX text mode: every special character escaped, so titles cannot inject commands.
export function latexText(text: string): string {
  return text.replace(/[\\{}$&#^_%~]/g, (c) =>
    c === "\\" ? "\\textbackslash{}" : c === "^" ? "\\textasciicircum{}" : c === "~" ? "\\textasciitilde{}" : `\\${c}`,
  );
}
