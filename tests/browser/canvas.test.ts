// The schematic canvas in chromium: the finite-gain follower drawn by mouse (a source Vs from in
// to ground, a VCVS mu·across(in, out) to an internal node, R0 from there to out, the port out to
// ground), solved, and read back from the ledger as Rth = R0/(1 + mu).
// Textbook fact (finite-gain voltage follower, Rout = Ro/(1 + A); Sedra & Smith, Microelectronic
// Circuits, from memory): with R0 = 4.7 kΩ and mu = 99, Rth = 4700/100 = 47 Ω.
import { mkdirSync } from "node:fs";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { parseValue } from "../../shared/engine/algebra/index.js";
import { launchBrowser, screenshotDir, type TestBrowser } from "../support/browser.js";
import { linkIn, waitForMail } from "../support/mail.js";
import { startTestServer, type TestServer } from "../support/server.js";
import { watchPage } from "./page-watch.js";
import { shot, signUpThroughForm } from "./page-steps.js";

const run = Date.now().toString(36);
const designer = { name: "Dana Drafter", email: `dana-${run}@example.com`, password: "copper verdigris paper" };

// Grid point → page pixels, from the canvas's own transform.
async function at(page: Page, gx: number, gy: number): Promise<[number, number]> {
  const canvas = page.getByTestId("schematic-canvas");
  const box = (await canvas.boundingBox())!;
  const transform = (await canvas.locator(":scope > g").first().getAttribute("transform"))!;
  const [, tx, ty, s] = /translate\(([-\d.e]+) ([-\d.e]+)\) scale\(([-\d.e]+)\)/.exec(transform)!.map(Number);
  return [box.x + tx + gx * 10 * s, box.y + ty + gy * 10 * s];
}

async function click(page: Page, gx: number, gy: number) {
  const [x, y] = await at(page, gx, gy);
  await page.mouse.click(x, y);
}

async function setPart(page: Page, name: string, fields: Record<string, string>) {
  let current = name;
  for (const [label, value] of Object.entries(fields)) {
    const input = page.getByRole("group", { name: `Part ${current}` }).getByLabel(label, { exact: true });
    await input.fill(value);
    await input.press("Enter");
    // A new name renames the inspector too.
    if (label === "Name") current = value;
  }
}

// A TeX result as KaTeX keeps it, read as plain infix (fractions, Greek letters, subscripts).
function texToInfix(tex: string): string {
  let s = tex.replace(/\\mathit\{([^}]*)\}/g, "$1").replace(/\\mu/g, "mu").replace(/_\{([^}]*)\}/g, "$1").replace(/\\cdot/g, "*").replace(/\\,/g, " ").replace(/\\left|\\right/g, "");
  for (let i = 0; i < 5; i += 1) s = s.replace(/\\frac\{([^{}]*)\}\{([^{}]*)\}/g, "($1)/($2)");
  return s.replace(/\s+/g, " ").replace(/(\w)\s+(\w)/g, "$1*$2");
}

describe("schematic canvas in chromium", () => {
  let server: TestServer;
  let browser: TestBrowser;
  let page: Page;
  let networkUrl = "";
  const problems: string[] = [];

  beforeAll(async () => {
    mkdirSync(screenshotDir, { recursive: true });
    server = await startTestServer();
    browser = await launchBrowser();
    page = watchPage(await browser.context.newPage(), problems);
  });
  afterAll(async () => {
    await browser?.close();
    await server?.close();
  });

  it("signs up and creates an empty network", async () => {
    await page.goto(`${server.url}/sign-up`);
    await signUpThroughForm(page, designer);
    await page.waitForURL(/\/teams\/[0-9a-f-]{36}$/);
    const mail = await waitForMail(server.db, designer.email, { subject: /confirm/i });
    const teamUrl = page.url();
    await page.goto(linkIn(mail, "/verify-email").toString());
    await page.getByText("Your address is confirmed.").waitFor();
    await page.goto(teamUrl);
    await page.getByRole("button", { name: "New network" }).click();
    await page.getByLabel("Title").fill("Line buffer, drawn");
    await page.getByLabel("Network (Portfold netlist or our JSON)").fill("ground 0\nport out 0\n");
    await page.getByRole("button", { name: "Create network" }).click();
    await page.waitForURL(/\/networks\/[0-9a-f-]{36}$/);
    networkUrl = page.url();
  });

  it("draws the finite-gain follower by mouse and the netlist follows", async () => {
    await page.getByRole("tab", { name: "Drawing" }).click();
    const palette = page.getByRole("toolbar", { name: "Palette" });
    for (const kind of ["resistor", "conductance", "capacitor", "inductor", "voltage", "current", "voltage by across", "current by across", "voltage by through", "current by through", "op-amp"]) {
      await palette.getByRole("button", { name: kind, exact: true }).waitFor();
    }
    // The source, standing: + at (0, -3), − at (0, 3).
    await palette.getByRole("button", { name: "voltage", exact: true }).click();
    await click(page, 0, 0);
    await setPart(page, "voltage1", { Name: "Vs", Value: "Vs" });
    // The amplifier, standing at x = 10: a voltage source whose value names its control.
    await palette.getByRole("button", { name: "voltage by across", exact: true }).click();
    await click(page, 10, 0);
    await setPart(page, "voltage1", { Name: "Amp" });
    await setPart(page, "Amp", { Value: "mu * across(in, out)" });
    // The output resistance, lying from (13, -6) to (19, -6).
    await palette.getByRole("button", { name: "resistor", exact: true }).click();
    await click(page, 16, -6);
    await setPart(page, "resistor1", { Name: "Rout", Value: "R0" });

    const tools = page.getByRole("toolbar", { name: "Drawing tools" });
    await tools.getByRole("button", { name: /^Ground/ }).click();
    await click(page, 0, 3);
    await click(page, 10, 3);
    await tools.getByLabel("Node name").fill("in");
    await tools.getByRole("button", { name: /^Name node/ }).click();
    await click(page, 0, -3);
    // Wires by the keyboard's own tool key: C, then point to point.
    await page.getByLabel("Schematic canvas: press ? for the keys").focus();
    await page.keyboard.press("c");
    await click(page, 10, -3);
    await click(page, 13, -6); // an L up to R0's first pin ends the wire there
    await click(page, 19, -6);
    await click(page, 24, -6);
    await page.keyboard.press("Escape");
    await tools.getByLabel("Node name").fill("out");
    await page.getByLabel("Schematic canvas: press ? for the keys").focus();
    await page.keyboard.press("n");
    await click(page, 24, -6);
    // The port: T, then the + terminal and the − terminal.
    await page.getByLabel("Schematic canvas: press ? for the keys").focus();
    await page.keyboard.press("t");
    await click(page, 24, -6);
    await click(page, 10, 3);

    const canvas = page.getByTestId("schematic-canvas");
    await shot(page, "canvas-drawn");
    await expect(canvas.getAttribute("aria-label")).resolves.toBe("Drawing: 3 parts, port out to 0");
    await expect(page.locator('[data-part="Amp"]').getAttribute("aria-label")).resolves.toBe("Amp: voltage, mu * across(in, out)");
    expect(await page.locator("[data-junction]").count()).toBe(0);
    await shot(page, "canvas-drawn");

    // The netlist says what the drawing says.
    await page.getByRole("tab", { name: "Netlist text" }).click();
    const text = await page.getByLabel("Portfold netlist").inputValue();
    expect(text).toMatch(/^port out 0$/m);
    expect(text).toMatch(/^Vs voltage in 0 = Vs$/m);
    const amp = /^Amp voltage (\w+) 0 = mu \* across\(in, out\)$/m.exec(text);
    expect(amp).not.toBeNull();
    expect(text).toMatch(new RegExp(`^Rout resistor ${amp![1]} out = R0$`, "m"));
  });

  it("keeps the help sheet of our own keys", async () => {
    await page.getByRole("tab", { name: "Drawing" }).click();
    await page.getByLabel("Schematic canvas: press ? for the keys").focus();
    await page.keyboard.press("?");
    const sheet = page.getByRole("dialog", { name: "Keys of the drawing" });
    await sheet.waitFor();
    await expect(sheet.textContent()).resolves.toContain("Quarter turn clockwise");
    await page.screenshot({ path: `${screenshotDir}/canvas-help.png` });
    await page.keyboard.press("Escape");
  });

  it("turns a part a quarter with Q, and Ctrl+Z puts it back, Ctrl+Shift+Z turns it again", async () => {
    const body = page.locator('[data-part="Rout"] > g[transform]').first();
    const lying = await body.getAttribute("transform");
    expect(lying).toMatch(/rotate\(0\)/);
    await click(page, 16, -6); // selects R0
    const keys = page.getByLabel("Schematic canvas: press ? for the keys");
    await keys.focus();
    await page.keyboard.press("q");
    await expect.poll(() => body.getAttribute("transform")).toMatch(/rotate\(90\)/);
    await page.keyboard.press("Control+z");
    await expect.poll(() => body.getAttribute("transform")).toBe(lying);
    await page.keyboard.press("Control+Shift+z");
    await expect.poll(() => body.getAttribute("transform")).toMatch(/rotate\(90\)/);
    await page.keyboard.press("Control+z");
    await expect.poll(() => body.getAttribute("transform")).toBe(lying);
    await expect(page.getByTestId("schematic-canvas").getAttribute("aria-label")).resolves.toBe("Drawing: 3 parts, port out to 0");
  });

  it("solves the drawing and reads Rth = R0/(1 + mu) from the ledger, 47 Ω at R0 = 4.7k, mu = 99", async () => {
    await page.getByRole("button", { name: "Solve", exact: true }).click();
    await page.waitForURL(/\/r\/1$/, { timeout: 60_000 });
    const equivalents = page.locator('section[aria-labelledby="equivalents-heading"]');
    await equivalents.locator(".katex").first().waitFor();
    const texts = await equivalents.locator('annotation[encoding="application/x-tex"]').allTextContents();
    const rth = texts.find((t) => t.startsWith("R_{\\mathrm{th}}"))!;
    const infix = texToInfix(rth.replace(/^R_\{\\mathrm\{th\}\}\s*=\s*/, ""));
    expect(parseValue(infix).equals(parseValue("R0/(1 + mu)"))).toBe(true);

    const values = page.getByRole("region", { name: "Values" });
    await values.getByLabel("R0", { exact: true }).fill("4.7k");
    await values.getByLabel("mu", { exact: true }).fill("99");
    await expect.poll(() => page.getByTestId("value-rth").textContent()).toBe("47 Ω");
    // The drawing came back from the server with the network: the layout was stored.
    await page.reload();
    await page.getByRole("tab", { name: "Drawing" }).click();
    await expect(page.getByTestId("schematic-canvas").getAttribute("aria-label")).resolves.toBe("Drawing: 3 parts, port out to 0");
    await expect(page.locator('[data-label="out"]').count()).resolves.toBe(1);
    await shot(page, "canvas-solved");
  });

  it("places a part added in the text on the canvas", async () => {
    await page.getByRole("tab", { name: "Netlist text" }).click();
    const editor = page.getByLabel("Portfold netlist");
    await editor.fill(`${await editor.inputValue()}Load resistor out 0 = RL\n`);
    await page.getByRole("tab", { name: "Drawing" }).click();
    await page.locator('[data-part="Load"]').waitFor();
    await expect(page.getByTestId("schematic-canvas").getAttribute("aria-label")).resolves.toBe("Drawing: 4 parts, port out to 0");
    // Undo of a drawing edit: remove Load by selecting it and pressing Delete, then undo.
    await shot(page, "canvas-text-added");
    expect(problems).toEqual([]);
  });

  it("shows the drawing in the read-only shared view", async () => {
    await page.goto(networkUrl.replace(/$/, "/r/1"));
    await page.getByRole("button", { name: "Share" }).click();
    await page.getByRole("button", { name: "Create share link" }).click();
    const url = await page.getByTestId("share-url").inputValue();
    const outsider = await launchBrowser();
    try {
      const view = watchPage(await outsider.context.newPage(), problems);
      await view.goto(url);
      const canvas = view.getByTestId("schematic-canvas");
      await canvas.waitFor();
      await expect(canvas.getAttribute("aria-label")).resolves.toBe("Drawing: 3 parts, port out to 0");
      expect(await view.getByRole("toolbar", { name: "Palette" }).count()).toBe(0);
      await view.locator('ol[aria-label="Ledger"] .katex').first().waitFor();
      await view.screenshot({ path: `${screenshotDir}/canvas-shared.png`, fullPage: true });
    } finally {
      await outsider.close();
    }
    expect(problems).toEqual([]);
  });
});
