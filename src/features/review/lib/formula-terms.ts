// The terms of a step's TeX formula a note can point at: the pieces between top-level relations and
// signs (=, +, −, row and column breaks), braces and \left…\right pairs kept whole. Each is a stretch of
// the formula exactly as stored, which is what the server checks a formula anchor against.
export function formulaTerms(tex: string, limit = 24): string[] {
  const terms: string[] = [];
  let depth = 0;
  let start = 0;
  const cut = (end: number) => {
    const raw = tex.slice(start, end);
    const term = raw.trim();
    if (term && !terms.includes(term)) terms.push(term);
  };
  for (let i = 0; i < tex.length; i++) {
    const c = tex[i];
    if (c === "\\") {
      if (tex.startsWith("\\left", i)) depth++;
      else if (tex.startsWith("\\right", i)) depth--;
      else if (tex[i + 1] === "\\" && depth === 0) {
        cut(i);
        start = i + 2;
      }
      i++;
      continue;
    }
    if (c === "{") depth++;
    else if (c === "}") depth--;
    else if (depth === 0 && (c === "=" || c === "+" || c === "-" || c === "&" || c === ",")) {
      cut(i);
      start = i + 1;
    }
  }
  cut(tex.length);
  return terms.slice(0, limit);
}
