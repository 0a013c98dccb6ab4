// Element values: parse each value expression, and turn it into the polynomial coefficient the
// nodal matrix holds. Values with a non-constant denominator (1/R, 1/(sL), A/(1+s*tau)) get an
// internal variable, so every matrix entry stays a polynomial and det(A) is multilinear in them.

import { Poly, Rational, RationalFunction, ValueSyntaxError, parseValue } from "../algebra";
import type { Diagnostic, Element, Network, ParseResult } from "../types";
import { diagnostic } from "./diagnostics";
import { isOpamp } from "./elements";

/** Laplace variable; capacitors and inductors are stamped as sC and 1/(sL). */
export const LAPLACE = "s";

/** Parsed value of every element that has one (in user symbols). */
export type ElementValues = ReadonlyMap<string, RationalFunction>;

export function parseElementValues(
  network: Network,
  positions?: ParseResult["positions"],
): { values: Map<string, RationalFunction>; diagnostics: Diagnostic[] } {
  const values = new Map<string, RationalFunction>();
  const diagnostics: Diagnostic[] = [];
  network.elements.forEach((e, i) => {
    if (isOpamp(e)) return;
    const pos = positions?.[e.name];
    try {
      const v = parseValue(e.value);
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
  return { values, diagnostics };
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

/** Internal variables start with "$", which no user symbol can contain. */
export function isInternalSymbol(name: string): boolean {
  return name.startsWith("$");
}

const ROLE_LETTER: Record<CoefficientRole, string> = { admittance: "y", impedance: "z", gain: "k", source: "u" };

/** The coefficient for one role of one element; an internal variable only when the value is not a polynomial. */
export function coefficientOf(display: RationalFunction, element: string, index: number, role: CoefficientRole, forceInternal = false): Coefficient {
  const c = display.den.constantValue();
  if (c !== null && !forceInternal) return { poly: display.num.scale(c.inverse()), display, internal: null };
  const name = `$${ROLE_LETTER[role]}${index + 1}`;
  const internal: InternalSymbol = { name, value: display, element, role };
  return { poly: Poly.variable(name), display, internal };
}

/** Admittance of a passive element in user symbols: 1/R, G, sC, 1/(sL). */
export function admittanceOf(e: Element, value: RationalFunction): RationalFunction {
  const s = RationalFunction.variable(LAPLACE);
  switch (e.kind) {
    case "resistor":
      return value.inverse();
    case "conductance":
      return value;
    case "capacitor":
      return s.mul(value);
    case "inductor":
      return s.mul(value).inverse();
    default:
      throw new Error(`${e.kind} has no admittance`);
  }
}

export function isPlainNumber(v: RationalFunction): boolean {
  return v.constantValue() !== null;
}

export const ONE = Rational.ONE;
