// Steps several browser tests take the same way: a screenshot, signing up or in through the
// forms, importing a netlist file from the team home.
import type { Page } from "playwright-core";
import { screenshotDir } from "../support/browser.js";

export interface Person {
  name: string;
  email: string;
  password: string;
}

export async function shot(page: Page, name: string): Promise<void> {
  // A full-page picture of a long ledger can take a while on a loaded machine.
  await page.screenshot({ path: `${screenshotDir}/${name}.png`, fullPage: true, timeout: 30_000 });
}

/** Fills the sign-up form on the current page and sends it. */
export async function signUpThroughForm(page: Page, who: Person): Promise<void> {
  await page.getByLabel("Name").fill(who.name);
  await page.getByLabel("E-mail").fill(who.email);
  await page.getByLabel("Password").fill(who.password);
  await page.getByRole("button", { name: "Create account" }).click();
}

/** Signs in through the form and waits for the team home (or the list of teams, for someone in several). */
export async function signInThroughForm(page: Page, baseUrl: string, who: Pick<Person, "email" | "password">): Promise<void> {
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel("E-mail").fill(who.email);
  await page.getByLabel("Password").fill(who.password);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL(/\/teams(\/|$)/);
}

/** From the team home: imports a Portfold netlist as a file and waits for its workbench. */
export async function importNetlist(page: Page, file: { name: string; text: string; title: string }): Promise<void> {
  await page.getByRole("button", { name: "Import from file" }).click();
  await page.getByLabel("File", { exact: true }).setInputFiles({ name: file.name, mimeType: "text/plain", buffer: Buffer.from(file.text) });
  await page.getByLabel(/^Title/).fill(file.title);
  await page.getByRole("button", { name: "Import", exact: true }).click();
  await page.waitForURL(/\/networks\/[0-9a-f-]{36}$/);
}
