// How unknowns, differences and coefficients are written in the ledger, as plain infix and as TeX.

import type { RationalFunction } from "../algebra";

/** Node voltage unknown, e.g. V_out. */
export function voltageInfix(node: string): string {
  return `V_${node}`;
}

export function voltageTex(node: string): string {
  return `V_{${labelTex(node)}}`;
}

/** Branch current unknown, e.g. I_Vin. */
export function currentInfix(element: string): string {
  return `I_${element}`;
}

export function currentTex(element: string): string {
  return `I_{${labelTex(element)}}`;
}

/** A node or element label set upright inside a subscript. */
export function labelTex(label: string): string {
  if (/^\d+$/.test(label)) return label;
  return `\\mathrm{${label.replace(/_/g, "\\_")}}`;
}

export interface Written {
  infix: string;
  tex: string;
}

/** V(a) − V(b) with ground written as 0 and dropped. */
export function differenceOf(a: string, b: string, ground: string): Written & { terms: number } {
  if (a === ground && b === ground) return { infix: "0", tex: "0", terms: 0 };
  if (b === ground) return { infix: voltageInfix(a), tex: voltageTex(a), terms: 1 };
  if (a === ground) return { infix: `-${voltageInfix(b)}`, tex: `-${voltageTex(b)}`, terms: 1 };
  return { infix: `${voltageInfix(a)} - ${voltageInfix(b)}`, tex: `${voltageTex(a)} - ${voltageTex(b)}`, terms: 2 };
}

/** Does a printed expression need parentheses as a factor? */
function isSum(text: string): boolean {
  let depth = 0;
  for (let i = 0; i < text.length; i++) {
    const ch = text[i];
    if (ch === "(" || ch === "{") depth++;
    else if (ch === ")" || ch === "}") depth--;
    else if ((ch === "+" || ch === "-") && depth === 0 && i > 0) return true;
  }
  return false;
}

function factorInfix(text: string): string {
  return isSum(text) || text.startsWith("-") || text.includes("/") ? `(${text})` : text;
}

function factorTex(text: string): string {
  return isSum(text) || text.startsWith("-") ? `\\left(${text}\\right)` : text;
}

/** coefficient × (difference), e.g. g_m (V_a − V_b). */
export function times(coefficient: RationalFunction, x: Written & { terms?: number }): Written {
  // A negated single term moves its sign to the front: -g_m V_b, never g_m -V_b (which reads as a difference).
  if ((x.terms ?? 1) === 1 && x.infix.startsWith("-") && x.tex.startsWith("-")) {
    return negate(times(coefficient, { infix: x.infix.slice(1), tex: x.tex.slice(1), terms: 1 }));
  }
  const c = coefficient.constantValue();
  const xi = (x.terms ?? 1) > 1 ? `(${x.infix})` : x.infix;
  const xt = (x.terms ?? 1) > 1 ? `\\left(${x.tex}\\right)` : x.tex;
  if (c !== null && c.isOne()) return { infix: x.infix, tex: x.tex };
  if (c !== null && c.neg().isOne()) return { infix: `-${xi}`, tex: `-${xt}` };
  return { infix: `${factorInfix(coefficient.toInfix())}*${xi}`, tex: `${factorTex(coefficient.toTex())} ${xt}` };
}

/** (difference) / value, e.g. (V_a − V_b)/R_0. */
export function over(x: Written & { terms?: number }, value: RationalFunction): Written {
  const c = value.constantValue();
  if (c !== null && c.isOne()) return { infix: x.infix, tex: x.tex };
  const xi = (x.terms ?? 1) > 1 ? `(${x.infix})` : x.infix;
  // A divisor is one factor: a/(L*s), never a/L*s, which reads as (a/L)*s.
  const d = value.toInfix();
  const divisor = /^[A-Za-z0-9_.]+$/.test(d) ? d : `(${d})`;
  return { infix: `${xi}/${divisor}`, tex: `\\frac{${x.tex}}{${value.toTex()}}` };
}

export function negate(x: Written): Written {
  const strip = (t: string) => (t.startsWith("-") && !isSum(t) ? t.slice(1) : null);
  const i = strip(x.infix);
  const t = strip(x.tex);
  return {
    infix: i ?? (isSum(x.infix) ? `-(${x.infix})` : `-${x.infix}`),
    tex: t ?? (isSum(x.tex) ? `-\\left(${x.tex}\\right)` : `-${x.tex}`),
  };
}

/** Sum of written terms, "a + b - c". */
export function sumOf(terms: Written[]): Written {
  if (terms.length === 0) return { infix: "0", tex: "0" };
  const join = (parts: string[]) =>
    parts.reduce((acc, p, i) => (i === 0 ? p : p.startsWith("-") ? `${acc} - ${p.slice(1)}` : `${acc} + ${p}`), "");
  return { infix: join(terms.map((t) => t.infix)), tex: join(terms.map((t) => t.tex)) };
}
