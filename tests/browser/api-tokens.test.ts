// The account page in chromium: a token is made, shown once, works as a bearer secret, and is revoked; the API reference renders.
import { mkdirSync } from "node:fs";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { launchBrowser, screenshotDir, type TestBrowser } from "../support/browser.js";
import { fixturePassword, signedInPerson, type Person } from "../support/fixtures.js";
import { startTestServer, type TestServer } from "../support/server.js";
import { shot, signInThroughForm } from "./page-steps.js";
import { watchPage } from "./page-watch.js";

// At a phone's width and a laptop's: a picture of each, and nothing wider than the window (common practice: no sideways scrolling of the page).
async function atWidths(page: Page, name: string): Promise<string[]> {
  const overflows: string[] = [];
  for (const width of [390, 1280]) {
    await page.setViewportSize({ width, height: 900 });
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    if (overflow > 0) overflows.push(`${name} at ${width} px: ${overflow} px wider than the window`);
    await shot(page, `${name}-${width}`);
  }
  return overflows;
}

describe("API tokens on the account page", () => {
  let server: TestServer;
  let browser: TestBrowser;
  let person: Person;
  beforeAll(async () => {
    server = await startTestServer();
    browser = await launchBrowser();
    person = await signedInPerson(server, "scripter");
    mkdirSync(screenshotDir, { recursive: true });
  });
  afterAll(async () => {
    await browser?.close();
    await server?.close();
  });

  it("creates a token, shows its secret once, and revokes it", { timeout: 120_000 }, async () => {
    const problems: string[] = [];
    const page = watchPage(await browser.context.newPage(), problems);
    await signInThroughForm(page, server.url, { email: person.user.email, password: fixturePassword });
    await page.getByRole("link", { name: person.user.name, exact: true }).click();
    await page.waitForURL(/\/account$/);
    await page.getByLabel("Name").fill("line-driver CI");
    await page.getByLabel("Scope").selectOption("solve");
    await page.getByRole("button", { name: "Create token" }).click();
    const secret = (await page.getByLabel("New token").textContent())!.trim();
    expect(secret).toMatch(/^pft_[A-Za-z0-9_-]{43}$/);
    await expect(page.getByRole("row", { name: /line-driver CI/ }).textContent()).resolves.toContain("read + solve");
    expect(await atWidths(page, "account-api-tokens")).toEqual([]);

    // The secret works as a bearer token for a script.
    const me = await fetch(`${server.url}/api/account/tokens/current`, { headers: { Authorization: `Bearer ${secret}` } });
    expect(me.status).toBe(200);

    // Once dismissed, the page never shows it again.
    await page.getByRole("button", { name: "Done" }).click();
    await page.reload();
    await page.getByRole("row", { name: /line-driver CI/ }).waitFor();
    expect(await page.content()).not.toContain(secret);

    page.once("dialog", (dialog) => dialog.accept());
    await page.getByRole("row", { name: /line-driver CI/ }).getByRole("button", { name: "Revoke" }).click();
    await page.getByText("No tokens yet.").waitFor();
    const revoked = await fetch(`${server.url}/api/account/tokens/current`, { headers: { Authorization: `Bearer ${secret}` } });
    expect(revoked.status).toBe(401);
    expect(problems).toEqual([]);
  });

  it("renders the API reference from the server's OpenAPI document", { timeout: 60_000 }, async () => {
    const problems: string[] = [];
    const page = watchPage(await browser.context.newPage(), problems);
    await page.goto(`${server.url}/api-reference`);
    await page.getByRole("heading", { name: "Schemas" }).waitFor();
    await expect(page.locator("code", { hasText: "/api/account/tokens/current" }).count()).resolves.toBeGreaterThan(0);
    await expect(page.locator("#schema-CreateTokenRequest").textContent()).resolves.toContain("expiresInDays");
    expect(await atWidths(page, "api-reference")).toEqual([]);
    expect(problems).toEqual([]);
  });
});
