// Team cells in chromium: an editor saves a cell on the team home, the server's refusals stay beside
// the form with what was typed, and a network placing the cell solves to the cell's own Thevenin
// resistance.
import { mkdirSync } from "node:fs";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { parseValue } from "../../shared/engine/algebra/index.js";
import { launchBrowser, screenshotDir, type TestBrowser } from "../support/browser.js";
import { startTestServer, type TestServer } from "../support/server.js";
import { watchPage } from "./page-watch.js";
import { shot, signUpThroughForm } from "./page-steps.js";

// The cell: a bias divider, upper leg from terminal t to m, lower leg from m to the ground (node 0 inside a cell).
const DIVIDER_LINES = `# bias divider for a sensor input
upper resistor t m = Ra
lower resistor m 0 = Rb`;

// Driven from an ideal reference and looked into at the tap. Common practice (voltage divider seen from
// its tap, the source set to zero): Rth = Ra*Rb/(Ra + Rb), the two legs in parallel; Vth = Vs*Rb/(Ra + Rb).
const BIASED_INPUT = `# sensor input biased from the reference through the team's divider
ground 0
port out 0
Reference voltage ref 0 = Vs
Bias cell div2 t=ref m=out
`;

const run = Date.now().toString(36);
const editor = { name: "Cela Cellwright", email: `cela-${run}@example.com`, password: "copper verdigris ledger" };

describe("team cells in chromium", () => {
  let server: TestServer;
  let browser: TestBrowser;
  let page: Page;
  let teamUrl = "";
  const pageErrors: string[] = [];

  beforeAll(async () => {
    mkdirSync(screenshotDir, { recursive: true });
    server = await startTestServer();
    browser = await launchBrowser();
    page = await browser.context.newPage();
    watchPage(page, pageErrors);
  });
  afterAll(async () => {
    await browser?.close();
    await server?.close();
  });

  const cells = () => page.getByRole("region", { name: "Cells" });
  const form = () => page.getByRole("form", { name: "Add a cell" });
  const check = () => page.getByRole("complementary", { name: "Cell check" });

  it("signs up and finds no team cells yet", async () => {
    await page.goto(`${server.url}/sign-up`);
    await signUpThroughForm(page, editor);
    await page.waitForURL(/\/teams\/[0-9a-f-]{36}$/);
    teamUrl = page.url();
    await cells().getByText("No cells in this team yet.").waitFor();
    await shot(page, "team-cells-empty");
  });

  it("shows the server's diagnostics beside the form and keeps what was typed", async () => {
    await form().getByLabel("Cell id").fill("div2");
    await form().getByLabel("Cell name").fill("Bias divider");
    // A terminal that no element touches, and a value that ends in an operator: both refused by the engine.
    await form().getByLabel("Terminals").fill("t, m, q");
    await form().getByLabel("Elements (netlist lines)").fill(DIVIDER_LINES.replace("= Rb", "= Rb *"));
    await form().getByRole("button", { name: "Add cell" }).click();

    const alert = check().getByRole("alert");
    await alert.getByText("The server refused this cell").waitFor();
    const diagnostics = alert.getByRole("list", { name: "Diagnostics" }).getByRole("listitem");
    await expect.poll(() => diagnostics.allTextContents()).toEqual(
      expect.arrayContaining([expect.stringContaining('terminal "q"'), expect.stringMatching(/^line 3.*"lower".*"Rb \*"/)]),
    );
    await expect(form().getByLabel("Cell id").inputValue()).resolves.toBe("div2");
    await expect(form().getByLabel("Terminals").inputValue()).resolves.toBe("t, m, q");
    await expect(form().getByLabel("Elements (netlist lines)").inputValue()).resolves.toContain("= Rb *");
    await shot(page, "team-cells-refused");
  });

  it("adds the divider and lists it with its terminals, symbols and author", async () => {
    await form().getByLabel("Terminals").fill("t, m");
    await form().getByLabel("Elements (netlist lines)").fill(DIVIDER_LINES);
    await form().getByRole("button", { name: "Add cell" }).click();
    await form().getByRole("status").getByText("Cell div2 added.").waitFor();

    const row = cells().locator('tr[data-cell="div2"]');
    await expect.poll(() => row.locator("td").allTextContents()).toEqual(["div2", "Bias divider", "t, m", "Ra, Rb", editor.name, "Delete"]);
    await expect(check().getByRole("alert").count()).resolves.toBe(0);
    // Saved, so the form starts again empty.
    await expect(form().getByLabel("Cell id").inputValue()).resolves.toBe("");
  });

  it("refuses a built-in cell's id at the id field", async () => {
    await form().getByLabel("Cell id").fill("amplifier");
    await form().getByLabel("Cell name").fill("Not the built-in one");
    await form().getByLabel("Terminals").fill("t, m");
    await form().getByLabel("Elements (netlist lines)").fill(DIVIDER_LINES);
    await form().getByRole("button", { name: "Add cell" }).click();
    await check().getByText("That id is taken").waitFor();
    await form().getByText('"amplifier" is a built-in cell').waitFor();
    await expect(form().getByLabel("Cell id").getAttribute("aria-invalid")).resolves.toBe("true");
    await shot(page, "team-cells");
  });

  it("solves a network placing the cell: Rth is the two legs in parallel", async () => {
    await page.getByRole("button", { name: "New network" }).click();
    await page.getByLabel("Title").fill("Biased sensor input");
    await page.getByLabel("Network (Portfold netlist or our JSON)").fill(BIASED_INPUT);
    await page.getByRole("button", { name: "Create network" }).click();
    await page.waitForURL(/\/networks\/[0-9a-f-]{36}$/);
    const networkId = new URL(page.url()).pathname.split("/").pop()!;
    await page.getByRole("button", { name: "Solve", exact: true }).click();
    await page.waitForURL(/\/r\/1$/, { timeout: 30_000 });

    // The exact result, as stored: Ra*Rb/(Ra + Rb), and Vs*Rb/(Ra + Rb).
    const revision = await page.request.get(`${server.url}/api/networks/${networkId}/revisions/1`);
    expect(revision.status()).toBe(200);
    const { results } = (await revision.json()) as { results: { rth: { infix: string }; vth: { infix: string } } };
    expect(parseValue(results.rth.infix).equals(parseValue("Ra*Rb/(Ra + Rb)"))).toBe(true);
    expect(parseValue(results.vth.infix).equals(parseValue("Vs*Rb/(Ra + Rb)"))).toBe(true);

    const values = page.getByRole("region", { name: "Values" });
    await values.getByLabel("Ra", { exact: true }).fill("1k");
    await values.getByLabel("Rb", { exact: true }).fill("1k");
    await expect.poll(() => page.getByTestId("value-rth").textContent()).toBe("500 Ω"); // 1k ∥ 1k
    // Unequal legs tell the parallel combination from half of one leg.
    await values.getByLabel("Ra", { exact: true }).fill("3k");
    await values.getByLabel("Rb", { exact: true }).fill("6k");
    await expect.poll(() => page.getByTestId("value-rth").textContent()).toBe("2 kΩ"); // 3k*6k/9k
    await values.getByLabel("Vs", { exact: true }).fill("9");
    await expect.poll(() => page.getByTestId("value-vth").textContent()).toBe("6 V"); // 9*6k/9k
  });

  it("deletes the cell after confirming", async () => {
    await page.goto(teamUrl);
    const row = cells().locator('tr[data-cell="div2"]');
    await row.getByRole("button", { name: "Delete cell div2" }).click();
    // The confirmation takes the focus, so Enter deletes from the keyboard.
    const confirm = row.getByRole("group", { name: "Delete cell div2?" });
    await confirm.getByRole("button", { name: "Keep" }).click();
    await expect(row.getByRole("group").count()).resolves.toBe(0);
    await row.getByRole("button", { name: "Delete cell div2" }).click();
    await expect.poll(() => page.evaluate(() => document.activeElement?.textContent)).toBe("Delete");
    await page.keyboard.press("Enter");
    await cells().getByText("No cells in this team yet.").waitFor();
    expect(pageErrors).toEqual([]);
  });
});
