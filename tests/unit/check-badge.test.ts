// The check badge shows a planted failure: each mark that is false renders ✗ with its outcome,
// and a revision solved before the marks said what they did shows the test-source mark as not run.
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { MemoryRouter } from "react-router-dom";
import { describe, expect, it } from "vitest";
import { normaliseRevision } from "../../src/features/derivations/api/normalise-revision";
import { CheckBadge } from "../../src/features/derivations/components/check-badge";
import type { CheckDetail, CheckMark, Results } from "../../src/types/api";

const MARKS: CheckMark[] = ["testSource", "vocIsc", "numeric", "exactPoint"];

function resultsWith(agree: Record<CheckMark, boolean | null>): Results {
  const detail = (k: CheckMark): CheckDetail => ({ agree: agree[k], method: `method of ${k}.`, outcome: `outcome of ${k}.`, points: 3, relativeError: null });
  return {
    vth: null,
    isc: null,
    rth: null,
    rthFromVocIsc: null,
    agree: null,
    statements: [],
    checks: { ...agree, details: Object.fromEntries(MARKS.map((k) => [k, detail(k)])) as Record<CheckMark, CheckDetail> },
    quantities: {},
    dimensionChecks: {},
  };
}

const render = (results: Results) => renderToStaticMarkup(createElement(MemoryRouter, null, createElement(CheckBadge, { results })));

describe("check badge", () => {
  it.each(MARKS)("a planted failure of %s shows ✗ on that mark alone, with its outcome", (failing) => {
    const html = render(resultsWith(Object.fromEntries(MARKS.map((k) => [k, k !== failing])) as Record<CheckMark, boolean>));
    const states = [...html.matchAll(/data-mark-state="(\w+)"/g)].map((m) => m[1]);
    expect(states).toEqual(MARKS.map((k) => (k === failing ? "false" : "true")));
    expect(html).toContain(`outcome of ${failing}. method of ${failing}.`);
    expect(html).toContain('href="/how-results-are-checked"');
  });

  it("an older revision without details shows its test-source mark as not run, never ✓", () => {
    const revision = normaliseRevision({ results: { rth: "R", checks: { testSource: true, vocIsc: true, numeric: true } } } as never);
    expect(revision.results.checks).toMatchObject({ testSource: null, vocIsc: true, numeric: true, exactPoint: null, details: null });
    const states = [...render(revision.results).matchAll(/data-mark-state="(\w+)"/g)].map((m) => m[1]);
    expect(states).toEqual(["none", "true", "true", "none"]);
  });
});
