// Diagnostics: one stable code per way a network can be ill-posed, with the elements involved.

import type { Diagnostic, Severity } from "../types";

/** Every code the engine emits, with what it means. Codes are stable: clients key on them. */
export const DIAGNOSTIC_CODES = {
  "parse-error": "the text netlist does not follow Portfold's netlist syntax",
  "invalid-json": "the input looks like JSON but is not valid JSON",
  "schema-invalid": "the JSON does not have the shape of a Portfold network",
  "value-syntax": "an element value is not a valid expression",
  "duplicate-name": "two elements share a name",
  "empty-network": "the network has no elements",
  "port-unknown-node": "a port terminal is not a node of any element",
  "port-same-node": "both port terminals are the same node",
  "control-missing-element": "a current control names an element that does not exist",
  "control-self": "a source is controlled by its own current",
  "control-unknown-node": "a voltage control names a node no element touches",
  "control-nonlinear": "a source value is not linear in its controls (a control squared, in a denominator, or two multiplied)",
  "format-renamed": "a word of the earlier format (an element kind, the control member, the cell option include), with the word that replaced it",
  "control-unsupported": "a current control names an element without a single reference current (an op-amp)",
  "value-zero": "a resistor or inductor has value 0 (an infinite admittance)",
  "floating-node": "a node has no path to ground through the elements",
  "no-dc-path": "a node reaches ground only through capacitors (the result still holds in s)",
  "voltage-source-loop": "voltage sources (and op-amp inputs) form a loop",
  "current-source-cutset": "a set of nodes is joined to the rest only by current sources",
  "singular-system": "the nodal equations have no unique solution for another reason",
  "option-invalid": "a solve option (value, limit or target) cannot be read",
  "quantity-conflict": "one symbol is given two different quantities by the elements it sits on",
  "dimension-mismatch": "a result does not come out in its unit",
  "cell-unknown": "a cell instance names a cell that is not defined",
  "cell-terminals": "a cell instance leaves a terminal unconnected or names one the cell does not have",
  "cell-symbols": "a cell instance renames a symbol the cell does not have, or includes a part it does not have",
} as const;

export type DiagnosticCode = keyof typeof DIAGNOSTIC_CODES;

const WARNINGS: ReadonlySet<DiagnosticCode> = new Set(["no-dc-path", "quantity-conflict", "dimension-mismatch"]);

export function diagnostic(
  code: DiagnosticCode,
  message: string,
  where: { elements?: string[]; nodes?: string[]; line?: number; column?: number; path?: (string | number)[] } = {},
): Diagnostic {
  const severity: Severity = WARNINGS.has(code) ? "warning" : "error";
  const d: Diagnostic = { code, severity, message, elements: where.elements ?? [], nodes: where.nodes ?? [] };
  if (where.line !== undefined) d.line = where.line;
  if (where.column !== undefined) d.column = where.column;
  if (where.path !== undefined) d.path = where.path;
  return d;
}

export function hasErrors(diagnostics: readonly Diagnostic[]): boolean {
  return diagnostics.some((d) => d.severity === "error");
}
