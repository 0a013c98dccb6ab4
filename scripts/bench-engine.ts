// Benchmark of the exact engine: Vth + Isc + Rth on ladder networks, beside sympy on the same
// networks in the same run. A script, not a test: it prints figures, it asserts nothing.
//
//   npm run bench:engine -- [--max N] [--max-gm N] [--sympy-budget SECONDS] [--sympy-cap SECONDS] [--no-sympy]
//
// Each network is solved in a fresh child process, so "peak MB" is that process's peak RSS; times
// are the best of up to three runs after a warm-up on a small ladder.
// Columns: first = the first exact solve of that network (after the warm-up); exact = best of three of
// the three results in lowest terms plus the Voc/Isc cross-check (no printing);
// full = solveNetwork with every printed form (infix, TeX, compact), no ledger.
// sympy = tests/engine/sympy/bench_port.py (Cramer's rule on DomainMatrix determinants over
// the polynomial ring, then cancel), given a per-network cap and a total budget.

import { spawnSync } from "node:child_process";
import { fileURLToPath } from "node:url";
import { solveNetwork, solveNetworkExact, type Element, type NetworkInput } from "../shared/engine";
import { readExpression } from "../shared/engine/algebra";

const HERE = fileURLToPath(import.meta.url);
const SYMPY_SCRIPT = fileURLToPath(new URL("../tests/engine/sympy/bench_port.py", import.meta.url));
const PYTHON = "/usr/bin/python3";

/** n sections of series Ra_i and shunt Rb_i, driven by Vs; optionally a transconductance gm_i·V(n_{i-1}) (a current source naming across) in every section. */
export function ladderNetwork(n: number, withGm: boolean): NetworkInput {
  const elements: Element[] = [{ name: "Vin", kind: "voltage", nodes: ["n0", "0"], value: "Vs" }];
  for (let i = 1; i <= n; i++) {
    elements.push({ name: `Ra${i}`, kind: "resistor", nodes: [`n${i - 1}`, `n${i}`], value: `Ra_${i}` });
    elements.push({ name: `Rb${i}`, kind: "resistor", nodes: [`n${i}`, "0"], value: `Rb_${i}` });
    if (withGm) elements.push({ name: `Gm${i}`, kind: "current", nodes: [`n${i}`, "0"], value: `gm_${i} * across(n${i - 1}, 0)` });
  }
  return { port: { plus: `n${n}`, minus: "0" }, elements };
}

interface OneRun {
  /** The first exact solve of this network (after the small warm-up). */
  firstMs: number;
  exactMs: number;
  fullMs: number;
  peakMB: number;
  terms: { rthNum: number; rthDen: number; vthNum: number; iscNum: number; iscDen: number };
  agree: boolean | null;
  results: { vth: string | null; rth: string | null; isc: string | null };
}

/** Child mode: solve one ladder and report on stdout. */
function runOne(n: number, withGm: boolean): OneRun {
  const net = ladderNetwork(n, withGm);
  // Warm the JIT on a small ladder first, then keep the best of up to three runs (within ~3 s).
  solveNetwork(ladderNetwork(3, withGm), { steps: false });
  let exactMs = Infinity;
  let fullMs = Infinity;
  const first = performance.now();
  let exact = solveNetworkExact(net);
  const firstMs = performance.now() - first;
  let full = solveNetwork(net, { steps: false, sensitivities: false, dimensions: false });
  for (let run = 0, spent = 0; run < 3 && spent < 3000; run++) {
    const t0 = performance.now();
    exact = solveNetworkExact(net);
    const t1 = performance.now();
    full = solveNetwork(net, { steps: false, sensitivities: false, dimensions: false });
    const t2 = performance.now();
    exactMs = Math.min(exactMs, t1 - t0);
    fullMs = Math.min(fullMs, t2 - t1);
    spent += t2 - t0;
  }
  const port = exact.port!;
  return {
    firstMs,
    exactMs,
    fullMs,
    peakMB: process.resourceUsage().maxRSS / 1024,
    terms: {
      rthNum: port.rth?.num.termCount() ?? 0,
      rthDen: port.rth?.den.termCount() ?? 0,
      vthNum: port.vth?.num.termCount() ?? 0,
      iscNum: port.isc?.num.termCount() ?? 0,
      iscDen: port.isc?.den.termCount() ?? 0,
    },
    agree: port.agree,
    results: { vth: full.vth?.infix ?? null, rth: full.rth?.infix ?? null, isc: full.isc?.infix ?? null },
  };
}

interface SympyRun {
  /** Solve time measured inside python (imports excluded). */
  seconds: number | null;
  /** Wall time of the python process, charged to the budget. */
  wall: number;
  status: "ok" | "timeout" | "error";
  matches: boolean | null;
}

function runSympy(net: NetworkInput, capSeconds: number, ours: OneRun["results"]): SympyRun {
  const started = performance.now();
  const r = spawnSync(PYTHON, [SYMPY_SCRIPT], { input: JSON.stringify(net), encoding: "utf8", timeout: Math.round(capSeconds * 1000), maxBuffer: 1 << 30 });
  const wall = (performance.now() - started) / 1000;
  if (r.error && (r.error as NodeJS.ErrnoException).code === "ETIMEDOUT") return { seconds: null, wall, status: "timeout", matches: null };
  if (r.status !== 0) return { seconds: null, wall, status: "error", matches: null };
  const out = JSON.parse(r.stdout) as { seconds: number; vth: string | null; rth: string | null; isc: string | null };
  // The two must be the same functions: read sympy's strings back (** as ^) and compare exactly.
  const same = (a: string | null, b: string | null) => (a === null || b === null ? a === b : readExpression(a.replace(/\*\*/g, "^")).sub(readExpression(b)).isZero());
  const matches = same(out.vth, ours.vth) && same(out.rth, ours.rth) && same(out.isc, ours.isc);
  return { seconds: out.seconds, wall, status: "ok", matches };
}

function childRun(n: number, withGm: boolean): OneRun {
  const r = spawnSync(process.execPath, ["--import", "tsx", HERE, "--one", String(n), withGm ? "gm" : "plain"], { encoding: "utf8", maxBuffer: 1 << 30 });
  if (r.status !== 0) throw new Error(`child failed for ${withGm ? "gm-" : ""}ladder-${n}: ${r.stderr}`);
  return JSON.parse(r.stdout) as OneRun;
}

function arg(name: string, fallback: number): number {
  const i = process.argv.indexOf(name);
  return i >= 0 ? Number(process.argv[i + 1]) : fallback;
}

function pad(s: string, n: number): string {
  return s.length >= n ? s : " ".repeat(n - s.length) + s;
}

function main(): void {
  const one = process.argv.indexOf("--one");
  if (one >= 0) {
    process.stdout.write(JSON.stringify(runOne(Number(process.argv[one + 1]), process.argv[one + 2] === "gm")));
    return;
  }
  const maxPlain = arg("--max", 12);
  const maxGm = arg("--max-gm", 10);
  const budget = arg("--sympy-budget", 90);
  const cap = arg("--sympy-cap", 30);
  const sympy = !process.argv.includes("--no-sympy");
  let spent = 0;

  const header = ["network", "first ms", "exact ms", "full ms", "peak MB", "Rth N/D terms", "Vth N", "Isc N/D", "agree", "sympy s", "same", "sympy/exact"];
  const widths = [14, 9, 9, 9, 8, 15, 6, 14, 6, 12, 5, 11];
  console.log(`Portfold engine benchmark (node ${process.version}); sympy budget ${budget} s, cap ${cap} s per network`);
  console.log(header.map((h, i) => pad(h, widths[i])).join(" "));
  const rows: { name: string; ours: OneRun; sym: SympyRun | null }[] = [];
  // Smallest first, the two families interleaved, so the sympy budget reaches both.
  const cases: [number, boolean][] = [];
  for (let n = 3; n <= Math.max(maxPlain, maxGm); n++) {
    if (n <= maxPlain) cases.push([n, false]);
    if (n <= maxGm) cases.push([n, true]);
  }
  for (const [n, withGm] of cases) {
    const name = `${withGm ? "gm-" : ""}ladder-${n}`;
    const ours = childRun(n, withGm);
    let sym: SympyRun | null = null;
    if (sympy) {
      const left = budget - spent;
      sym = left <= 1 ? { seconds: null, wall: 0, status: "timeout", matches: null } : runSympy(ladderNetwork(n, withGm), Math.min(cap, left), ours.results);
      spent += sym.wall;
    }
    rows.push({ name, ours, sym });
    const t = ours.terms;
    const symText = !sym ? "-" : sym.status === "ok" ? sym.seconds!.toFixed(2) : sym.status === "timeout" ? "sympy: >cap" : "error";
    const ratio = sym && sym.status === "ok" ? `${(sym.seconds! * 1000 / ours.exactMs).toFixed(0)}x` : "-";
    console.log(
      [
        name,
        ours.firstMs.toFixed(0),
        ours.exactMs.toFixed(0),
        ours.fullMs.toFixed(0),
        ours.peakMB.toFixed(0),
        `${t.rthNum}/${t.rthDen}`,
        String(t.vthNum),
        `${t.iscNum}/${t.iscDen}`,
        String(ours.agree),
        symText,
        sym && sym.matches !== null ? (sym.matches ? "yes" : "NO") : "-",
        ratio,
      ]
        .map((c, i) => pad(c, widths[i]))
        .join(" "),
    );
  }
  const l12 = rows.find((r) => r.name === "ladder-12");
  const l7 = rows.find((r) => r.name === "ladder-7");
  console.log("");
  if (l12) console.log(`target ladder-12 (Rth denominator ${l12.ours.terms.rthDen} terms) <= 2 s: first ${(l12.ours.firstMs / 1000).toFixed(2)} s, exact ${(l12.ours.exactMs / 1000).toFixed(2)} s, full ${(l12.ours.fullMs / 1000).toFixed(2)} s`);
  if (l7?.sym?.status === "ok") {
    const s7 = l7.sym.seconds! * 1000;
    console.log(`target >= 100x sympy on ladder-7: ${(s7 / l7.ours.exactMs).toFixed(0)}x best, ${(s7 / l7.ours.firstMs).toFixed(0)}x first run (sympy ${(s7 / 1000).toFixed(1)} s, exact ${l7.ours.exactMs.toFixed(0)} ms, first ${l7.ours.firstMs.toFixed(0)} ms)`);
  }
}

main();
