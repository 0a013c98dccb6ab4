// Our own line breaking of typeset results: KaTeX does not break display math, so a long sum is
// split at its top-level + and − into lines that fit a width given in characters.

/** A rough width of TeX source once typeset, in characters: commands and braces take no room. */
export function typesetLength(tex: string): number {
  return tex
    .replace(/\\(left|right|,|;|!|quad|qquad|mathit|mathrm|mathbf|operatorname)\b/g, "")
    .replace(/\\frac\{/g, "{")
    .replace(/\\[a-zA-Z]+/g, "x")
    .replace(/[{}\s^_]/g, "").length;
}

interface Split {
  parts: string[];
  /** The operator in front of each part after the first ("+" or "-"). */
  signs: string[];
}

// Splits at + and − that stand between terms at the outermost level (not inside braces or \left…\right).
function splitTopLevel(tex: string, separators: string[]): Split {
  const parts: string[] = [];
  const signs: string[] = [];
  let depth = 0;
  let start = 0;
  let previous = ""; // last non-space character at depth 0
  for (let i = 0; i < tex.length; i++) {
    const c = tex[i];
    if (c === "\\") {
      const command = /^\\([a-zA-Z]+|.)/.exec(tex.slice(i))![0];
      if (command === "\\left") depth++;
      else if (command === "\\right") depth--;
      i += command.length - 1;
      previous = "x";
      continue;
    }
    if (c === "{") depth++;
    else if (c === "}") depth--;
    else if (depth === 0 && separators.includes(c) && previous !== "" && !"+-=(,&".includes(previous)) {
      parts.push(tex.slice(start, i).trim());
      signs.push(c);
      start = i + 1;
      previous = "";
      continue;
    }
    if (c.trim()) previous = depth === 0 ? c : "x";
  }
  parts.push(tex.slice(start).trim());
  return { parts, signs };
}

// Reads `\frac{N}{D}` when it is the whole expression.
function wholeFraction(tex: string): { numerator: string; denominator: string } | null {
  const t = tex.trim();
  if (!t.startsWith("\\frac{")) return null;
  const groups: string[] = [];
  let i = "\\frac".length;
  for (let g = 0; g < 2; g++) {
    if (t[i] !== "{") return null;
    let depth = 0;
    const open = i;
    for (; i < t.length; i++) {
      if (t[i] === "\\") {
        i++;
        continue;
      }
      if (t[i] === "{") depth++;
      else if (t[i] === "}" && --depth === 0) break;
    }
    groups.push(t.slice(open + 1, i));
    i++;
  }
  return i === t.length ? { numerator: groups[0], denominator: groups[1] } : null;
}

// Parentheses around a whole numerator or denominator say nothing under a fraction bar; they also cannot span lines.
function unwrapped(tex: string): string {
  const t = tex.trim();
  if (!t.startsWith("\\left(") || !t.endsWith("\\right)")) return t;
  const inner = t.slice("\\left(".length, -"\\right)".length);
  // Only when the outer pair is one pair: the inner text's own \left and \right balance.
  return balanced(inner) ? inner.trim() : t;
}

function balanced(tex: string): boolean {
  let depth = 0;
  for (const match of tex.matchAll(/\\left|\\right/g)) {
    depth += match[0] === "\\left" ? 1 : -1;
    if (depth < 0) return false;
  }
  return depth === 0;
}

// Groups terms into lines of at most `budget` characters (a single long term keeps a line to itself).
function sumLines(tex: string, budget: number): string[] | null {
  const { parts, signs } = splitTopLevel(tex, ["+", "-"]);
  if (parts.length < 2) return null;
  const lines: string[] = [];
  let line = parts[0];
  for (let k = 1; k < parts.length; k++) {
    const term = `${signs[k - 1]} ${parts[k]}`;
    if (typesetLength(line) + typesetLength(term) > budget) {
      lines.push(line);
      line = term;
    } else line = `${line} ${term}`;
  }
  lines.push(line);
  return lines.length > 1 ? lines : null;
}

/** An expression broken to fit `budget` characters a line, as TeX (unchanged when it fits or cannot break). */
export function breakExpression(tex: string, budget: number): string {
  if (typesetLength(tex) <= budget) return tex;
  // Already laid out by its author (alignments, explicit line breaks): left as it is, to scroll.
  if (/\\begin|&|\\\\/.test(tex)) return tex;
  // Side-by-side equations ("a = …, \qquad b = …") go one under the other first.
  const equations = tex.split(/,\s*\\qquad\s*/);
  if (equations.length > 1) return `\\begin{gathered}${equations.map((e) => breakExpression(e, budget)).join(" \\\\ ")}\\end{gathered}`;
  const fraction = wholeFraction(tex);
  if (fraction) {
    const top = breakExpression(unwrapped(fraction.numerator), budget);
    const bottom = breakExpression(unwrapped(fraction.denominator), budget);
    const stack = (part: string) => (part.includes("\\\\") ? `\\begin{gathered}${part}\\end{gathered}` : part);
    return `\\frac{${stack(top)}}{${stack(bottom)}}`;
  }
  const lines = sumLines(tex, budget);
  if (lines) return lines.join(" \\\\ ");
  return breakParenthesised(tex, budget) ?? tex;
}

// A product with one long parenthesised sum, e.g. R_4 (a + b + …): the sum is broken inside sized
// parentheses, which, unlike \left…\right, may open on one line and close on another.
function breakParenthesised(tex: string, budget: number): string | null {
  const open = tex.indexOf("\\left(");
  if (open < 0) return null;
  let depth = 0;
  let close = -1;
  for (const match of tex.slice(open).matchAll(/\\left|\\right/g)) {
    depth += match[0] === "\\left" ? 1 : -1;
    if (depth === 0) {
      close = open + match.index!;
      break;
    }
  }
  if (close < 0 || !tex.startsWith("\\right)", close)) return null;
  const inner = tex.slice(open + "\\left(".length, close);
  const before = tex.slice(0, open).trim();
  const after = tex.slice(close + "\\right)".length).trim();
  const lines = sumLines(inner, budget - typesetLength(before) - 2);
  if (!lines || /\\left|\\right/.test(before + after)) return null;
  const last = lines.length - 1;
  return lines.map((line, i) => `${i === 0 ? `${before} \\Bigl(` : ""}${line}${i === last ? `\\Bigr) ${after}` : ""}`).join(" \\\\ ");
}

/** `lhs = rhs` with a long rhs: the rhs broken, continuation lines set under the first term. */
export function breakEquation(lhs: string, rhs: string, budget: number): string {
  const room = Math.max(12, budget - typesetLength(lhs) - 2);
  if (typesetLength(rhs) <= room) return `${lhs} = ${rhs}`;
  if (wholeFraction(rhs)) return `${lhs} = ${breakExpression(rhs, room)}`;
  const lines = sumLines(rhs, room);
  if (!lines) return `${lhs} = ${rhs}`;
  return `\\begin{aligned} ${lhs} &= ${lines[0]} \\\\ ${lines
    .slice(1)
    .map((l) => `&\\quad ${l}`)
    .join(" \\\\ ")} \\end{aligned}`;
}
