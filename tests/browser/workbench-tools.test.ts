// The workbench's other tools in chromium: import from a file, inline diagnostics, the element
// table kept in step with the text, the port picker, revision history and compare, export,
// the print view, the team table's search/sort/paging, and a password reset by mail.
import { mkdirSync, readFileSync } from "node:fs";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { parseNetlistText } from "../../shared/engine/circuit/netlist-text.js";
import { ApiClient } from "../support/api.js";
import { launchBrowser, screenshotDir, type TestBrowser } from "../support/browser.js";
import { linkIn, waitForMail } from "../support/mail.js";
import { startTestServer, type TestServer } from "../support/server.js";
import { watchPage } from "./page-watch.js";
import { importNetlist, shot, signInThroughForm } from "./page-steps.js";

// A strain-gauge bridge read differentially between its two mid-points.
// Common practice (Wheatstone bridge): Vth = Vs*(Rb/(Ra+Rb) - Rd/(Rc+Rd)), zero when balanced,
// and Rth = Ra||Rb + Rc||Rd with the excitation shorted, so four equal arms of 1 kΩ give 1 kΩ.
const BRIDGE = `# strain-gauge bridge, read across its mid-points
ground 0
port a b
Excite voltage top 0 = Vs
ArmA resistor top a = Ra
ArmB resistor a 0 = Rb
ArmC resistor top b = Rc
Gauge resistor b 0 = Rd
`;

const run = Date.now().toString(36);
const user = { name: "Tess Tools", email: `tess-${run}@example.com`, password: "first password 1" };

async function downloaded(page: Page, menuItem: string): Promise<{ name: string; text: string }> {
  await page.getByRole("button", { name: "Export" }).click();
  const [download] = await Promise.all([page.waitForEvent("download"), page.getByRole("menuitem", { name: menuItem }).click()]);
  return { name: download.suggestedFilename(), text: readFileSync((await download.path())!, "utf8") };
}

describe("workbench tools in chromium", () => {
  let server: TestServer;
  let browser: TestBrowser;
  let page: Page;
  let api: ApiClient;
  let teamId = "";
  let networkUrl = "";
  const pageErrors: string[] = [];

  beforeAll(async () => {
    mkdirSync(screenshotDir, { recursive: true });
    // Every solve here is answered with a job (wait 0), so the workbench's polling is what brings the revision.
    server = await startTestServer({ solve: { waitMs: 0 } });
    api = new ApiClient(server.url);
    expect((await api.post("/api/auth/signup", user)).status).toBe(201);
    teamId = (await api.get("/api/me")).body.teams[0].id;
    browser = await launchBrowser();
    page = await browser.context.newPage();
    watchPage(page, pageErrors);
  });
  afterAll(async () => {
    await browser?.close();
    await server?.close();
  });

  it("signs in and imports a netlist file", async () => {
    await signInThroughForm(page, server.url, user);
    await importNetlist(page, { name: "strain-bridge.pfn", text: BRIDGE, title: "Strain bridge" });
    networkUrl = page.url();
    await expect(page.getByRole("heading", { level: 1 }).textContent()).resolves.toBe("Strain bridge");
  });

  it("shows a diagnostic on the line it names, and the schematic keeps the last good network", async () => {
    const editor = page.getByLabel("Portfold netlist");
    const text = await editor.inputValue();
    await editor.fill(text.replace("Gauge resistor b 0 = Rd", "Gauge resistr b 0 = Rd"));
    const diagnostics = page.getByRole("list", { name: "Netlist diagnostics" });
    await diagnostics.waitFor();
    // The imported file is kept exactly as typed: its comment is line 1, so "Gauge ..." is line 8.
    expect(text).toBe(BRIDGE);
    expect(text.split("\n")[7]).toBe("Gauge resistor b 0 = Rd");
    await expect(diagnostics.textContent()).resolves.toMatch(/^Line 8, column 7: /);
    expect(await page.getByText("(last version that read without errors)").isVisible()).toBe(true);
    expect(await page.getByRole("button", { name: "Solve", exact: true }).isDisabled()).toBe(true);
    await shot(page, "workbench-diagnostic");
    await editor.fill(text);
    await diagnostics.waitFor({ state: "detached" });
  });

  it("keeps the element table and the port picker in step with the text", async () => {
    await page.getByRole("tab", { name: "Element table" }).click();
    await page.getByLabel("Value of Gauge").fill("2*Rd");
    await page.getByRole("button", { name: "Add element" }).click();
    await page.getByLabel("Name of element 6").fill("Load");
    await page.getByLabel("First node of Load").fill("b");
    await page.getByLabel("Second node of Load").fill("0");
    await page.getByLabel("Value of Load").fill("RL");
    await shot(page, "workbench-element-table");
    await page.getByRole("tab", { name: "Netlist text" }).click();
    const text = await page.getByLabel("Portfold netlist").inputValue();
    expect(text).toContain("Gauge resistor b 0 = 2*Rd");
    expect(text).toContain("Load resistor b 0 = RL");
    // Back to the bridge alone, then move the port's minus terminal to ground and back.
    await page.getByLabel("Portfold netlist").fill(BRIDGE);
    await page.getByLabel("− terminal (node)").selectOption("0");
    await expect(page.getByLabel("Portfold netlist").inputValue()).resolves.toContain("port a 0\n");
    await page.getByLabel("− terminal (node)").selectOption("b");
    await expect(page.getByLabel("Portfold netlist").inputValue()).resolves.toContain("port a b\n");
  });

  it("solves the bridge and reads the balanced-bridge values", async () => {
    await page.getByRole("button", { name: "Solve", exact: true }).click();
    await page.waitForURL(/\/r\/1$/, { timeout: 30_000 });
    const values = page.getByRole("region", { name: "Values" });
    for (const arm of ["Ra", "Rb", "Rc", "Rd"]) await values.getByLabel(arm, { exact: true }).fill("1k");
    await values.getByLabel("Vs", { exact: true }).fill("5");
    await expect.poll(() => page.getByTestId("value-vth").textContent()).toBe("0 V");
    await expect.poll(() => page.getByTestId("value-rth").textContent()).toBe("1 kΩ");
    await shot(page, "workbench-bridge");
  });

  it("solves a changed bridge and compares the two revisions", async () => {
    const editor = page.getByLabel("Portfold netlist");
    await editor.fill(BRIDGE.replace("Gauge resistor b 0 = Rd", "Gauge resistor b 0 = Rd + dR"));
    await page.getByRole("button", { name: "Solve", exact: true }).click();
    await page.waitForURL(/\/r\/2$/, { timeout: 30_000 });
    await page.getByRole("link", { name: "History" }).click();
    await page.getByLabel("Compare revision 1").check();
    await page.getByLabel("Compare revision 2").check();
    await page.getByRole("button", { name: "Compare the two" }).click();
    const comparison = page.getByRole("region", { name: "Revision 1 compared with 2" });
    await comparison.waitFor();
    await expect(comparison.textContent()).resolves.toContain("1 element differs");
    await expect(comparison.textContent()).resolves.toContain("Vth, Rth, Isc changed");
    await expect(comparison.getByRole("table").textContent()).resolves.toContain("Gauge resistor b 0 = Rd + dR");
    await shot(page, "revision-compare");
  });

  it("exports the ledger as LaTeX and the network as JSON and text", async () => {
    await page.goto(`${networkUrl}/r/1`);
    await page.locator('ol[aria-label="Ledger"] .katex').first().waitFor();
    const latex = await downloaded(page, "Ledger as LaTeX (.tex)");
    expect(latex.name).toBe("strain-bridge-r1.tex");
    expect(latex.text).toContain("\\begin{document}");
    expect(latex.text).toContain("\\end{document}");
    expect((latex.text.match(/\\subsection\*/g) ?? []).length).toBeGreaterThan(4);

    const json = await downloaded(page, "Network as JSON (.json)");
    const circuit = JSON.parse(json.text);
    expect(circuit.port).toEqual({ plus: "a", minus: "b" });
    expect(circuit.elements).toHaveLength(5);

    const text = await downloaded(page, "Network as Portfold netlist (.pfn)");
    const reread = parseNetlistText(text.text);
    expect(reread.diagnostics.filter((d) => d.severity === "error")).toEqual([]);
    expect(reread.network?.elements).toEqual(circuit.elements);
  });

  it("prints a clean review document", async () => {
    await page.emulateMedia({ media: "print" });
    expect(await page.getByRole("region", { name: "Values" }).isVisible()).toBe(false);
    expect(await page.getByRole("button", { name: "Solve", exact: true }).isVisible()).toBe(false);
    expect(await page.locator('ol[aria-label="Ledger"]').isVisible()).toBe(true);
    await shot(page, "print-view");
    await page.emulateMedia({ media: "screen" });
  });

  it("searches, sorts and pages the team's networks on the server", async () => {
    for (let i = 1; i <= 21; i += 1) {
      const created = await api.post(`/api/teams/${teamId}/networks`, {
        title: `Line driver ${String(i).padStart(2, "0")}`,
        circuit: { ground: "0", port: { plus: "o", minus: "0" }, elements: [{ name: "Rs", kind: "resistor", nodes: ["o", "0"], value: "R" }] },
      });
      expect(created.status).toBe(201);
    }
    await page.goto(`${server.url}/teams/${teamId}`);
    await page.getByText("1–20 of 22").waitFor();
    await page.getByRole("button", { name: "Next" }).click();
    await page.getByText("21–22 of 22").waitFor();
    await page.getByLabel("Search networks").fill("bridge");
    await page.getByText("1–1 of 1").waitFor();
    await page.getByLabel("Search networks").fill("driver");
    await page.getByText("1–20 of 21").waitFor();
    await page.getByRole("button", { name: "Title" }).click();
    await expect.poll(() => page.locator("tbody tr").first().textContent()).toContain("Line driver 01");
    await page.getByRole("button", { name: "Title" }).click();
    await expect.poll(() => page.locator("tbody tr").first().textContent()).toContain("Line driver 21");
    await shot(page, "team-home-search");
  });

  it("resets the password by the mailed link", async () => {
    await page.getByRole("button", { name: "Sign out" }).click();
    await page.goto(`${server.url}/reset-password`);
    await page.getByLabel("E-mail").fill(user.email);
    await page.getByRole("button", { name: "Send the link" }).click();
    await page.getByText(/a link to set a new password is on its way/).waitFor();
    const mail = await waitForMail(server.db, user.email, { subject: /password/i });
    await page.goto(linkIn(mail, "/reset-password").toString());
    await page.getByLabel("New password", { exact: true }).fill("second password 2");
    await page.getByLabel("New password again").fill("second password 2");
    await page.getByRole("button", { name: "Set the password" }).click();
    await page.getByText("Your password is set and you are signed in.").waitFor();
    await page.getByRole("button", { name: "Sign out" }).waitFor();
    await shot(page, "reset-password");
    const fresh = new ApiClient(server.url);
    expect((await fresh.post("/api/auth/login", { email: user.email, password: "second password 2" })).status).toBe(200);
    expect((await fresh.post("/api/auth/login", { email: user.email, password: user.password })).status).toBe(401);
  });

  it("raised no uncaught error and no console error in the page on the way", () => {
    expect(pageErrors).toEqual([]);
  });
});
