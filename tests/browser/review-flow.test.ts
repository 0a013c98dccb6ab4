// The main path through Portfold in chromium: sign up, enter a network as text, solve, read the
// typeset ledger, plug in numbers, take a gain to infinity, sweep, share, review, and the mail.
import { mkdirSync, readFileSync } from "node:fs";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { parseValue } from "../../shared/engine/algebra/index.js";
import { launchBrowser, screenshotDir, type TestBrowser } from "../support/browser.js";
import { linkIn, waitForMail } from "../support/mail.js";
import { startTestServer, type TestServer } from "../support/server.js";
import { watchPage } from "./page-watch.js";
import { shot, signUpThroughForm } from "./page-steps.js";

// A sensor buffer: a finite-gain amplifier (gain mu, output resistance R0) wired as a voltage follower.
// Textbook fact (finite-gain voltage follower; e.g. Sedra & Smith, Microelectronic Circuits, from memory):
// Vth = mu*Vs/(1 + mu), Rth = R0/(1 + mu), so Rth -> R0/mu to leading order as mu -> infinity.
const NETLIST = `# sensor buffer behind a strain bridge
ground 0
port out 0
Sensor voltage in 0 = Vs
Amp voltage x 0 = mu * across(in, out)
OutputRes resistor x out = R0
`;

const run = Date.now().toString(36);
const author = { name: "Ada Author", email: `ada-${run}@example.com`, password: "correct horse battery" };
const reviewer = { name: "Rui Reviewer", email: `rui-${run}@example.com`, password: "staple gun tangerine" };

describe("review flow in chromium", () => {
  let server: TestServer;
  let authorBrowser: TestBrowser;
  let reviewerBrowser: TestBrowser;
  let page: Page;
  let shareUrl = "";
  let teamUrl = "";
  const pageErrors: string[] = [];

  beforeAll(async () => {
    mkdirSync(screenshotDir, { recursive: true });
    server = await startTestServer();
    authorBrowser = await launchBrowser();
    reviewerBrowser = await launchBrowser();
    page = await authorBrowser.context.newPage();
    watchPage(page, pageErrors);
  });
  afterAll(async () => {
    await reviewerBrowser?.close();
    await authorBrowser?.close();
    await server?.close();
  });

  it("signs up, confirms the address and lands on the personal team", async () => {
    await page.goto(`${server.url}/sign-up`);
    await shot(page, "sign-up");
    await signUpThroughForm(page, author);
    await page.waitForURL(/\/teams\/[0-9a-f-]{36}$/);
    teamUrl = page.url();
    await expect(page.getByRole("heading", { level: 1 }).textContent()).resolves.toBe(`${author.name}'s networks`);
    await page.getByText("No networks in this team yet.").waitFor();
    await shot(page, "team-home-empty");

    const mail = await waitForMail(server.db, author.email, { subject: /confirm/i });
    await page.goto(linkIn(mail, "/verify-email").toString());
    await page.getByText("Your address is confirmed.").waitFor();
  });

  it("creates a network from text and solves it into a typeset ledger", async () => {
    await page.goto(teamUrl);
    await page.getByRole("button", { name: "New network" }).click();
    await page.getByLabel("Title").fill("Strain-gauge buffer");
    await page.getByLabel("Network (Portfold netlist or our JSON)").fill(NETLIST);
    await shot(page, "create-network");
    await page.getByRole("button", { name: "Create network" }).click();
    await page.waitForURL(/\/networks\/[0-9a-f-]{36}$/);
    await page.getByText("No derivation yet.").waitFor();
    // The schematic preview draws the three elements and the port.
    await expect(page.locator('svg[role="img"][aria-label^="Schematic preview"]').getAttribute("aria-label")).resolves.toContain("3 elements, port out to 0");

    await page.getByRole("button", { name: "Solve", exact: true }).click();
    // A solve runs the exact engine on the server: allow for a busy machine.
    await page.waitForURL(/\/r\/1$/, { timeout: 30_000 });
    const steps = page.locator('ol[aria-label="Ledger"] > li');
    await steps.first().waitFor();
    expect(await steps.count()).toBeGreaterThan(3);
    // Typeset by KaTeX, and nothing it could not read.
    await page.locator('ol[aria-label="Ledger"] .katex').first().waitFor();
    expect(await page.locator('ol[aria-label="Ledger"] .katex').count()).toBeGreaterThan(3);
    expect(await page.locator(".katex-error").count()).toBe(0);
    await expect(page.getByRole("list", { name: "Check badge" }).textContent()).resolves.toContain("Voc/Isc");
    await shot(page, "workbench-solved");
  });

  it("plugs in numbers with SI prefixes and reads them in engineering notation", async () => {
    const values = page.getByRole("region", { name: "Values" });
    await values.getByLabel("R0", { exact: true }).fill("4.7k");
    await values.getByLabel("mu", { exact: true }).fill("99");
    // Partly substituted: Vs is still a symbol, so Vth stays an expression and Rth is a number.
    await expect.poll(() => page.getByTestId("value-rth").textContent()).toBe("47 Ω"); // 4700/(1 + 99)
    await values.getByLabel("Vs", { exact: true }).fill("10m");
    await expect.poll(() => page.getByTestId("value-vth").textContent()).toBe("9.9 mV"); // 99*0.01/100
  });

  it("takes mu to infinity: Rth goes to 0 and to leading order R0/mu", async () => {
    const limits = page.getByRole("region", { name: "Limits" });
    await limits.getByLabel("Symbol").selectOption("mu");
    await limits.getByLabel("→ ∞").check();
    const leading = await limits.locator('[data-limit="rth"] [data-leading-infix]').textContent();
    expect(parseValue(leading ?? "").equals(parseValue("R0/mu"))).toBe(true);
    const vthLeading = await limits.locator('[data-limit="vth"] [data-leading-infix]').textContent();
    expect(parseValue(vthLeading ?? "").equals(parseValue("Vs"))).toBe(true);
  });

  it("sweeps Rth against mu over decades, with a readout and a CSV", async () => {
    const sweep = page.getByRole("region", { name: "Sweep" });
    await sweep.getByLabel("Plot", { exact: true }).selectOption("rth");
    await sweep.getByLabel("Against", { exact: true }).selectOption("mu");
    await sweep.getByLabel("From", { exact: true }).fill("1");
    await sweep.getByLabel("To", { exact: true }).fill("1M");
    const plotArea = sweep.locator('[data-testid="sweep-plot"] .u-over');
    await plotArea.waitFor();
    await plotArea.scrollIntoViewIfNeeded();
    const box = (await plotArea.boundingBox())!;
    await page.mouse.move(box.x + box.width * 0.2, box.y + box.height / 2);
    await page.mouse.move(box.x + box.width * 0.3, box.y + box.height / 2, { steps: 5 });
    await expect.poll(() => sweep.locator("figcaption").textContent()).toMatch(/mu = [\d.]+ ?k?, Rth = [\d.]+ [kmµ]?Ω/);
    // From the keyboard: the last point is mu = 10^6, where Rth = 4700/(1 + 10^6) = 4.7 mΩ to four digits.
    await sweep.getByLabel("Read at a point (arrow keys)").focus();
    await page.keyboard.press("End");
    await expect.poll(() => sweep.locator("figcaption").textContent()).toContain("mu = 1 M, Rth = 4.7 mΩ");
    await shot(page, "workbench-values-limits-sweep");

    const [download] = await Promise.all([page.waitForEvent("download"), sweep.getByRole("button", { name: "Download CSV" }).click()]);
    const csv = readFileSync((await download.path())!, "utf8").trim().split("\n");
    expect(csv[0]).toBe("mu,Rth (Ω)");
    const [mu0, rth0] = csv[1].split(",").map(Number);
    expect(mu0).toBe(1);
    expect(rth0).toBeCloseTo(4700 / (1 + 1), 9);
    expect(csv.length).toBe(1 + 6 * 40 + 1);
  });

  it("creates a share link and invites a reviewer", async () => {
    await page.getByRole("button", { name: "Share" }).click();
    await page.getByRole("button", { name: "Create share link" }).click();
    const url = page.getByTestId("share-url");
    await url.waitFor();
    shareUrl = await url.inputValue();
    expect(shareUrl).toMatch(new RegExp(`^${server.url}/s/[A-Za-z0-9_-]{43}$`));
    await page.screenshot({ path: `${screenshotDir}/share-dialog.png` });
    await page.keyboard.press("Escape");

    await page.goto(teamUrl);
    await page.getByLabel("Invite by e-mail").fill(reviewer.email);
    await page.getByLabel("Role", { exact: true }).selectOption("reviewer");
    await page.getByRole("button", { name: "Send invitation" }).click();
    await page.getByText("Invitation sent.").waitFor();
    await page.getByRole("link", { name: "Strain-gauge buffer" }).waitFor();
    await shot(page, "team-home");
  });

  it("opens the share link signed out, then the reviewer signs in and notes a step", async () => {
    const guest = await reviewerBrowser.context.newPage();
    watchPage(guest, pageErrors);
    await guest.goto(shareUrl);
    await guest.getByRole("heading", { level: 1, name: "Strain-gauge buffer" }).waitFor();
    await guest.locator('ol[aria-label="Ledger"] .katex').first().waitFor();
    // Values work without an account too: computed in the browser from the stored result.
    await guest.getByRole("region", { name: "Values" }).getByLabel("R0", { exact: true }).fill("1k");
    await guest.getByRole("region", { name: "Values" }).getByLabel("mu", { exact: true }).fill("9");
    await expect.poll(() => guest.getByTestId("value-rth").textContent()).toBe("100 Ω");
    await shot(guest, "shared-view-signed-out");

    await guest.getByRole("link", { name: "Sign in to comment" }).first().click();
    await guest.getByRole("link", { name: "Create an account" }).click();
    const signedUpAt = new Date();
    await signUpThroughForm(guest, reviewer);
    await guest.waitForURL(shareUrl);
    // An invitation is accepted only at the invited address, confirmed.
    const confirmation = await waitForMail(server.db, reviewer.email, { since: signedUpAt, subject: /confirm/i });
    await guest.goto(linkIn(confirmation, "/verify-email").toString());
    await guest.getByText("Your address is confirmed.").waitFor();

    const invitation = await waitForMail(server.db, reviewer.email, { subject: /invit/i });
    await guest.goto(linkIn(invitation, "/invitations/accept").toString());
    await guest.getByText(`invites ${reviewer.email} to join`).waitFor();
    await shot(guest, "accept-invitation");
    await guest.getByRole("button", { name: /^Join / }).click();
    await guest.waitForURL(/\/teams\//);

    await guest.goto(shareUrl);
    const firstNote = guest.getByRole("button", { name: /^Add a note on step 1,/ });
    await firstNote.click();
    const note = "Please state which node is the reference before the KCL rows.";
    await guest.getByLabel(/^Note on step 1,/).fill(note);
    await guest.getByRole("button", { name: "Add note" }).click();
    await guest.getByRole("complementary", { name: /^Review notes on step 1,/ }).locator("li p").getByText(note).waitFor();
    await shot(guest, "shared-view-with-note");
    await guest.getByRole("button", { name: "Approve", exact: true }).click();
    await guest.getByRole("dialog", { name: "Approve revision 1" }).getByRole("button", { name: "Approve with open notes" }).click();
    await expect.poll(() => guest.getByRole("status", { name: "Review state" }).textContent(), { timeout: 15_000 }).toContain("approved by Rui Reviewer");
  });

  it("sends the author a mail about the note whose link opens the revision with the note beside its step", async () => {
    const mail = await waitForMail(server.db, author.email, { subject: /note|comment/i, timeoutMs: 10_000 });
    expect(mail.text).toContain("Please state which node is the reference");
    await waitForMail(server.db, author.email, { subject: /verdict|approved/i, timeoutMs: 10_000 });
    await page.goto(`${server.url}/dev/mailbox?to=${encodeURIComponent(author.email)}`);
    await page.getByText(mail.subject).first().waitFor();
    await shot(page, "author-mailbox");

    await page.goto(linkIn(mail, "/n/").toString());
    await page.waitForURL(/\/networks\/[0-9a-f-]{36}\/r\/1$/);
    await page.getByRole("complementary", { name: /^Review notes on step 1,/ }).getByText("Please state which node is the reference").waitFor();
    await page.goto(teamUrl);
    await expect.poll(() => page.locator("tbody tr").first().textContent()).toContain("approved");
  });

  it("raised no uncaught error and no console error in either page on the way", () => {
    expect(pageErrors).toEqual([]);
  });
});
