// Debian chromium driven by playwright-core, with the flags this sandboxed machine needs.
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { chromium, type BrowserContext } from "playwright-core";

export interface TestBrowser {
  context: BrowserContext;
  close(): Promise<void>;
}

export async function launchBrowser(): Promise<TestBrowser> {
  const userDataDir = mkdtempSync(join(tmpdir(), "portfold-chromium-"));
  const context = await chromium.launchPersistentContext(userDataDir, {
    executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
    headless: true,
    viewport: { width: 1440, height: 900 },
    args: [
      "--headless",
      "--no-sandbox",
      "--disable-gpu",
      "--disable-quic",
      "--no-first-run",
      "--disable-background-networking",
      "--disable-component-update",
      "--disable-sync",
    ],
  });
  return {
    context,
    close: async () => {
      await context.close();
      rmSync(userDataDir, { recursive: true, force: true });
    },
  };
}

export const screenshotDir = "test-results/screenshots";
