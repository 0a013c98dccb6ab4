// Builds the client with the project's own vite.config.ts into a temporary folder, so a test checks
// the app as `npm start` would serve it, whatever dist/ holds at the moment.
import { mkdtempSync, readFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { build } from "vite";
import { reportFileName, type BundleReport } from "../../scripts/bundle-report.js";

export interface ClientBuild {
  dir: string;
  report: BundleReport & { targetKb: number };
}

export async function buildClient(): Promise<ClientBuild> {
  const dir = mkdtempSync(join(tmpdir(), "portfold-client-"));
  // vitest runs with NODE_ENV=test, which would give React's development build; `npm start` builds for production.
  const nodeEnv = process.env.NODE_ENV;
  process.env.NODE_ENV = "production";
  try {
    await build({ configFile: "vite.config.ts", mode: "production", logLevel: "silent", build: { outDir: dir, emptyOutDir: true } });
  } finally {
    process.env.NODE_ENV = nodeEnv;
  }
  return { dir, report: JSON.parse(readFileSync(join(dir, reportFileName), "utf8")) };
}
