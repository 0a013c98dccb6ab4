// Records what went wrong inside a page: uncaught errors, and console errors such as a
// Content-Security-Policy refusal. A refused request (401 while signed out) is an answer, not a fault.
import type { Page } from "playwright-core";

export function watchPage(page: Page, problems: string[]): Page {
  page.setDefaultTimeout(10_000);
  page.on("pageerror", (error) => problems.push(`uncaught: ${error.message}`));
  page.on("console", (message) => {
    if (message.type() !== "error") return;
    if (message.text().startsWith("Failed to load resource")) return;
    problems.push(`console at ${page.url()}: ${message.text()}`);
  });
  return page;
}
