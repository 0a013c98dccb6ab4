// The check badge shows a planted failure: each mark that is false renders ✗ with its outcome,
// and a revision solved before the marks said what they did shows the test-source mark as not run.
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { MemoryRouter } from "react-router-dom";
import { describe, expect, it } from "vitest";
import { CheckBadge } from "../../src/features/derivations/components/check-badge";
import type { CheckDetail, CheckMark, RevisionResults } from "../../src/lib/api-contract";

const MARKS: CheckMark[] = ["testSource", "vocIsc", "numeric", "exactPoint"];

// Only what the badge reads of a solve's results.
function resultsWith(agree: Record<CheckMark, boolean | null>, details = true): RevisionResults {
  const detail = (k: CheckMark): CheckDetail => ({ agree: agree[k], method: `method of ${k}.`, outcome: `outcome of ${k}.`, points: 3, relativeError: null });
  return {
    agree: null,
    numericCheck: null,
    checks: { ...agree, ...(details ? { details: Object.fromEntries(MARKS.map((k) => [k, detail(k)])) as Record<CheckMark, CheckDetail> } : {}) },
  } as Partial<RevisionResults> as RevisionResults;
}

const render = (results: RevisionResults) => renderToStaticMarkup(createElement(MemoryRouter, null, createElement(CheckBadge, { results })));

describe("check badge", () => {
  it.each(MARKS)("a planted failure of %s shows ✗ on that mark alone, with its outcome", (failing) => {
    const html = render(resultsWith(Object.fromEntries(MARKS.map((k) => [k, k !== failing])) as Record<CheckMark, boolean>));
    const states = [...html.matchAll(/data-mark-state="(\w+)"/g)].map((m) => m[1]);
    expect(states).toEqual(MARKS.map((k) => (k === failing ? "false" : "true")));
    expect(html).toContain(`outcome of ${failing}. method of ${failing}.`);
    expect(html).toContain('href="/how-results-are-checked"');
  });

  it("an older revision without details shows its test-source mark as not run, never ✓", () => {
    // As such a revision was stored: three marks, no exact-point mark, no details.
    const older = resultsWith({ testSource: true, vocIsc: true, numeric: true } as Record<CheckMark, boolean>, false);
    const states = [...render(older).matchAll(/data-mark-state="(\w+)"/g)].map((m) => m[1]);
    expect(states).toEqual(["none", "true", "true", "none"]);
  });
});
