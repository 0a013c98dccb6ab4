// Daily work on one network in chromium: start from one of our networks, see every problem while
// typing and the help for it, keep the text exactly as typed through saves, table edits, a failed
// solve and someone else's save, rename it, keep numbers as value sets for the reviewer, attach a
// file, and read the shared netlist back as a netlist.
import { mkdirSync } from "node:fs";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { parseNetlistText } from "../../shared/engine/circuit/netlist-text.js";
import { ApiClient } from "../support/api.js";
import { launchBrowser, screenshotDir, type TestBrowser } from "../support/browser.js";
import { startTestServer, type TestServer } from "../support/server.js";
import { watchPage } from "./page-watch.js";

// The smallest valid PNG: 1×1 pixel (PNG specification, ISO/IEC 15948 signature and chunks).
const PNG = Buffer.from("89504e470d0a1a0a0000000d49484452000000010000000108060000001f15c4890000000d49444154789c6360000002000154a24f5d0000000049454e44ae426082", "hex");

describe("edits that lose nothing", () => {
  let server: TestServer;
  let browser: TestBrowser;
  let page: Page;
  let api: ApiClient;
  let teamId = "";
  let networkUrl = "";
  let networkId = "";
  const pageErrors: string[] = [];
  const editor = () => page.getByLabel("Portfold netlist", { exact: true });

  beforeAll(async () => {
    mkdirSync(screenshotDir, { recursive: true });
    // Four elements at most: a fifth passes every check in the browser and is refused by the solver's cap.
    server = await startTestServer({ solve: { maxElements: 4 } });
    api = new ApiClient(server.url);
    const who = { name: "Edda Edits", email: `edda-${Date.now().toString(36)}@example.com`, password: "nothing is lost" };
    expect((await api.post("/api/auth/signup", who)).status).toBe(201);
    teamId = (await api.get("/api/me")).body.teams[0].id;
    browser = await launchBrowser();
    const [name, value] = api.cookie!.split("=");
    await browser.context.addCookies([{ name, value, url: server.url }]);
    await browser.context.grantPermissions(["clipboard-read", "clipboard-write"], { origin: server.url });
    page = await browser.context.newPage();
    watchPage(page, pageErrors);
    page.setDefaultTimeout(60_000);
  });
  afterAll(async () => {
    await browser?.close();
    await server?.close();
  });

  it("offers four starting networks of our own besides the blank one, each valid as it stands", async () => {
    await page.goto(`${server.url}/teams/${teamId}`);
    await page.getByRole("button", { name: "New network" }).click();
    const options = page.getByRole("radio");
    await expect(options.count()).resolves.toBe(5);
    await page.getByRole("radio", { name: /RC input filter/ }).check();
    await expect(page.getByLabel("Title", { exact: true }).inputValue()).resolves.toBe("RC input filter");
    await expect(page.getByRole("list", { name: "Netlist diagnostics" }).count()).resolves.toBe(0);
    await page.screenshot({ path: `${screenshotDir}/new-network-dialog.png` });
    await page.getByRole("button", { name: "Create network" }).click();
    await page.waitForURL(/\/networks\/[0-9a-f-]{36}$/);
    networkUrl = page.url();
    networkId = networkUrl.split("/").pop()!;
    await expect(editor().inputValue()).resolves.toContain("# RC input filter in front of an ADC");
  });

  it("shows each problem live, on its line, with the element marked in the preview, and drops it once fixed", async () => {
    const typed = await editor().inputValue();
    await editor().fill(`${typed}Rbig resistor adc 0 = 2.2Meg\n`);
    const list = page.getByRole("list", { name: "Netlist diagnostics" });
    await list.locator('[data-diagnostic-line="7"]').waitFor();
    await editor().fill(`${typed}Rbig resistor adc 0 = 2.2M\n`);
    await list.waitFor({ state: "detached" });
    // A floating pair of nodes is a topology error: only the engine's full check finds it, live.
    await editor().fill(`${typed}Rstray resistor p q = Rx\n`);
    await page.locator('[data-diagnostic-line="7"]').waitFor();
    await page.locator('svg[aria-label^="Schematic preview"] [data-fault="Rstray"]').waitFor();
    await page.screenshot({ path: `${screenshotDir}/live-diagnostics.png` });
    // The help for the problem is one click away.
    await page.getByRole("button", { name: "syntax help" }).first().click();
    const reference = page.getByRole("dialog", { name: "Portfold netlist reference" });
    await reference.waitFor();
    for (const word of ["resistor", "conductance", "capacitor", "inductor", "voltage", "current", "opamp", "cell", "quantity", "assume"]) {
      await expect(reference.getByRole("heading", { name: new RegExp(`^${word}\\b`) }).count()).resolves.toBe(1);
    }
    await expect(reference.textContent()).resolves.toContain("M is mega (10⁶) and m is milli (10⁻³)");
    await reference.getByRole("button", { name: "Close" }).click();
    await editor().fill(typed);
    await page.locator('[data-diagnostic-line="7"]').waitFor({ state: "detached" });
    await expect(page.locator("[data-fault]").count()).resolves.toBe(0);
  });

  it("saves the text exactly as typed and says so; a table edit changes only its element's line", async () => {
    const typed = `${await editor().inputValue()}\n# the load the converter adds\nRload resistor adc 0 = RL   # sampling switch, averaged\n`;
    await editor().fill(typed);
    await expect(page.locator("#solve-note").textContent()).resolves.toContain("Unsaved changes");
    await page.getByRole("button", { name: "Save", exact: true }).click();
    await page.getByRole("button", { name: "Saved", exact: true }).waitFor();
    await expect(page.locator("#solve-note").textContent()).resolves.not.toContain("Unsaved");
    await page.reload();
    await expect(editor().inputValue()).resolves.toBe(typed);

    await page.getByRole("tab", { name: "Element table" }).click();
    await page.getByLabel("Value of Rfilt").fill("R_f");
    await page.getByRole("tab", { name: "Netlist text" }).click();
    const after = await editor().inputValue();
    expect(after.split("\n").filter((line, i) => line !== typed.split("\n")[i])).toEqual(["Rfilt resistor in adc = R_f"]);
  });

  it("solves, names the impedance Zth(s), and keeps the result, marked older, when a later solve fails", async () => {
    await page.getByRole("button", { name: "Solve", exact: true }).click();
    await page.waitForURL(/\/r\/1$/);
    const card = page.locator("[data-result-card]");
    await card.locator(".katex").first().waitFor();
    await expect(card.textContent()).resolves.toContain("Zth(s)");
    await expect(card.textContent()).resolves.not.toContain("Rth ·");
    // A fifth element: the browser finds nothing wrong, the solver's cap refuses it.
    await editor().fill(`${await editor().inputValue()}Rleak resistor in 0 = R_leak\n`);
    await page.getByRole("button", { name: "Solve", exact: true }).click();
    await card.getByText("The last Solve failed").waitFor();
    await expect(card.locator(".katex").count()).resolves.toBeGreaterThan(0);
    expect(page.url()).toMatch(/\/r\/1$/);
    await page.screenshot({ path: `${screenshotDir}/solve-failed-older-result.png` });
  });

  it("on someone else's save, shows what differs and takes theirs without losing mine", async () => {
    const current = (await api.get(`/api/networks/${networkId}`)).body;
    const theirs = current.netlist.replace("Rload resistor adc 0 = RL", "Rload resistor adc 0 = R_L2");
    expect((await api.patch(`/api/networks/${networkId}`, { netlist: theirs })).status).toBe(200);
    const mine = `${await editor().inputValue()}# my note\n`;
    await editor().fill(mine);
    await page.getByRole("button", { name: "Save", exact: true }).click();
    const conflict = page.getByRole("alert", { name: "Saved by someone else" });
    await conflict.waitFor();
    await expect(conflict.getByTestId("only-theirs").textContent()).resolves.toContain("R_L2");
    await conflict.getByRole("button", { name: "Copy mine" }).click();
    await expect(page.evaluate(() => navigator.clipboard.readText())).resolves.toBe(mine);
    await page.screenshot({ path: `${screenshotDir}/save-conflict.png` });
    await conflict.getByRole("button", { name: "Take theirs" }).click();
    await expect(editor().inputValue()).resolves.toBe(theirs);
  });

  it("renames the network and edits its description in place", async () => {
    await page.getByRole("button", { name: "Edit title and description" }).click();
    const form = page.getByRole("form", { name: "Title and description" });
    await form.getByLabel("Title", { exact: true }).fill("ADC input filter, 16-bit channel");
    await form.getByLabel("Description", { exact: true }).fill("Anti-alias RC in front of the converter pin.");
    await page.getByRole("button", { name: "Save title and description" }).click();
    await expect(page.getByRole("heading", { level: 1 }).textContent()).resolves.toBe("ADC input filter, 16-bit channel");
    expect((await api.get(`/api/networks/${networkId}`)).body.description).toBe("Anti-alias RC in front of the converter pin.");
  });

  it("keeps numbers as a named value set that the shared page shows; exports them", async () => {
    await page.goto(`${networkUrl}/r/1`);
    const values = page.getByRole("region", { name: "Values" });
    await values.getByLabel("R_f", { exact: true }).fill("10k");
    await values.getByLabel("C", { exact: true }).fill("1n");
    await values.getByLabel("Save these values as").fill("nominal");
    await values.getByRole("button", { name: "Save set" }).click();
    await values.getByRole("option", { name: /nominal/ }).waitFor({ state: "attached" });
    await page.reload();
    await values.getByLabel("Value set", { exact: true }).selectOption({ label: "nominal (2 values)" });
    await expect(values.getByLabel("R_f", { exact: true }).inputValue()).resolves.toBe("10k");
    await page.getByRole("button", { name: "Export" }).click();
    await page.getByRole("menuitem", { name: "Value sets as CSV (.csv)" }).waitFor();
    await page.keyboard.press("Escape");

    const share = await api.post(`/api/networks/${networkId}/revisions/1/share`, {});
    const shared = await browser.context.newPage();
    watchPage(shared, pageErrors);
    shared.setDefaultTimeout(60_000);
    await browser.context.clearCookies();
    await shared.goto(`${server.url}${new URL(share.body.url).pathname}`);
    await shared.getByRole("region", { name: "Values" }).getByLabel("Value set", { exact: true }).selectOption({ label: "nominal (2 values)" });
    // The netlist the shared page shows reads back as a netlist, as it stands.
    const text = await shared.getByLabel("Netlist").textContent();
    const read = parseNetlistText(text ?? "");
    expect(read.diagnostics.filter((d) => d.severity === "error")).toEqual([]);
    expect(read.network!.elements.map((e) => e.name)).toEqual(["Source", "Rfilt", "Cfilt", "Rload"]);
    await shared.close();
    const [name, value] = api.cookie!.split("=");
    await browser.context.addCookies([{ name, value, url: server.url }]);
  });

  it("attaches a PNG, lists it with the server's limits, and deletes it", async () => {
    await page.goto(networkUrl);
    const section = page.getByRole("region", { name: "Attachments" });
    await section.getByText("PDF, PNG, JPEG, up to 5.0 MB").waitFor();
    await section.getByLabel("Attach a file").setInputFiles({ name: "scope-capture.png", mimeType: "image/png", buffer: PNG });
    await section.getByRole("link", { name: "scope-capture.png" }).waitFor();
    await section.getByRole("button", { name: "Delete scope-capture.png" }).click();
    await section.getByText("No files attached.").waitFor();
  });

  it("shows each problem the server finds in an imported file, by line", async () => {
    await page.goto(`${server.url}/teams/${teamId}`);
    await page.getByRole("button", { name: "Import from file" }).click();
    const bad = "ground 0\nport out 0\nRsens resistr in out = Rs\nCload capacitor out = C\n";
    await page.getByLabel("File", { exact: true }).setInputFiles({ name: "broken.pfn", mimeType: "text/plain", buffer: Buffer.from(bad) });
    await page.getByRole("button", { name: "Import", exact: true }).click();
    const problems = page.getByRole("list", { name: "Problems in the file" });
    await problems.waitFor();
    const lines = await problems.getByRole("listitem").allTextContents();
    expect(lines.some((l) => l.startsWith("line 3"))).toBe(true);
    expect(lines.some((l) => l.startsWith("line 4"))).toBe(true);
  });

  it("empties the New team field after a team is made from a team's page (the page stays, the team changes)", async () => {
    await page.goto(`${server.url}/teams/${teamId}`);
    await page.getByLabel("New team").fill("Converter reviews");
    await page.getByRole("button", { name: "Create team" }).click();
    await page.waitForURL((url) => /\/teams\/[0-9a-f-]{36}$/.test(url.pathname) && !url.pathname.endsWith(teamId));
    await page.getByRole("heading", { level: 1, name: "Converter reviews" }).waitFor();
    await expect(page.getByLabel("New team").inputValue()).resolves.toBe("");
  });

  it("raised no uncaught error and no console error in the page on the way", () => {
    expect(pageErrors).toEqual([]);
  });
});
