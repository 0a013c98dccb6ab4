// The Sweep and Frequency panels and the netlist editor's margin notes in chromium, on a sensor's
// anti-alias RC low-pass in front of an ADC. Checks against outside references: the single-pole
// low-pass (common practice, any circuits textbook): −3 dB and −45° at fc = 1/(2πRC), −20 dB per
// decade well above it; |H(j2πf)| evaluated by sympy at the plotted frequencies.
import { execFileSync } from "node:child_process";
import { readFileSync } from "node:fs";
import type { Locator } from "playwright-core";
import { describe, expect, it } from "vitest";
import { screenshotDir } from "../support/browser.js";
import { importNetlist, signInThroughForm, withSignedUpSession } from "./page-steps.js";

const WIDTHS = [390, 1024, 1280, 1440];
const HEIGHT: Record<number, number> = { 390: 844, 1024: 768, 1280: 800, 1440: 900 };

// Vth = Vin/(1 + sRC), Zth = R/(1 + sRC).
const ANTI_ALIAS = `# anti-alias filter between the sensor and the ADC input
ground 0
port adc 0
Sensor voltage in 0 = Vin
Rfilt resistor in adc = R
Cfilt capacitor adc 0 = C
`;
const [R, C] = [1000, 100e-9];
const FC = 1 / (2 * Math.PI * R * C); // 1591.55 Hz

const run = Date.now().toString(36);
const user = { name: "Pia Plots", email: `pia-${run}@example.com`, password: "first password 1" };

// |1/(1 + j2πfRC)| by sympy, to 15 digits, at each frequency.
function sympyMagnitudes(frequencies: number[]): number[] {
  const program = `
import json, sys, sympy
f = sympy.Symbol("f", positive=True)
R, C = sympy.Integer(1000), sympy.Rational(1, 10**7)
H = 1/(1 + sympy.I*2*sympy.pi*f*R*C)
print(json.dumps([float(sympy.N(sympy.Abs(H.subs(f, sympy.nsimplify(x))), 15)) for x in json.load(sys.stdin)]))
`;
  return JSON.parse(execFileSync("/usr/bin/python3", ["-c", program], { input: JSON.stringify(frequencies), encoding: "utf8", timeout: 60_000 }));
}

const ticks = (chart: Locator, axis: "x" | "y") => chart.getAttribute(axis === "x" ? "data-ticks-x" : "data-ticks-y");
const readingDb = (text: string | null) => Number(/= (-?[\d.]+) dB/.exec(text ?? "")?.[1]);

// Each step between neighbouring ticks is 1, 2 or 5 times a power of ten.
function isOneTwoFive(labels: string): boolean {
  const SI: Record<string, number> = { k: 1e3, M: 1e6, m: 1e-3, "µ": 1e-6 };
  const values = labels.split(" ").map((l) => Number(l.replace(/[kMmµ]$/, "")) * (SI[l.slice(-1)] ?? 1));
  return values.length >= 2 && values.slice(1).every((v, i) => {
    const step = v - values[i];
    const mantissa = Number((step / 10 ** Math.floor(Math.log10(step))).toPrecision(6));
    return [1, 2, 5].includes(mantissa);
  });
}

describe("sweep, frequency panel and editor notes in chromium", () => {
  const session = withSignedUpSession(user);

  it("draws the open-circuit transfer from the one source: −3 dB at 1/(2πRC), −20 dB per decade, sympy's |H| at the plotted points", async () => {
    const { page, server } = session();
    await signInThroughForm(page, server.url, user);
    await importNetlist(page, { name: "anti-alias.pfn", text: ANTI_ALIAS, title: "Anti-alias filter" });
    await page.getByRole("button", { name: "Solve", exact: true }).click();
    await page.waitForURL(/\/r\/1$/, { timeout: 30_000 });

    const values = page.getByRole("region", { name: "Values", exact: true });
    await values.getByLabel("R", { exact: true }).fill("1k");
    await values.getByLabel("C", { exact: true }).fill("100n");
    const frequency = page.getByRole("region", { name: "Frequency", exact: true });
    await expect(frequency.getByLabel("Plot", { exact: true }).inputValue()).resolves.toBe("transfer");
    await expect(frequency.getByTestId("frequency-source-note").textContent()).resolves.toContain("Vth/Vin: the open-circuit voltage divided by the value of Sensor (Vin), the network's one independent source");
    const figure = frequency.getByRole("figure", { name: "Bode plot of Vth/Vin" });
    await figure.locator("canvas").nth(1).waitFor();
    // One pole at −1/(RC) = −10 krad/s (1.592 kHz), no zero (common practice for a single RC).
    await expect(frequency.getByRole("list", { name: "Poles" }).textContent()).resolves.toBe("s = -10 krad/s (1.592 kHz)");
    await expect(frequency.locator('dl[aria-label="Poles and zeros of Vth/Vin"]').textContent()).resolves.toContain("Zerosnone");

    await frequency.getByLabel("From", { exact: true }).fill("10");
    await frequency.getByLabel("To", { exact: true }).fill("1M");
    const [magnitude, phase] = [figure.locator("[data-ticks-x]").nth(0), figure.locator("[data-ticks-x]").nth(1)];
    await expect.poll(() => ticks(magnitude, "x")).toBe("10 100 1k 10k 100k 1M");
    await expect(magnitude.getAttribute("data-scale-y")).resolves.toBe("linear");
    await expect.poll(async () => isOneTwoFive((await ticks(magnitude, "y")) ?? "")).toBe(true);
    // Phase runs from 0 to −90° in fractions of a turn (multiples of 15°).
    await expect.poll(async () => ((await ticks(phase, "y")) ?? "").split(" ").map(Number)).toEqual(expect.arrayContaining([-90, 0]));
    expect(((await ticks(phase, "y")) ?? "").split(" ").every((t) => Number(t) % 15 === 0)).toBe(true);

    const readAt = frequency.getByLabel("Read at", { exact: true });
    const reading = frequency.getByTestId("bode-reading");
    await readAt.fill(FC.toPrecision(10));
    await expect.poll(() => reading.textContent()).toMatch(/= -3\.01 dB, phase -45\.0°$/);
    await readAt.fill("100k");
    await expect.poll(() => reading.textContent()).toContain("f = 100 kHz");
    const at100k = readingDb(await reading.textContent());
    await readAt.fill("1M");
    await expect.poll(() => reading.textContent()).toContain("f = 1 MHz");
    expect(readingDb(await reading.textContent()) - at100k).toBeCloseTo(-20, 1);

    const [download] = await Promise.all([page.waitForEvent("download"), frequency.getByRole("button", { name: "Download CSV" }).click()]);
    const rows = readFileSync((await download.path())!, "utf8").trim().split("\n");
    expect(rows[0]).toBe("frequency (Hz),|Vth/Vin| (V/V),|Vth/Vin| (dB),phase (°)");
    expect(rows.length).toBe(1 + 5 * 40 + 1);
    const sample = [1, 60, 120, 141, 200].map((i) => rows[i].split(",").map(Number));
    const reference = sympyMagnitudes(sample.map(([f]) => f));
    sample.forEach(([, mag, db], i) => {
      expect(Math.abs(mag - reference[i]) / reference[i]).toBeLessThan(1e-9);
      expect(db).toBeCloseTo(20 * Math.log10(reference[i]), 9);
    });

    // Linear magnitude: a log axis of decades in V/V.
    await frequency.getByLabel("linear", { exact: true }).check();
    await expect.poll(() => magnitude.getAttribute("data-scale-y")).toBe("log");
    await expect.poll(async () => ((await ticks(magnitude, "y")) ?? "").split(" ")).toContain("100m");
    await frequency.getByLabel("dB", { exact: true }).check();
  });

  it("says clearly what is wrong with a typed frequency range, and offers |Zth| too", async () => {
    const { page } = session();
    const frequency = page.getByRole("region", { name: "Frequency", exact: true });
    const alert = frequency.getByRole("alert");
    await frequency.getByLabel("From", { exact: true }).fill("0");
    await expect(alert.textContent()).resolves.toBe("Start: the frequency axis is logarithmic, so the start must be above 0 Hz.");
    await frequency.getByLabel("From", { exact: true }).fill("ten");
    await expect(alert.textContent()).resolves.toMatch(/^Start: expected a number/);
    await frequency.getByLabel("From", { exact: true }).fill("10k");
    await frequency.getByLabel("To", { exact: true }).fill("1k");
    await expect(alert.textContent()).resolves.toBe("Stop: must be above the start (10 kHz).");
    await frequency.getByLabel("From", { exact: true }).fill("10");
    await frequency.getByLabel("To", { exact: true }).fill("1 MHz");
    await alert.waitFor({ state: "detached" });

    await frequency.getByLabel("Plot", { exact: true }).selectOption("zth");
    const figure = frequency.getByRole("figure", { name: "Bode plot of Zth" });
    await figure.locator("canvas").nth(1).waitFor();
    // Zth = R/(1 + sRC): R at DC, 0 at high frequency (common practice).
    await expect(figure.textContent()).resolves.toContain("DC limit (1 kΩ)");
    await frequency.getByLabel("Plot", { exact: true }).selectOption("transfer");
    for (const width of WIDTHS) {
      await page.setViewportSize({ width, height: HEIGHT[width] });
      await frequency.scrollIntoViewIfNeeded();
      await frequency.screenshot({ path: `${screenshotDir}/frequency-panel-${width}.png` });
    }
    await page.setViewportSize({ width: 1440, height: 900 });
  });

  it("names the sweep Zth(s), labels log decades, and unticks log on a range through zero", async () => {
    const { page } = session();
    // s = 0 reads the network at DC, where Zth = R.
    await page.getByRole("region", { name: "Values", exact: true }).getByLabel("s", { exact: true }).fill("0");
    const sweep = page.getByRole("region", { name: "Sweep", exact: true });
    await expect(sweep.count()).resolves.toBe(1);
    const options = await sweep.getByLabel("Plot", { exact: true }).locator("option").allTextContents();
    expect(options).toContain("Zth(s) (Ω)");
    expect(options.join(" ")).not.toContain("Rth");
    await sweep.getByLabel("Plot", { exact: true }).selectOption("rth");
    await sweep.getByLabel("Against", { exact: true }).selectOption("R");
    await sweep.getByLabel("From", { exact: true }).fill("1");
    await sweep.getByLabel("To", { exact: true }).fill("1M");
    const chart = sweep.locator("[data-ticks-x]");
    await expect.poll(() => ticks(chart, "x")).toBe("1 10 100 1k 10k 100k 1M");
    await expect.poll(() => ticks(chart, "y")).toBe("1 10 100 1k 10k 100k 1M");
    await expect(sweep.getByLabel("log Zth(s)").isChecked()).resolves.toBe(true);
    await sweep.scrollIntoViewIfNeeded();
    for (const width of WIDTHS) {
      await page.setViewportSize({ width, height: HEIGHT[width] });
      await sweep.scrollIntoViewIfNeeded();
      await sweep.screenshot({ path: `${screenshotDir}/sweep-panel-log-${width}.png` });
    }
    await page.setViewportSize({ width: 1440, height: 900 });

    // A range from zero cannot be log: the box is unticked and the reason given; 1-2-5 steps on the linear axis.
    await sweep.getByLabel("From", { exact: true }).fill("0");
    const axes = sweep.getByRole("status", { name: "Sweep axes" });
    // Zth = R is 0 at the start too: the result's log box goes as well, with its own reason.
    await expect.poll(() => axes.textContent()).toBe(
      "The range touches zero: a log axis cannot show it. Log R unticked. Zth(s) is not positive over this range: a log axis cannot show it. Log Zth(s) unticked.",
    );
    await expect(sweep.getByLabel("log R").isChecked()).resolves.toBe(false);
    await expect(sweep.getByLabel("log Zth(s)").isChecked()).resolves.toBe(false);
    await expect.poll(() => chart.getAttribute("data-scale-x")).toBe("linear");
    await expect.poll(async () => isOneTwoFive((await ticks(chart, "x")) ?? "")).toBe(true);
    await expect(ticks(chart, "x")).resolves.toMatch(/^0 200k 400k 600k 800k 1M$|^0 500k 1M$/);
    // Ticking either again is refused, with the reason.
    await sweep.getByLabel("log Zth(s)").click();
    await expect(sweep.getByLabel("log Zth(s)").isChecked()).resolves.toBe(false);
    await expect(axes.textContent()).resolves.toContain("Zth(s) is not positive over this range: log stays unticked.");
    await sweep.getByLabel("From", { exact: true }).fill("-1M");
    await sweep.getByLabel("log R").click();
    await expect(sweep.getByLabel("log R").isChecked()).resolves.toBe(false);
    await expect(axes.textContent()).resolves.toContain("The range crosses zero: a log axis cannot show it. Log R stays unticked.");
    await expect.poll(() => ticks(chart, "y")).toMatch(/^-1M .*0 .*1M$/);
    for (const width of WIDTHS) {
      await page.setViewportSize({ width, height: HEIGHT[width] });
      await sweep.scrollIntoViewIfNeeded();
      await sweep.screenshot({ path: `${screenshotDir}/sweep-panel-linear-${width}.png` });
    }
    await page.setViewportSize({ width: 1440, height: 900 });
    // Back above zero: the reasons go, and log can be ticked again.
    await sweep.getByLabel("From", { exact: true }).fill("1");
    await axes.waitFor({ state: "detached" });
    await sweep.getByLabel("log R").check();
    await sweep.getByLabel("log Zth(s)").check();
    await expect.poll(() => ticks(chart, "x")).toBe("1 10 100 1k 10k 100k 1M");
  });

  it("puts each diagnostic beside its own line, never over the text, marks the element, and drops it the moment it is fixed", async () => {
    const { page, pageErrors } = session();
    const editor = page.getByLabel("Portfold netlist", { exact: true });
    const typed = await editor.inputValue();
    const lines = typed.split("\n");
    const bad = lines.map((l) => (l.startsWith("Rfilt") ? "Rfilt resistr in adc = R" : l.startsWith("Cfilt") ? "Cfilt capacitr adc 0 = C" : l)).join("\n");
    await editor.fill(bad);
    const notes = page.getByRole("list", { name: "Netlist diagnostics" }).getByRole("listitem");
    await notes.first().waitFor();
    const lineOf = (name: string) => lines.findIndex((l) => l.startsWith(name)) + 1;
    const count = await notes.count();
    expect(count).toBe(2);
    // The text column as shown (the textarea inside it may be wider, scrolled sideways).
    const column = editor.locator("..");
    const text = (await column.boundingBox())!;
    const boxes = [];
    for (let i = 0; i < count; i++) {
      const note = notes.nth(i);
      const line = Number(await note.getAttribute("data-diagnostic-line"));
      const box = (await note.boundingBox())!;
      boxes.push(box);
      // Beside the text: wholly right of the text box.
      expect(box.x).toBeGreaterThanOrEqual(text.x + text.width - 0.5);
      // Level with its own line (8 px padding, 20 px lines), or below it when pushed by the note above.
      expect(box.y).toBeGreaterThanOrEqual(text.y + 8 + (line - 1) * 20 - 0.5);
      if (i === 0) expect(box.y).toBeLessThanOrEqual(text.y + 8 + (line - 1) * 20 + 0.5);
    }
    for (let i = 1; i < boxes.length; i++) expect(boxes[i].y).toBeGreaterThanOrEqual(boxes[i - 1].y + boxes[i - 1].height);
    expect((await notes.allTextContents()).join(" ")).toContain(`Line ${lineOf("Rfilt")}, column`);

    // A topology fault (found only by the full check): the element named is marked in the preview.
    await editor.fill(`${typed}Rstray resistor p q = Rx\n`);
    await page.locator('svg[aria-label^="Schematic preview"] [data-fault="Rstray"]').waitFor();
    const stray = page.locator(`[data-diagnostic-line="${lines.length}"]`);
    await stray.waitFor();
    for (const width of WIDTHS) {
      await page.setViewportSize({ width, height: HEIGHT[width] });
      const panel = page.getByRole("tabpanel");
      await panel.scrollIntoViewIfNeeded();
      await page.screenshot({ path: `${screenshotDir}/editor-diagnostic-${width}.png` });
      const note = (await stray.boundingBox())!;
      const area = (await column.boundingBox())!;
      expect(note.x).toBeGreaterThanOrEqual(area.x + area.width - 0.5);
    }
    await page.setViewportSize({ width: 1440, height: 900 });
    // A warning names its elements too: they are drawn in copper.
    await editor.fill(`${typed}Cc capacitor adc x = Cx\nRx resistor x y = R2\nCy capacitor y 0 = C2\n`);
    await page.locator('svg[aria-label^="Schematic preview"] [data-caution="Cy"]').waitFor();
    await expect(page.locator('svg[aria-label^="Schematic preview"] [data-caution="Cc"]').count()).resolves.toBe(1);
    await expect(page.locator(`[data-diagnostic-line="${lines.length}"]`).textContent()).resolves.toContain("reach ground only through capacitors");
    // Fixed: gone at once, with no wait for the next check.
    await editor.fill(typed);
    await expect(page.locator("[data-diagnostic-line]").count()).resolves.toBe(0);
    await expect(page.locator("[data-fault]").count()).resolves.toBe(0);
    expect(pageErrors).toEqual([]);
  });
});
