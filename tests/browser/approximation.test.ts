// The Values panel's approximation within a stated error, in chromium: a cascode current sink's
// output resistance approaches gm·ro² (Razavi, Design of Analog CMOS Integrated Circuits, 2nd ed.,
// from memory) at a design point, the largest error is stated, a dropped term can be locked in and a kept one locked out.
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { readExpression } from "../../shared/engine/algebra";
import type { TestServer } from "../support/server.js";
import { importNetlist, shot, signedUpSession, signInThroughForm, type SignedUpSession } from "./page-steps.js";

const CASCODE = `# cascode current sink, small-signal
ground 0
port d 0
Gm2 current d x = gm2 * across(0, x)
M2ro resistor d x = ro2
M1ro resistor x 0 = ro1
`;

const run = Date.now().toString(36);
const user = { name: "Abe Approx", email: `abe-${run}@example.com`, password: "first password 1" };
const same = (a: string | null, b: string) => a !== null && readExpression(a).sub(readExpression(b)).isZero();

describe("approximation within a stated error in chromium", () => {
  let session: SignedUpSession;
  let server: TestServer;
  let page: Page;
  let pageErrors: string[];

  beforeAll(async () => {
    session = await signedUpSession(user);
    ({ server, page, pageErrors } = session);
  });
  afterAll(async () => {
    await session?.close();
  });

  it("drops the small terms at the design point, states the error, keeps a term locked in and another locked out", async () => {
    await signInThroughForm(page, server.url, user);
    await importNetlist(page, { name: "cascode.pfn", text: CASCODE, title: "Cascode sink" });
    await page.getByRole("button", { name: "Solve", exact: true }).click();
    await page.waitForURL(/\/r\/1$/, { timeout: 30_000 });
    const values = page.getByRole("region", { name: "Values" });
    await values.getByLabel("gm2", { exact: true }).fill("2m");
    await values.getByLabel("ro1", { exact: true }).fill("50k");
    await values.getByLabel("ro2", { exact: true }).fill("50k");
    const approx = values.getByRole("region", { name: "Approximate" });
    await approx.getByLabel("Approximate within a stated error").check();
    const rth = approx.getByTestId("approx-rth");
    await expect.poll(async () => same(await rth.getAttribute("data-infix"), "gm2*ro1*ro2")).toBe(true);
    // ro1 + ro2 beside gm2·ro1·ro2 at gm2·ro = 100: 2 %, stated to three digits.
    await expect.poll(() => approx.getByTestId("approx-error-rth").textContent()).toBe("(largest error 1.96 % at the design point)");
    await shot(page, "approximation-cascode");
    // Locking ro1 in brings it back into the approximate form.
    await approx.getByRole("group", { name: "Terms of Rth" }).getByRole("button", { name: "ro1", exact: true }).click();
    await expect.poll(async () => same(await rth.getAttribute("data-infix"), "gm2*ro1*ro2 + ro1")).toBe(true);
    await shot(page, "approximation-cascode-locked");
    // Locking the kept gm2·ro1·ro2 out drops it whatever it costs, and the cost is stated; clicking again frees it.
    const terms = approx.getByRole("group", { name: "Terms of Rth" });
    const big = terms.getByRole("button", { name: "gm2*ro1*ro2", exact: true });
    await expect.poll(() => big.getAttribute("data-lock")).toBe("free");
    await big.click();
    await expect.poll(() => big.getAttribute("data-lock")).toBe("out");
    await expect.poll(async () => (await rth.getAttribute("data-infix"))?.includes("gm2")).toBe(false);
    await expect.poll(async () => Number((await approx.getByTestId("approx-error-rth").textContent())?.match(/([\d.]+) %/)?.[1])).toBeGreaterThan(90);
    await shot(page, "approximation-cascode-locked-out");
    await big.click();
    await expect.poll(() => big.getAttribute("data-lock")).toBe("free");
    await expect.poll(async () => same(await rth.getAttribute("data-infix"), "gm2*ro1*ro2 + ro1")).toBe(true);
    expect(pageErrors).toEqual([]);
  });
});
