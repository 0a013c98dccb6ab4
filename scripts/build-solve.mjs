// Builds what `npm run solve` runs (scripts/solve.sh): scripts/solve.ts bundled by esbuild into one
// CommonJS file with its libraries, then a V8 startup snapshot of it, so a run starts with the
// engine already loaded instead of compiling TypeScript. Output in node_modules/.cache/portfold.

import { execFileSync } from "node:child_process";
import { mkdirSync, renameSync, rmSync } from "node:fs";
import { dirname, join, resolve } from "node:path";
import { fileURLToPath } from "node:url";
import { build } from "esbuild";

const ROOT = resolve(dirname(fileURLToPath(import.meta.url)), "..");
const OUT_DIR = join(ROOT, "node_modules", ".cache", "portfold");
// Per-process names, renamed at the end: runs started together never read half a file.
const bundle = join(OUT_DIR, `solve.${process.pid}.cjs`);
const blob = join(OUT_DIR, `solve.${process.pid}.blob`);

mkdirSync(OUT_DIR, { recursive: true });
try {
  await build({
    entryPoints: [join(ROOT, "scripts", "solve.ts")],
    outfile: bundle,
    bundle: true,
    platform: "node",
    format: "cjs",
    target: "node20",
    minify: true,
    logLevel: "error",
    absWorkingDir: ROOT,
  });
  execFileSync(process.execPath, ["--snapshot-blob", blob, "--build-snapshot", bundle], { stdio: "inherit" });
  renameSync(blob, join(OUT_DIR, "solve.blob"));
} finally {
  rmSync(bundle, { force: true });
  rmSync(blob, { force: true });
}
