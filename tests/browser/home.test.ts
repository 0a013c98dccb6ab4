import { mkdirSync } from "node:fs";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { launchBrowser, screenshotDir, type TestBrowser } from "../support/browser.js";
import { startTestServer, type TestServer } from "../support/server.js";

describe("home page in chromium", () => {
  let server: TestServer;
  let browser: TestBrowser;
  beforeAll(async () => {
    server = await startTestServer();
    browser = await launchBrowser();
  });
  afterAll(async () => {
    await browser?.close();
    await server?.close();
  });

  it("shows the product's name, loads fonts from the bundle, and makes no outside requests", async () => {
    const page = await browser.context.newPage();
    const requests: string[] = [];
    page.on("request", (request) => requests.push(request.url()));
    await page.goto(server.url, { waitUntil: "networkidle" });
    await expect(page.getByRole("heading", { level: 1 }).textContent()).resolves.toBe("Portfold");
    const fontRequests = requests.filter((url) => /\.woff2?($|\?)/.test(url));
    expect(fontRequests.length).toBeGreaterThan(0);
    expect(requests.every((url) => url.startsWith(server.url))).toBe(true);
    const bodyFont = await page.evaluate(() => getComputedStyle(document.body).fontFamily);
    expect(bodyFont).toContain("IBM Plex Sans");
    mkdirSync(screenshotDir, { recursive: true });
    await page.screenshot({ path: `${screenshotDir}/home.png`, fullPage: true });
  });

  it("shows a not-found page for an unknown address", async () => {
    const page = await browser.context.newPage();
    await page.goto(`${server.url}/no/such/page`);
    await expect(page.getByRole("heading", { level: 1 }).textContent()).resolves.toBe("Nothing at this address");
  });
});
