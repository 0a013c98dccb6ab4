// Steps several browser tests take the same way: a screenshot, signing up or in through the
// forms, importing a netlist file from the team home.
import { mkdirSync } from "node:fs";
import type { Page } from "playwright-core";
import { afterAll, beforeAll } from "vitest";
import { ApiClient } from "../support/api.js";
import { launchBrowser, screenshotDir, type TestBrowser } from "../support/browser.js";
import { startTestServer, type TestServer } from "../support/server.js";
import { watchPage } from "./page-watch.js";

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
  // The address changes before the new network has loaded: wait for its title as well.
  await page.getByRole("heading", { level: 1, name: file.title, exact: true }).waitFor();
}

/** What most browser tests start with: the app with its database, one person signed up through the API, a watched page. */
export interface SignedUpSession {
  server: TestServer;
  browser: TestBrowser;
  page: Page;
  pageErrors: string[];
  close(): Promise<void>;
}

export async function signedUpSession(person: Person): Promise<SignedUpSession> {
  mkdirSync(screenshotDir, { recursive: true });
  const server = await startTestServer();
  const api = new ApiClient(server.url);
  const signup = await api.post("/api/auth/signup", person);
  if (signup.status !== 201) throw new Error(`sign-up answered ${signup.status}`);
  const browser = await launchBrowser();
  const page = await browser.context.newPage();
  const pageErrors: string[] = [];
  watchPage(page, pageErrors);
  return {
    server,
    browser,
    page,
    pageErrors,
    close: async () => {
      await browser.close();
      await server.close();
    },
  };
}

/** For a describe block: one signed-up session before its tests (pages wait up to 60 s), closed after them. */
export function withSignedUpSession(person: Person): () => SignedUpSession {
  let session: SignedUpSession | undefined;
  beforeAll(async () => {
    session = await signedUpSession(person);
    session.page.setDefaultTimeout(60_000);
  });
  afterAll(async () => {
    await session?.close();
  });
  return () => {
    if (!session) throw new Error("the session has not started");
    return session;
  };
}
