// The bundle report on a small app built by the real bundler: it must tell a library imported
// statically (in the first load, with the file that imports it) from one loaded on demand.
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";
import { build } from "vite";
import { afterAll, describe, expect, it } from "vitest";
import { bundleReport, formatReport, reportFileName, type BundleReport } from "../../scripts/bundle-report.js";

describe("the bundle report", () => {
  const root = mkdtempSync(join(tmpdir(), "portfold-bundle-fixture-"));
  afterAll(() => rmSync(root, { recursive: true, force: true }));

  it("names the file that pulls KaTeX into the first load, and finds uPlot lazy", async () => {
    writeFileSync(join(root, "index.html"), `<!doctype html><html><body><div id="root"></div><script type="module" src="/entry.js"></script></body></html>`);
    writeFileSync(join(root, "entry.js"), `import { typeset } from "./formula.js";\ndocument.body.dataset.ready = typeset("V_{th}");\nwindow.addEventListener("click", () => import("./chart.js"));\n`);
    writeFileSync(join(root, "formula.js"), `import katex from "katex";\nexport const typeset = (tex) => katex.renderToString(tex);\n`);
    writeFileSync(join(root, "chart.js"), `import uPlot from "uplot";\nexport const chart = (el) => new uPlot({ width: 10, height: 10, series: [{}] }, [[]], el);\n`);
    const nodeEnv = process.env.NODE_ENV;
    process.env.NODE_ENV = "production";
    try {
      await build({
        root,
        configFile: false,
        logLevel: "silent",
        resolve: { alias: { katex: resolve("node_modules/katex"), uplot: resolve("node_modules/uplot") } },
        build: { outDir: join(root, "dist"), rolldownOptions: { plugins: [bundleReport({ targetKb: 350 })] } },
      });
    } finally {
      process.env.NODE_ENV = nodeEnv;
    }
    const report: BundleReport = JSON.parse(readFileSync(join(root, "dist", reportFileName), "utf8"));
    const katex = report.libraries.find((library) => library.name === "KaTeX")!;
    const uplot = report.libraries.find((library) => library.name === "uPlot")!;
    expect(katex.lazy).toBe(false);
    // The chain runs from the entry through our own files to KaTeX; its last file of ours is the culprit.
    const chain = katex.eagerChain!;
    const firstLibraryModule = chain.findIndex((id) => /node_modules\//.test(id));
    expect(chain[firstLibraryModule]).toMatch(/node_modules\/katex\//);
    expect(chain[firstLibraryModule - 1]).toMatch(/formula\.js$/);
    expect(formatReport({ ...report }, 350, root)).toContain("KaTeX: EAGER, in the first load; imported statically by formula.js");
    expect(uplot.lazy).toBe(true);
    expect(uplot.eagerChain).toBeNull();
    expect(report.lazy.some((chunk) => chunk.libraries.includes("uPlot"))).toBe(true);
    expect(report.firstLoad.every((chunk) => !report.lazy.some((lazy) => lazy.fileName === chunk.fileName))).toBe(true);
  });
});
