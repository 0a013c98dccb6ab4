// Element values: parse each value expression, and turn it into the polynomial coefficient the
// nodal matrix holds. Values with a non-constant denominator (1/R, 1/(sL), A/(1+s*tau)) get an
// internal variable, so every matrix entry stays a polynomial and det(A) is multilinear in them.

import { Poly, RationalFunction, ValueSyntaxError, parseValue } from "../algebra";
import { controlOfSymbol, controlSymbol, controlsIn } from "../algebra/expression";
import type { Control, Diagnostic, Network, ParseResult } from "../types";
import { diagnostic } from "./diagnostics";
import { isOpamp, isSource } from "./elements";

/** Laplace variable; capacitors and inductors are stamped as sC and 1/(sL). */
export const LAPLACE = "s";

/** One controlled part of a source value: gain × control. */
export interface SourceTerm {
  control: Control;
  gain: RationalFunction;
}

/** The controlled parts of every controlled source, by element name, in the order its value names them. */
export type SourceTerms = ReadonlyMap<string, readonly SourceTerm[]>;

/** Why a source value cannot be split into an independent part plus gain × control terms. */
class NonLinearControl extends Error {}

/**
 * Split a source value read with its controls as symbols into independent part + Σ gain·control.
 * The value must be linear in its controls: no control in a denominator, no power or product of them.
 */
function splitSourceValue(value: RationalFunction): { independent: RationalFunction; terms: SourceTerm[] } {
  const controlSymbols = value.variables().filter((v) => controlOfSymbol(v) !== null);
  if (controlSymbols.length === 0) return { independent: value, terms: [] };
  const inDenominator = controlSymbols.find((c) => value.den.degreeIn(c) > 0);
  if (inDenominator) throw new NonLinearControl(`${controlText(inDenominator)} is in a denominator`);
  for (const t of value.num.terms()) {
    const named = controlSymbols.filter((c) => (t.monomial[c] ?? 0) > 0);
    const power = named.reduce((sum, c) => sum + t.monomial[c], 0);
    if (power > 1) {
      const what = named.length > 1 ? `${named.map(controlText).join(" and ")} are multiplied together` : `${controlText(named[0])} is raised to a power`;
      throw new NonLinearControl(what);
    }
  }
  let independent = value.num;
  const terms: SourceTerm[] = [];
  for (const c of controlSymbols) {
    const coefficient = value.num.coefficientIn(c, 1);
    independent = independent.sub(coefficient.mul(Poly.variable(c)));
    const parts = controlOfSymbol(c)!;
    const control: Control = parts.word === "across" ? { nodes: [parts.args[0], parts.args[1]] } : { element: parts.args[0] };
    terms.push({ control, gain: RationalFunction.from(coefficient, value.den) });
  }
  return { independent: RationalFunction.from(independent, value.den), terms };
}

/** The controlled parts in the order the value names their controls. */
function inTextOrder(terms: SourceTerm[], text: string): SourceTerm[] {
  const order = controlsIn(text).map((c) => controlSymbol(c.word, c.args));
  const key = (t: SourceTerm) => order.indexOf("nodes" in t.control ? controlSymbol("across", t.control.nodes) : controlSymbol("through", [t.control.element]));
  return [...terms].sort((x, y) => key(x) - key(y));
}

function controlText(symbol: string): string {
  const c = controlOfSymbol(symbol)!;
  return `${c.word}(${c.args.join(", ")})`;
}

export function parseElementValues(
  network: Network,
  positions?: ParseResult["positions"],
): { values: Map<string, RationalFunction>; terms: Map<string, SourceTerm[]>; diagnostics: Diagnostic[] } {
  const values = new Map<string, RationalFunction>();
  const terms = new Map<string, SourceTerm[]>();
  const diagnostics: Diagnostic[] = [];
  network.elements.forEach((e, i) => {
    if (isOpamp(e)) return;
    const pos = positions?.[e.name];
    const at = (column: number) => {
      const where = pos ? { line: pos.line, column: (pos.valueColumn ?? 1) + column - 1 } : {};
      return { where, prefix: pos ? `line ${where.line}, column ${where.column}: ` : "" };
    };
    try {
      const read = parseValue(e.value);
      if (!isSource(e)) {
        const named = controlsIn(e.value)[0];
        if (named) {
          const { where, prefix } = at(named.column);
          diagnostics.push(
            diagnostic("value-syntax", `${prefix}value "${e.value}" of "${e.name}": ${named.word}(...) belongs in the value of a voltage or current source, not a ${e.kind}`, {
              elements: [e.name],
              path: ["elements", i, "value"],
              ...where,
            }),
          );
          return;
        }
      }
      let v = read;
      try {
        const split = splitSourceValue(read);
        v = split.independent;
        if (split.terms.length > 0) terms.set(e.name, inTextOrder(split.terms, e.value));
      } catch (err) {
        if (!(err instanceof NonLinearControl)) throw err;
        const { where, prefix } = at(controlsIn(e.value)[0]?.column ?? 1);
        diagnostics.push(
          diagnostic("control-nonlinear", `${prefix}value "${e.value}" of "${e.name}" is not linear in its controls: ${err.message}; a controlled source's value is a sum of gain × across(...) or gain × through(...) terms, plus an independent part`, {
            elements: [e.name],
            path: ["elements", i, "value"],
            ...where,
          }),
        );
        return;
      }
      values.set(e.name, v);
      if ((e.kind === "resistor" || e.kind === "inductor") && v.isZero()) {
        diagnostics.push(
          diagnostic("value-zero", `${e.kind} "${e.name}" has value 0, an infinite admittance; join its nodes into one node instead`, {
            elements: [e.name],
            path: ["elements", i, "value"],
            ...(pos ? { line: pos.line, column: pos.valueColumn ?? 1 } : {}),
          }),
        );
      }
    } catch (err) {
      const column = err instanceof ValueSyntaxError ? err.column : 1;
      const message = (err instanceof Error ? err.message : String(err)).replace(/ \(column \d+\)$/, "");
      const where = pos ? { line: pos.line, column: (pos.valueColumn ?? 1) + column - 1 } : {};
      const prefix = pos ? `line ${where.line}, column ${where.column}: ` : "";
      diagnostics.push(
        diagnostic("value-syntax", `${prefix}value "${e.value}" of "${e.name}": ${message}`, {
          elements: [e.name],
          path: ["elements", i, "value"],
          ...where,
        }),
      );
    }
  });
  return { values, terms, diagnostics };
}

/** A matrix coefficient: the polynomial that is stamped, and what it stands for in user symbols. */
export interface Coefficient {
  poly: Poly;
  display: RationalFunction;
  /** Set when poly is an internal variable standing for display. */
  internal: InternalSymbol | null;
}

export interface InternalSymbol {
  name: string;
  value: RationalFunction;
  element: string;
  role: CoefficientRole;
}

export type CoefficientRole = "admittance" | "impedance" | "gain" | "source";

const ROLE_LETTER: Record<CoefficientRole, string> = { admittance: "y", impedance: "z", gain: "k", source: "u" };

/**
 * The coefficient for one role of one element; an internal variable only when the value is not a
 * polynomial. part numbers the gains of one source (0 for the first), so each gets its own name.
 */
export function coefficientOf(display: RationalFunction, element: string, index: number, role: CoefficientRole, forceInternal = false, part = 0): Coefficient {
  const c = display.den.constantValue();
  if (c !== null && !forceInternal) return { poly: display.num.scale(c.inverse()), display, internal: null };
  // 1/R names its R, so the internals sort as their targets do: undoing the substitution then
  // reverses the canonical term order instead of scrambling it (see reciprocalSubstitute).
  const target = simpleReciprocalOf(display);
  // "." sorts below every character of a name, so "$yR.2" comes before "$yR1.3" as R before R1.
  const name = `$${ROLE_LETTER[role]}${target === null ? "" : `${target}.`}${index + 1}${part > 0 ? `_${part + 1}` : ""}`;
  const internal: InternalSymbol = { name, value: display, element, role };
  return { poly: Poly.variable(name), display, internal };
}

/** R when the value is 1/R with R a single symbol, else null. */
export function simpleReciprocalOf(value: RationalFunction): string | null {
  const one = value.num.constantValue();
  if (one === null || !one.isOne() || value.den.termCount() !== 1) return null;
  const vars = value.den.variables();
  return vars.length === 1 && value.den.equals(Poly.variable(vars[0])) ? vars[0] : null;
}
