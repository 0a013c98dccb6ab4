// Edits made outside the text (element table, drawing) keep the designer's netlist as typed,
// long results break into lines KaTeX can typeset, and limits use the signs quantities imply.
import { execFileSync } from "node:child_process";
import katex from "katex";
import { describe, expect, it } from "vitest";
import { breakEquation, breakExpression, typesetLength } from "@/components/ui/tex-lines";
import { limitWithSigns, positiveSymbols } from "@/features/analysis/lib/limit-sign";
import { keepTypedLines } from "@/features/network-editor/lib/keep-lines";
import { parseNetlistText, type EngineNetwork } from "@/lib/engine-netlist";
import { readExpression } from "@/lib/engine";

const typed = `# strain bridge, top leg first
ground 0
port mid 0

Rtop   resistor in mid = R_top   # 10k nominal
Rbot resistor mid 0 = R_bot

# load of the next stage
Rload resistor mid 0 = R_L
`;

const read = (text: string) => parseNetlistText(text).network as EngineNetwork;

describe("keepTypedLines", () => {
  it("rewrites only the line of the element that changed, keeping its comment", () => {
    const network = read(typed);
    const next = { ...network, elements: network.elements.map((e) => (e.name === "Rtop" && e.kind !== "opamp" ? { ...e, value: "R_top + R_trim" } : e)) };
    const text = keepTypedLines(typed, next);
    const before = typed.split("\n");
    const after = text.split("\n");
    expect(after).toHaveLength(before.length);
    expect(after.filter((l, i) => l !== before[i])).toEqual(["Rtop resistor in mid = R_top + R_trim   # 10k nominal"]);
    // What the text reads as is exactly the edited network (the engine's own reader is the judge).
    expect(read(text)).toEqual(next);
  });

  it("adds a new element after the last element line and drops a removed one's line only", () => {
    const network = read(typed);
    const next = { ...network, elements: [...network.elements.filter((e) => e.name !== "Rbot"), { name: "Cload", kind: "capacitor" as const, nodes: ["mid", "0"] as [string, string], value: "C_L" }] };
    const text = keepTypedLines(typed, next);
    expect(text).toContain("# strain bridge, top leg first\nground 0\nport mid 0\n\nRtop   resistor in mid = R_top   # 10k nominal\n\n# load of the next stage\nRload resistor mid 0 = R_L\nCload capacitor mid 0 = C_L\n");
    expect(read(text).elements.map((e) => e.name)).toEqual(["Rtop", "Rload", "Cload"]);
  });

  it("moves the port on its own line and renames an element in place", () => {
    const network = read(typed);
    const next = { ...network, port: { plus: "in", minus: "0" }, elements: network.elements.map((e) => (e.name === "Rload" ? { ...e, name: "Rnext" } : e)) };
    const text = keepTypedLines(typed, next);
    expect(text).toContain("port in 0\n");
    expect(text).toContain("# load of the next stage\nRnext resistor mid 0 = R_L\n");
    expect(read(text)).toEqual(next);
  });
});

describe("breaking long results into lines", () => {
  // A ladder's numerator: a sum of many products, longer than any phone screen.
  const terms = Array.from({ length: 14 }, (_, i) => `R_{${i + 1}}\\,R_{${i + 2}}`);
  const long = `\\frac{${terms.join(" + ")}}{R_{1} + R_{2} - R_{3}}`;

  it("splits only at top-level + and −, each line within the budget, and KaTeX typesets the result", () => {
    const broken = breakEquation("R_{\\mathrm{th}}", long, 40);
    expect(broken).toContain("\\\\");
    expect(() => katex.renderToString(broken, { throwOnError: true, displayMode: true })).not.toThrow();
    const numerator = /\\begin\{gathered\}(.*?)\\end\{gathered\}/.exec(broken)![1];
    const lines = numerator.split(" \\\\ ");
    expect(lines.length).toBeGreaterThan(2);
    for (const line of lines) expect(typesetLength(line)).toBeLessThanOrEqual(40);
    // Nothing is lost: the lines joined again are the numerator's terms, in order.
    expect(lines.join(" ").replace(/\s+/g, " ")).toBe(terms.join(" + "));
  });

  it("leaves a short result as it is, and breaks a product's long parenthesised sum inside sized parentheses", () => {
    expect(breakExpression("\\frac{R_o}{A + 1}", 40)).toBe("\\frac{R_o}{A + 1}");
    const grouped = `R_{4} \\left(${terms.join(" + ")}\\right)`;
    const broken = breakExpression(`\\frac{${grouped}}{R_{1} + R_{2}}`, 30);
    expect(broken).toContain("R_{4} \\Bigl(");
    expect(broken).toContain("\\Bigr)");
    expect(() => katex.renderToString(broken, { throwOnError: true, displayMode: true })).not.toThrow();
    // Two groups side by side are left whole: which one to break is not ours to guess.
    const two = `\\left(${terms.join(" + ")}\\right) \\left(a + b\\right)`;
    expect(breakExpression(two, 20)).toBe(two);
  });
});

// sympy with the symbols declared positive, as a resistance is (Debian python3-sympy).
function sympyLimit(expr: string, symbol: string, positive: string[]): string {
  const program = `import sympy\nnames = ${JSON.stringify(positive)}\nloc = {n: sympy.Symbol(n, positive=True) for n in names}\nexpr = sympy.sympify(${JSON.stringify(expr)}, locals=loc)\nprint(sympy.limit(expr, loc[${JSON.stringify(symbol)}], sympy.oo))`;
  return execFileSync("/usr/bin/python3", ["-c", program], { encoding: "utf8", timeout: 100_000 }).trim();
}

describe("limits with positive quantities", () => {
  it("gives R_f → ∞ a sign when every other symbol is a positive quantity, as sympy does with positive symbols", () => {
    const quantities = { R_f: "resistance", R_1: "resistance", R_2: "resistance", A: "dimensionless" };
    const positive = positiveSymbols(quantities);
    const growing = readExpression("R_f*R_2/R_1");
    expect(growing.limit("R_f", "inf")).toEqual({ kind: "infinite", sign: 0 });
    expect(limitWithSigns(growing, "R_f", "inf", positive)).toEqual({ kind: "infinite", sign: 1 });
    expect(sympyLimit("R_f*R_2/R_1", "R_f", ["R_f", "R_1", "R_2"])).toBe("oo");
    const falling = readExpression("-R_f*R_2/R_1");
    expect(limitWithSigns(falling, "R_f", "inf", positive)).toEqual({ kind: "infinite", sign: -1 });
    expect(sympyLimit("-R_f*R_2/R_1", "R_f", ["R_f", "R_1", "R_2"])).toBe("-oo");
    // A gain may have either sign: the sign stays open.
    expect(limitWithSigns(readExpression("R_f*A/R_1"), "R_f", "inf", positive)).toEqual({ kind: "infinite", sign: 0 });
  }, 120_000);
});
