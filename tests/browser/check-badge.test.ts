// The check badge in chromium: after a solve every mark says what it did, and the badge links to
// the page that lists every check and every outside reference.
import { mkdirSync } from "node:fs";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { ApiClient } from "../support/api.js";
import { launchBrowser, screenshotDir, type TestBrowser } from "../support/browser.js";
import { startTestServer, type TestServer } from "../support/server.js";
import { watchPage } from "./page-watch.js";
import { importNetlist, shot, signInThroughForm } from "./page-steps.js";

// A sensor behind a finite-gain follower (Sedra & Smith, 7th ed., ch. 2; from memory): every mark applies.
const FOLLOWER = `port out 0
Sensor voltage in 0 = Vs
Amp voltage x 0 = A * across(in, out)
Rout resistor x out = Ro
`;

const run = Date.now().toString(36);
const user = { name: "Cleo Checks", email: `cleo-${run}@example.com`, password: "check password 1" };

describe("the check badge in chromium", () => {
  let server: TestServer;
  let browser: TestBrowser;
  let page: Page;
  const pageErrors: string[] = [];

  beforeAll(async () => {
    mkdirSync(screenshotDir, { recursive: true });
    server = await startTestServer();
    expect((await new ApiClient(server.url).post("/api/auth/signup", user)).status).toBe(201);
    browser = await launchBrowser();
    page = await browser.context.newPage();
    watchPage(page, pageErrors);
  });
  afterAll(async () => {
    await browser?.close();
    await server?.close();
  });

  it("shows four marks after a solve, each with what it did", async () => {
    await signInThroughForm(page, server.url, user);
    await importNetlist(page, { name: "follower.pfn", text: FOLLOWER, title: "Sensor follower" });
    await page.getByRole("button", { name: "Solve", exact: true }).click();
    await page.waitForURL(/\/r\/1$/, { timeout: 30_000 });
    const badge = page.getByRole("list", { name: "Check badge" });
    await badge.waitFor();
    const marks = badge.locator("li");
    expect(await marks.count()).toBe(4);
    expect(await marks.evaluateAll((items) => items.map((i) => i.getAttribute("data-mark-state")))).toEqual(["true", "true", "true", "true"]);
    expect(await marks.nth(0).getAttribute("title")).toMatch(/^Agreed at 3 points.*Drove 1 A into the port/);
    await page.getByText("What each check did").click();
    const details = page.getByRole("definition").filter({ hasText: "exact rational elimination" });
    expect(await details.textContent()).toMatch(/Equal exactly at 2 points/);
    await shot(page, "check-badge-details");
  });

  it("links to the page that lists every check and outside reference", async () => {
    await page.getByRole("link", { name: "How results are checked" }).click();
    await page.waitForURL(/\/how-results-are-checked$/);
    // The route's module loads after the address changes: wait for its heading, not the old page's.
    await page.getByRole("heading", { level: 1, name: "How results are checked" }).waitFor();
    expect(await page.getByRole("heading", { level: 1 }).textContent()).toBe("How results are checked");
    expect(await page.getByText("Razavi, Design of Analog CMOS Integrated Circuits, 2nd ed., ch. 3").count()).toBe(1);
    expect(await page.getByText("66 networks").count()).toBe(1);
    await shot(page, "how-results-are-checked");
    expect(pageErrors).toEqual([]);
  });
});
