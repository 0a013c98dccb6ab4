// Records what went wrong inside a page: uncaught errors, console errors such as a
// Content-Security-Policy refusal, and every 5xx answer the page got. A refused request (401 while
// signed out, 404, 409) is an answer, not a fault; "Failed to load resource" console lines only
// repeat those answers, so they are skipped here and the server's own faults come from the responses.
import type { Page } from "playwright-core";

export function watchPage(page: Page, problems: string[]): Page {
  page.setDefaultTimeout(10_000);
  page.on("pageerror", (error) => problems.push(`uncaught: ${error.message}`));
  page.on("response", (response) => {
    if (response.status() >= 500) problems.push(`${response.status()} from ${response.request().method()} ${response.url()}`);
  });
  page.on("console", (message) => {
    if (message.type() !== "error") return;
    if (message.text().startsWith("Failed to load resource")) return;
    problems.push(`console at ${page.url()}: ${message.text()}`);
  });
  return page;
}
