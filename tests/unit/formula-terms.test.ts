// Terms of a TeX formula for note anchors. Grouping follows TeX's own rule that braces make one group
// (Knuth, The TeXbook, chapter 5, from memory); every term must be a verbatim stretch of the formula,
// because that is what the server checks a formula anchor against.
import { describe, expect, it } from "vitest";
import { formulaTerms } from "../../src/features/review/lib/formula-terms";

describe("formula terms", () => {
  it("splits at top-level relations and signs, keeping braced groups whole", () => {
    const tex = "V_{\\mathrm{th}} = \\frac{A V_s}{1 + A} - I_{b} R_{o}";
    expect(formulaTerms(tex)).toEqual(["V_{\\mathrm{th}}", "\\frac{A V_s}{1 + A}", "I_{b} R_{o}"]);
  });

  it("keeps \\left( … \\right) together and splits matrix rows and columns", () => {
    expect(formulaTerms("x = \\left(a + b\\right) c")).toEqual(["x", "\\left(a + b\\right) c"]);
    expect(formulaTerms("\\begin{bmatrix} g_1 & -g_2 \\\\ g_3 & g_4 \\end{bmatrix}")).toContain("g_3");
  });

  it("gives only stretches of the formula as stored", () => {
    const tex = "R_{th} = \\frac{R_o}{1 + \\mu} , \\quad I_{sc} = \\frac{\\mu V_s}{R_o}";
    for (const term of formulaTerms(tex)) expect(tex).toContain(term);
  });
});
