// The network page, the shared view, the team home and the review margin at the four widths a
// designer uses (phone, small laptop, laptop, desktop): nothing scrolls the page sideways, the
// result card is in the first screenful, and no typeset formula is cut off at its box's edge
// unless that box scrolls. Common practice for responsive pages; the screenshots are looked at.
import { mkdirSync } from "node:fs";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { demoNetworks } from "../../server/db/demo-data.js";
import { ApiClient } from "../support/api.js";
import { launchBrowser, screenshotDir, type TestBrowser } from "../support/browser.js";
import { startTestServer, type TestServer } from "../support/server.js";
import { watchPage } from "./page-watch.js";

const WIDTHS = [390, 1024, 1280, 1440];
const HEIGHT: Record<number, number> = { 390: 844, 1024: 768, 1280: 800, 1440: 900 };

// A resistive ladder of three sections behind the demo's own bridge source: results long enough
// (sums of dozens of products) to need breaking into lines on every screen.
function ladderCircuit() {
  const source = { ...demoNetworks[0].circuit.elements[0], name: "Bridge", nodes: ["n0", "0"], value: "Vs" };
  const elements: unknown[] = [source];
  for (let i = 1; i <= 3; i++) {
    elements.push({ name: `Rseries${i}`, kind: "resistor", nodes: [`n${i - 1}`, `n${i}`], value: `R_s${i}` });
    elements.push({ name: `Rshunt${i}`, kind: "resistor", nodes: [`n${i}`, "0"], value: `R_p${i}` });
  }
  return { ground: "0", port: { plus: "n3", minus: "0" }, elements };
}

interface Layout {
  overflow: number;
  cardTop: number | null;
  cutFormulas: string[];
}

// Measured in the page: document overflow, the result card's top, and formulas wider than a box that does not scroll.
async function measure(page: Page): Promise<Layout> {
  return page.evaluate(() => {
    const overflow = document.documentElement.scrollWidth - window.innerWidth;
    const card = document.querySelector("[data-result-card]");
    const cutFormulas: string[] = [];
    for (const math of Array.from(document.querySelectorAll<HTMLElement>(".katex"))) {
      if (math.closest("dialog:not([open])") || math.offsetParent === null) continue;
      const right = Math.max(...Array.from(math.querySelectorAll(".katex-html .base")).map((b) => b.getBoundingClientRect().right));
      if (!Number.isFinite(right)) continue;
      // The first ancestor that clips: it must scroll when the formula is wider than it.
      let box: HTMLElement | null = math.parentElement;
      while (box && getComputedStyle(box).overflowX === "visible") box = box.parentElement;
      const edge = box ? box.getBoundingClientRect().right : window.innerWidth;
      const scrolls = box !== null && ["auto", "scroll"].includes(getComputedStyle(box).overflowX) && box.scrollWidth > box.clientWidth;
      if (right > edge + 1 && !scrolls) cutFormulas.push(`${(math.textContent ?? "").slice(0, 40)} (${Math.round(right - edge)} px past its box)`);
    }
    return { overflow, cardTop: card ? card.getBoundingClientRect().top : null, cutFormulas };
  });
}

describe("the workbench at every width", () => {
  let server: TestServer;
  let browser: TestBrowser;
  let page: Page;
  let api: ApiClient;
  let networkId = "";
  let teamId = "";
  let shareUrl = "";
  let notedStep = "";
  const pageErrors: string[] = [];

  beforeAll(async () => {
    mkdirSync(screenshotDir, { recursive: true });
    server = await startTestServer();
    api = new ApiClient(server.url);
    const who = { name: "Wen Widths", email: `wen-${Date.now().toString(36)}@example.com`, password: "every width counts" };
    expect((await api.post("/api/auth/signup", who)).status).toBe(201);
    teamId = (await api.get("/api/me")).body.teams[0].id;
    const created = await api.post(`/api/teams/${teamId}/networks`, {
      title: "Bridge ladder into the ADC driver, three sections",
      description: "How the bridge's ladder of series and shunt arms looks from the last node.",
      circuit: ladderCircuit(),
    });
    expect(created.status).toBe(201);
    networkId = created.body.id;
    const solved = await api.post(`/api/networks/${networkId}/solve`);
    expect(solved.status).toBe(201);
    // A review note on a step and a verdict, so the margin has something to show.
    const steps = solved.body.steps as { id: string }[];
    notedStep = steps[2].id;
    expect((await api.post(`/api/networks/${networkId}/revisions/1/comments`, { stepId: steps[2].id, body: "Does the third shunt arm include the gauge's lead resistance?" })).status).toBe(201);
    expect((await api.put(`/api/networks/${networkId}/revisions/1/verdict`, { verdict: "needs_changes", note: "Name the lead resistance in the third shunt arm." })).status).toBe(200);
    const share = await api.post(`/api/networks/${networkId}/revisions/1/share`, {});
    expect(share.status).toBe(201);
    shareUrl = new URL(share.body.url).pathname;
    browser = await launchBrowser();
    const [name, value] = api.cookie!.split("=");
    await browser.context.addCookies([{ name, value, url: server.url }]);
    page = await browser.context.newPage();
    watchPage(page, pageErrors);
    // A shared machine can be slow to typeset a long ledger; the checks are about layout, not speed.
    page.setDefaultTimeout(60_000);
    // The raw TeX source must never be on screen, not even while KaTeX loads.
    await page.addInitScript(() => {
      new MutationObserver((mutations) => {
        for (const m of mutations)
          for (const node of Array.from(m.addedNodes)) {
            // KaTeX's own output carries the source in its MathML annotation; that is not on screen.
            if (node instanceof Element && (node.closest(".katex") || node.querySelector(".katex"))) continue;
            if (/\\frac|\\mathit/.test(node.textContent ?? "")) (window as unknown as { rawTexSeen: boolean }).rawTexSeen = true;
          }
      }).observe(document, { subtree: true, childList: true });
    });
  });
  afterAll(async () => {
    await browser?.close();
    await server?.close();
  });

  for (const width of WIDTHS) {
    it(`network page at ${width} px: no sideways page scroll, the answer first, no formula cut off`, async () => {
      await page.setViewportSize({ width, height: HEIGHT[width] });
      await page.goto(`${server.url}/networks/${networkId}`);
      await page.locator("[data-result-card] .katex").first().waitFor();
      await page.locator('ol[aria-label="Ledger"] .katex').first().waitFor();
      await page.waitForTimeout(300); // line breaking settles after the first measure
      const layout = await measure(page);
      expect(layout.overflow).toBeLessThanOrEqual(0);
      expect(layout.cardTop).not.toBeNull();
      expect(layout.cardTop!).toBeLessThan(HEIGHT[width] - 120);
      expect(layout.cutFormulas).toEqual([]);
      // The title is readable: it has a width, on a phone too.
      const title = await page.getByRole("heading", { level: 1 }).boundingBox();
      expect(title!.width).toBeGreaterThan(200);
      expect(await page.evaluate(() => (window as unknown as { rawTexSeen?: boolean }).rawTexSeen ?? false)).toBe(false);
      await page.screenshot({ path: `${screenshotDir}/network-page-${width}.png`, fullPage: true });
      // The first screenful too: what a designer sees on opening the network.
      await page.screenshot({ path: `${screenshotDir}/network-page-${width}-first-screen.png` });
    });

    it(`review margin at ${width} px: the note sits beside its step or folds under it`, async () => {
      await page.setViewportSize({ width, height: HEIGHT[width] });
      await page.goto(`${server.url}/networks/${networkId}/r/1`);
      const step = page.locator(`li[id="step-${notedStep}"]`);
      const note = step.getByText("Does the third shunt arm include");
      await note.waitFor();
      await note.scrollIntoViewIfNeeded();
      // Formulas typeset late move the steps: measure once the layout holds still.
      let noteBox = (await note.boundingBox())!;
      let stepBox = (await step.boundingBox())!;
      for (let settled = 0; settled < 20; settled++) {
        await page.waitForTimeout(150);
        const [n, s] = [(await note.boundingBox())!, (await step.boundingBox())!];
        const still = n.y === noteBox.y && s.y === stepBox.y && s.height === stepBox.height;
        [noteBox, stepBox] = [n, s];
        if (still) break;
      }
      // Beside the step from ~1400 px, under its equation below that; inside the step's row either way.
      expect(noteBox.y).toBeGreaterThanOrEqual(stepBox.y);
      expect(noteBox.y + noteBox.height).toBeLessThanOrEqual(stepBox.y + stepBox.height + 1);
      if (width >= 1400) expect(noteBox.x).toBeGreaterThan(stepBox.x + stepBox.width / 2);
      expect((await measure(page)).overflow).toBeLessThanOrEqual(0);
      await page.screenshot({ path: `${screenshotDir}/review-flow-${width}.png`, fullPage: false, clip: { x: 0, y: Math.max(0, noteBox.y - 300), width, height: Math.min(HEIGHT[width], 700) } });
    });

    it(`shared view at ${width} px: the same holds signed out`, async () => {
      const anonymous = await browser.context.browser()?.newContext();
      const view = anonymous ? await anonymous.newPage() : await browser.context.newPage();
      if (!anonymous) await browser.context.clearCookies();
      watchPage(view, pageErrors);
      view.setDefaultTimeout(60_000);
      await view.setViewportSize({ width, height: HEIGHT[width] });
      await view.goto(`${server.url}${shareUrl}`);
      await view.locator("[data-result-card] .katex").first().waitFor();
      await view.waitForTimeout(300);
      const layout = await measure(view);
      expect(layout.overflow).toBeLessThanOrEqual(0);
      expect(layout.cardTop!).toBeLessThan(HEIGHT[width] - 120);
      expect(layout.cutFormulas).toEqual([]);
      await view.screenshot({ path: `${screenshotDir}/shared-view-${width}.png`, fullPage: true });
      await view.close();
      if (!anonymous) {
        const [name, value] = api.cookie!.split("=");
        await browser.context.addCookies([{ name, value, url: server.url }]);
      }
    });

    it(`team home at ${width} px: the table scrolls inside itself, never the page`, async () => {
      await page.setViewportSize({ width, height: HEIGHT[width] });
      await page.goto(`${server.url}/teams/${teamId}`);
      await page.getByRole("link", { name: /Bridge ladder/ }).first().waitFor();
      expect((await measure(page)).overflow).toBeLessThanOrEqual(0);
      await page.screenshot({ path: `${screenshotDir}/team-home-${width}.png`, fullPage: true });
    });
  }

  it("raised no uncaught error and no console error in the page on the way", () => {
    expect(pageErrors).toEqual([]);
  });
});
