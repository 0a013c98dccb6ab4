// The bounds on what a person may type into one expression, checked before anything parses it.
import { expressionBreach, type ExpressionBounds, type ExpressionBreach } from "../../shared/engine/algebra/expression-bounds.js";
import { Unprocessable } from "./errors.js";

const boundSetting: Record<ExpressionBreach["bound"], string> = {
  characters: "EXPRESSION_MAX_CHARS",
  terms: "EXPRESSION_MAX_TERMS",
  depth: "EXPRESSION_MAX_DEPTH",
  exponent: "EXPRESSION_MAX_EXPONENT",
};

const boundWords: Record<ExpressionBreach["bound"], string> = {
  characters: "characters",
  terms: "terms (numbers and names)",
  depth: "levels of nested brackets",
  exponent: "as the power it reaches (exponents multiply through nested brackets)",
};

/** Every user-typed expression of a network (JSON or netlist text) or a cell definition, with where it sits. */
function typedExpressions(input: unknown): { where: string; text: string }[] {
  if (typeof input === "string" && input.trimStart().startsWith("{")) {
    try {
      return typedExpressions(JSON.parse(input));
    } catch {
      return [];
    }
  }
  if (typeof input === "string") {
    return input.split(/\r?\n/).flatMap((line, i) => {
      const eq = line.indexOf("=");
      return eq < 0 ? [] : [{ where: `line ${i + 1}`, text: line.slice(eq + 1) }];
    });
  }
  const found: { where: string; text: string }[] = [];
  const elementValues = (elements: unknown, prefix: string) => {
    if (!Array.isArray(elements)) return;
    elements.slice(0, 10_000).forEach((e, i) => {
      const value = (e as { value?: unknown })?.value;
      if (typeof value === "string") found.push({ where: `${prefix}elements[${i}].value`, text: value });
    });
  };
  const network = (input ?? {}) as { elements?: unknown; cellDefinitions?: unknown; cells?: unknown };
  elementValues(network.elements, "");
  if (Array.isArray(network.cellDefinitions)) network.cellDefinitions.slice(0, 1_000).forEach((d, j) => elementValues((d as { elements?: unknown })?.elements, `cellDefinitions[${j}].`));
  if (Array.isArray(network.cells)) {
    network.cells.slice(0, 10_000).forEach((c, k) => {
      const symbols = (c as { symbols?: unknown })?.symbols;
      if (symbols && typeof symbols === "object") for (const [name, text] of Object.entries(symbols)) if (typeof text === "string") found.push({ where: `cells[${k}].symbols.${name}`, text });
    });
  }
  return found;
}

/**
 * Refuses, before anything parses it, a network or cell whose typed expressions go past a size bound:
 * 422 `expression_too_large` naming the bound, its setting and where the expression sits. Returns
 * how many typed characters it checked.
 */
export function checkExpressionBounds(input: unknown, bounds: ExpressionBounds): number {
  let typedChars = 0;
  for (const { where, text } of typedExpressions(input)) {
    typedChars += text.length;
    const found = expressionBreach(text, bounds);
    if (!found) continue;
    const setting = boundSetting[found.bound];
    throw new Unprocessable(
      "expression_too_large",
      `The expression at ${where} is too large to read: it has ${found.actual} ${boundWords[found.bound]}, over the bound of ${found.limit} set by ${setting}.`,
      { fields: { [where]: `over the ${found.bound} bound of ${found.limit}` }, details: { bound: { ...found, setting, where } } },
    );
  }
  return typedChars;
}
