// The Frequency panel and design solve in chromium: a sensor's RC output network gets its Bode
// plot of |Zth| and phase with the DC and high-frequency limits, its pole and zero, and a design
// solve for the shunt resistor, including a target no value meets.
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { TestServer } from "../support/server.js";
import { importNetlist, shot, signedUpSession, signInThroughForm, type SignedUpSession } from "./page-steps.js";

// Zth = Rs + R/(1 + sRC): DC limit Rs + R, high-frequency limit Rs (common practice),
// pole at s = −1/(RC), zero at s = −(Rs + R)/(Rs·R·C).
const SENSOR_RC = `# sensor output: series resistor, then a shunt RC
ground 0
port out 0
Rser resistor out n = Rs
Rsh resistor n 0 = R
Csh capacitor n 0 = C
`;

const run = Date.now().toString(36);
const user = { name: "Fran Freq", email: `fran-${run}@example.com`, password: "first password 1" };

describe("frequency panel and design solve in chromium", () => {
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

  it("solves the RC network and draws the Bode plot with its limits, pole and zero", async () => {
    await signInThroughForm(page, server.url, user);
    await importNetlist(page, { name: "sensor-rc.pfn", text: SENSOR_RC, title: "Sensor RC" });
    await page.getByRole("button", { name: "Solve", exact: true }).click();
    await page.waitForURL(/\/r\/1$/, { timeout: 30_000 });

    const frequency = page.getByRole("region", { name: "Frequency" });
    await frequency.waitFor();
    const limits = frequency.locator('dl[aria-label="Frequency limits of Zth"]');
    await expect(limits.textContent()).resolves.toContain("DC (s → 0)");
    // The panel has several status lines (the plot's caption, the design solve's answer): the one asking for values says what is missing.
    await frequency.getByRole("status").filter({ hasText: /Give C, R, Rs a value/ }).waitFor();

    const values = page.getByRole("region", { name: "Values" });
    await values.getByLabel("Rs", { exact: true }).fill("100");
    await values.getByLabel("R", { exact: true }).fill("1k");
    await values.getByLabel("C", { exact: true }).fill("1u");
    const figure = frequency.getByRole("figure", { name: "Bode plot of Zth" });
    await figure.locator("canvas").nth(1).waitFor();
    expect(await figure.locator("canvas").count()).toBe(2);
    // Limits marked: 1.1 kΩ at DC and 100 Ω at high frequency.
    await expect(figure.textContent()).resolves.toContain("DC limit (1.1 kΩ)");
    await expect(figure.textContent()).resolves.toContain("high-frequency limit (100 Ω)");
    // Pole −1/(RC) = −1000 rad/s (159.2 Hz); zero −(Rs + R)/(Rs R C) = −11000 rad/s (1.751 kHz).
    const poles = await frequency.getByRole("list", { name: "Poles" }).textContent();
    const zeros = await frequency.getByRole("list", { name: "Zeros" }).textContent();
    expect(poles).toBe("s = -1 krad/s (159.2 Hz)");
    expect(zeros).toBe("s = -11 krad/s (1.751 kHz)");
    await frequency.scrollIntoViewIfNeeded();
    await shot(page, "frequency-bode-rc");
  });

  it("solves for R at DC, and states when no value meets the target", async () => {
    const values = page.getByRole("region", { name: "Values" });
    // s = 0 reads the network at DC, where Rth = Rs + R.
    await values.getByLabel("s", { exact: true }).fill("0");
    const form = page.getByRole("form", { name: "Design solve" });
    await form.getByLabel("Result").selectOption("rth");
    await form.getByLabel("Solve for").selectOption("R");
    await form.getByLabel("Target").fill("1.5k");
    await form.getByRole("button", { name: "Solve for R" }).click();
    await expect.poll(() => page.getByTestId("design-solve-number").textContent()).toBe("1.4 kΩ");
    await shot(page, "design-solve-value");
    // Below Rs no positive R helps.
    await form.getByLabel("Target").fill("50 Ω");
    await form.getByRole("button", { name: "Solve for R" }).click();
    const answer = form.getByRole("status", { name: "Design solve answer" });
    await expect.poll(() => answer.textContent()).toMatch(/^No value meets it: no positive resistance meets it: the equation gives R = -50\.00/);
    await shot(page, "design-solve-none");
    expect(pageErrors).toEqual([]);
  });
});
