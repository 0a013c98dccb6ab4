/// <reference types="vitest/config" />
import { defineConfig } from "vite";
import react from "@vitejs/plugin-react";
import { fileURLToPath } from "node:url";
import { bundleReport } from "./scripts/bundle-report.js";

const apiPort = Number(process.env.PORT ?? 4317);

export default defineConfig({
  plugins: [react()],
  resolve: { alias: { "@": fileURLToPath(new URL("./src", import.meta.url)) } },
  build: {
    outDir: "dist/client",
    emptyOutDir: true,
    // Fonts stay files, never data: URLs, so the Content-Security-Policy can say font-src 'self'.
    assetsInlineLimit: (file) => (/\.(woff2?|ttf|otf|eot)$/.test(file) ? false : undefined),
    // Prints first-load JS (gzip) against 350 kB and which chunks, KaTeX and uPlot among them, are lazy.
    rolldownOptions: { plugins: [bundleReport({ targetKb: 350 })] },
  },
  server: {
    proxy: { "/api": `http://127.0.0.1:${apiPort}` },
  },
  test: {
    projects: [
      { extends: true, test: { name: "unit", include: ["tests/engine/**/*.test.ts", "tests/unit/**/*.test.ts"], environment: "node", testTimeout: 30_000 } },
      { extends: true, test: { name: "integration", include: ["tests/integration/**/*.test.ts"], environment: "node", fileParallelism: false, testTimeout: 30_000, hookTimeout: 30_000 } },
      { extends: true, test: { name: "browser", include: ["tests/browser/**/*.test.ts"], environment: "node", fileParallelism: false, testTimeout: 120_000, hookTimeout: 120_000 } },
    ],
  },
});
