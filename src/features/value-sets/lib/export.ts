import { latexText } from "@/lib/latex";
import type { ValueSet } from "@/lib/api-contract";

const symbolsOf = (sets: ValueSet[]) => [...new Set(sets.flatMap((s) => Object.keys(s.values)))].sort((a, b) => a.localeCompare(b, "en", { numeric: true }));

// A CSV field quoted when it holds a separator, a quote or a line break (RFC 4180).
const csvField = (text: string) => (/[",\n\r]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text);

/** One row per symbol, one column per set, values as typed (RFC 4180 CSV). */
export function valueSetsCsv(sets: ValueSet[]): string {
  const rows = [["symbol", ...sets.map((s) => s.name)], ...symbolsOf(sets).map((symbol) => [symbol, ...sets.map((s) => s.values[symbol] ?? "")])];
  return rows.map((row) => row.map(csvField).join(",")).join("\r\n") + "\r\n";
}

/** The same table for the LaTeX export (a tabular, values in text mode as typed). */
export function valueSetsLatex(sets: ValueSet[]): string[] {
  if (sets.length === 0) return [];
  return [
    "\\subsection*{Value sets}",
    `\\begin{tabular}{l${"r".repeat(sets.length)}}`,
    `symbol & ${sets.map((s) => latexText(s.name)).join(" & ")} \\\\ \\hline`,
    ...symbolsOf(sets).map((symbol) => `\\texttt{${latexText(symbol)}} & ${sets.map((s) => latexText(s.values[symbol] ?? "")).join(" & ")} \\\\`),
    "\\end{tabular}",
    "",
  ];
}
