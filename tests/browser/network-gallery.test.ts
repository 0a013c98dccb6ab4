// Networks of every element kind, solved through the API and opened in the workbench: the
// schematic preview draws them, the ledger typesets without a KaTeX error, and Values give
// the numbers known from practice.
import { mkdirSync } from "node:fs";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { parseNetlistText } from "../../shared/engine/circuit/netlist-text.js";
import { ApiClient } from "../support/api.js";
import { launchBrowser, screenshotDir, type TestBrowser } from "../support/browser.js";
import { startTestServer, type TestServer } from "../support/server.js";
import { watchPage } from "./page-watch.js";

interface GalleryNetwork {
  slug: string;
  title: string;
  netlist: string;
  values: Record<string, string>;
  expect: Partial<Record<"vth" | "rth" | "isc", string>>;
  source: string;
}

const gallery: GalleryNetwork[] = [
  {
    slug: "non-inverting-stage",
    title: "Non-inverting sensor stage",
    // Ideal op-amp, non-inverting: gain 1 + R2/R1 and an output of zero resistance (common practice).
    netlist: `ground 0
port out 0
Sensor voltage in 0 = Vs
GainBlock opamp in fb -> out
Feedback resistor out fb = R2
LowerLeg resistor fb 0 = R1
`,
    values: { Vs: "100m", R1: "1k", R2: "9k" },
    expect: { vth: "1 V" },
    source: "common practice: non-inverting gain 1 + R2/R1 = 10, ideal output stiff",
  },
  {
    slug: "emitter-follower",
    title: "Line driver, emitter follower",
    // Hybrid-pi emitter follower: Rout = RE || ro || (Rs + r_pi)/(1 + gm*r_pi)
    // (e.g. Sedra & Smith, Microelectronic Circuits, emitter follower; from memory).
    netlist: `ground 0
port e 0
Signal voltage sig 0 = Vs
SourceRes resistor sig b = Rs
BaseEmitter resistor b e = r_pi
Transcond current 0 e = gm * across(b, e)
Output resistor e 0 = r_o
EmitterLoad resistor e 0 = RE
`,
    values: { Vs: "1", Rs: "1k", r_pi: "2.5k", gm: "40m", r_o: "100k", RE: "1k" },
    // (1000 + 2500)/(1 + 100) = 34.6535 Ω in parallel with 1 kΩ and 100 kΩ: 33.48 Ω
    expect: { rth: "33.48 Ω" },
    source: "emitter follower output resistance",
  },
  {
    slug: "rc-anti-alias",
    title: "RC anti-alias filter",
    // First-order RC low-pass seen from its output: Zth(s) = R/(1 + sRC), so Zth(0) = R (common practice).
    netlist: `ground 0
port out 0
Driver voltage in 0 = Vs
Series resistor in out = R
Hold capacitor out 0 = C
`,
    values: { Vs: "1", R: "10k", C: "1n", s: "0" },
    expect: { rth: "10 kΩ", vth: "1 V" },
    source: "RC low-pass at DC",
  },
  {
    slug: "rl-sense",
    title: "Current-sense shunt with trace inductance",
    // A CCVS reading the shunt current, and an inductor in series: at s = 0 only the resistances remain.
    netlist: `ground 0
port o 0
Feed current 0 n = Is
Shunt resistor n 0 = Rsh
Trace inductor n m = L
Readout voltage o 0 = rm * through(Shunt)
Sense resistor m 0 = Rm
`,
    values: { Is: "1", Rsh: "1", L: "5n", rm: "100", Rm: "3", s: "0" },
    // At DC the inductor is a short, so the shunt is in parallel with Rm: I(Shunt) = Is*Rm/(Rsh + Rm) = 0.75 A,
    // and the readout gives rm times that: 75 V.
    expect: { vth: "75 V" },
    source: "current divider at DC",
  },
];

describe("network gallery in chromium", () => {
  let server: TestServer;
  let browser: TestBrowser;
  let page: Page;
  let api: ApiClient;
  let teamId = "";
  const pageErrors: string[] = [];

  beforeAll(async () => {
    mkdirSync(screenshotDir, { recursive: true });
    server = await startTestServer();
    api = new ApiClient(server.url);
    const who = { name: "Gala Gallery", email: `gala-${Date.now().toString(36)}@example.com`, password: "gallery password" };
    expect((await api.post("/api/auth/signup", who)).status).toBe(201);
    teamId = (await api.get("/api/me")).body.teams[0].id;
    browser = await launchBrowser();
    const [name, value] = api.cookie!.split("=");
    await browser.context.addCookies([{ name, value, url: server.url }]);
    page = await browser.context.newPage();
    watchPage(page, pageErrors);
  });
  afterAll(async () => {
    await browser?.close();
    await server?.close();
  });

  for (const network of gallery) {
    it(`draws, typesets and evaluates: ${network.title} (${network.source})`, async () => {
      const parsed = parseNetlistText(network.netlist);
      expect(parsed.diagnostics.filter((d) => d.severity === "error")).toEqual([]);
      const created = await api.post(`/api/teams/${teamId}/networks`, { title: network.title, circuit: parsed.network });
      expect(created.status).toBe(201);
      expect((await api.post(`/api/networks/${created.body.id}/solve`)).status).toBe(201);

      await page.goto(`${server.url}/networks/${created.body.id}`);
      await page.locator('ol[aria-label="Ledger"] .katex').first().waitFor({ timeout: 30_000 }); // the first page also loads KaTeX
      expect(await page.locator(".katex-error").count()).toBe(0);
      const elements = parsed.network!.elements.length;
      await expect(page.locator('svg[aria-label^="Schematic preview"]').getAttribute("aria-label")).resolves.toContain(`${elements} elements`);

      const values = page.getByRole("region", { name: "Values" });
      for (const [symbol, text] of Object.entries(network.values)) await values.getByLabel(symbol, { exact: true }).fill(text);
      for (const [result, shown] of Object.entries(network.expect)) {
        await expect.poll(() => page.getByTestId(`value-${result}`).textContent()).toBe(shown);
      }
      await page.screenshot({ path: `${screenshotDir}/gallery-${network.slug}.png` });
    });
  }

  it("raised no uncaught error and no console error in the page on the way", () => {
    expect(pageErrors).toEqual([]);
  });
});
