// Property tests: random networks; Portfold's exact Vth, Rth, Isc evaluated at random points (by
// nerdamer, from the printed infix) equal an independent floating-point solve written here, in
// sparse-tableau form (every element current an unknown), which shares no code with the engine.

import fc from "fast-check";
import nerdamer from "nerdamer";
import { describe, expect, it } from "vitest";
import { ELEMENT_KINDS, solveNetwork, type Element, type NetworkInput } from "../../shared/engine";
import { mulberry32, randomNetwork } from "./circuit-generators";

const SI: Record<string, number> = { T: 1e12, G: 1e9, M: 1e6, k: 1e3, m: 1e-3, u: 1e-6, n: 1e-9, p: 1e-12, f: 1e-15 };

/** Numeric value of an expression string at a point, by nerdamer (SI prefixes expanded first). */
function evaluate(text: string, point: Record<string, number>): number {
  const expanded = text.replace(/(\d+(?:\.\d*)?(?:[eE][+-]?\d+)?)([TGMkmunpf])(?![A-Za-z0-9_])/g, (_m, n, p) => `(${n}*${SI[p]})`);
  const subs: Record<string, string> = {};
  for (const [k, v] of Object.entries(point)) subs[k] = String(v);
  return Number(nerdamer(expanded, subs).evaluate().text("decimals"));
}

const CONTROL = /(across|through)\s*\(([^)]*)\)/g;

/**
 * A source value split numerically by superposition (it is linear in its controls): the value with
 * every control at 0 is the independent part; with one control at 1, the independent part plus its gain.
 */
function linearParts(text: string, point: Record<string, number>): { independent: number; controls: { control: { word: string; args: string[] }; gain: number }[] } {
  const controls = [...text.matchAll(CONTROL)].map((m) => ({ word: m[1], args: m[2].split(",").map((x) => x.trim()) }));
  const at = (one: number) => {
    let j = 0;
    return evaluate(text.replace(CONTROL, () => (j++ === one ? "(1)" : "(0)")), point);
  };
  const independent = at(-1);
  return { independent, controls: controls.map((control, j) => ({ control, gain: at(j) - independent })) };
}

function gauss(a: number[][], b: number[]): number[] | null {
  const n = b.length;
  const m = a.map((r, i) => [...r, b[i]]);
  const scale = Math.max(...a.flat().map(Math.abs), 1e-300);
  for (let k = 0; k < n; k++) {
    let p = k;
    for (let i = k + 1; i < n; i++) if (Math.abs(m[i][k]) > Math.abs(m[p][k])) p = i;
    if (Math.abs(m[p][k]) < 1e-9 * scale) return null;
    [m[k], m[p]] = [m[p], m[k]];
    for (let i = k + 1; i < n; i++) {
      const f = m[i][k] / m[k][k];
      for (let j = k; j <= n; j++) m[i][j] -= f * m[k][j];
    }
  }
  const x = new Array<number>(n).fill(0);
  for (let i = n - 1; i >= 0; i--) {
    let s = m[i][n];
    for (let j = i + 1; j < n; j++) s -= m[i][j] * x[j];
    x[i] = s / m[i][i];
  }
  return x;
}

/** Sparse tableau: unknowns are node voltages and every element's current; one branch equation per element. */
function tableauPort(net: NetworkInput, point: Record<string, number>, mode: "open" | "test" | "short"): number | null {
  const ground = net.ground ?? "0";
  const elements: Element[] = [...net.elements];
  if (mode === "short") elements.push({ name: "__short", kind: "voltage", nodes: [net.port.plus, net.port.minus], value: "0" });
  const nodes = [...new Set(elements.flatMap((e) => (e.kind === "opamp" ? [...e.inputs, e.output] : e.nodes)))].filter((n) => n !== ground);
  const nv = nodes.length;
  const idx = new Map(elements.map((e, i) => [e.name, nv + i]));
  const n = nv + elements.length;
  const a = Array.from({ length: n }, () => new Array<number>(n).fill(0));
  const b = new Array<number>(n).fill(0);
  const vcol = (x: string) => (x === ground ? -1 : nodes.indexOf(x));
  const addV = (row: number, x: string, c: number) => {
    const j = vcol(x);
    if (j >= 0) a[row][j] += c;
  };
  const value = (e: Element) => ("value" in e ? evaluate(e.value, point) : 0);
  const s = point.s;
  elements.forEach((e, k) => {
    const row = nv + k;
    const ic = nv + k;
    if (e.kind === "opamp") {
      const j = vcol(e.output);
      if (j >= 0) a[j][ic] -= 1; // current delivered into the output node
      addV(row, e.inputs[0], 1);
      addV(row, e.inputs[1], -1);
      return;
    }
    const [p, q] = e.nodes;
    if (vcol(p) >= 0) a[vcol(p)][ic] += 1;
    if (vcol(q) >= 0) a[vcol(q)][ic] -= 1;
    switch (e.kind) {
      case "resistor": // V - R I = 0
        addV(row, p, 1);
        addV(row, q, -1);
        a[row][ic] -= value(e);
        break;
      case "inductor":
        addV(row, p, 1);
        addV(row, q, -1);
        a[row][ic] -= s * value(e);
        break;
      case "conductance":
      case "capacitor": {
        const y = e.kind === "capacitor" ? s * value(e) : value(e);
        a[row][ic] += 1;
        addV(row, p, -y);
        addV(row, q, y);
        break;
      }
      case "voltage":
      case "current": {
        // V(p) − V(q) (or the element's current) − Σ gain·control = independent part, zeroed for the test source.
        const source = linearParts(e.value, point);
        if (e.kind === "voltage") {
          addV(row, p, 1);
          addV(row, q, -1);
        } else a[row][ic] += 1;
        for (const { control, gain } of source.controls) {
          if (control.word === "across") {
            addV(row, control.args[0], -gain);
            addV(row, control.args[1], gain);
          }
          else a[row][idx.get(control.args[0])!] -= gain;
        }
        b[row] = mode === "test" ? 0 : source.independent;
        break;
      }
    }
  });
  if (mode === "test") {
    if (vcol(net.port.plus) >= 0) b[vcol(net.port.plus)] += 1;
    if (vcol(net.port.minus) >= 0) b[vcol(net.port.minus)] -= 1;
  }
  const x = gauss(a, b);
  if (!x) return null;
  if (mode === "short") return x[idx.get("__short")!];
  const v = (name: string) => (vcol(name) >= 0 ? x[vcol(name)] : 0);
  return v(net.port.plus) - v(net.port.minus);
}

function symbolsOf(net: NetworkInput): string[] {
  const out = new Set<string>(["s"]);
  for (const e of net.elements) if ("value" in e) for (const m of e.value.replace(CONTROL, "").matchAll(/(?<![\d.])[A-Za-z_][A-Za-z0-9_]*/g)) out.add(m[0]);
  return [...out];
}

const close = (x: number, y: number) => Math.abs(x - y) <= 1e-6 * Math.max(1, Math.abs(x), Math.abs(y));

describe("exact results against a floating-point tableau solve", () => {
  it("agree at random points for random networks of every element kind", () => {
    let compared = 0;
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 2 ** 31 - 1 }),
        fc.constantFrom(...ELEMENT_KINDS),
        fc.boolean(),
        fc.boolean(),
        (seed, force, reactive, numbers) => {
          const rand = mulberry32(seed);
          const net = randomNetwork(rand, { force, reactive, numbers });
          const ours = solveNetwork(net, { steps: false, sensitivities: false, dimensions: false });
          const point: Record<string, number> = {};
          for (const sym of symbolsOf(net)) point[sym] = Number((0.5 + 1.5 * rand()).toFixed(4));
          for (const [name, mode] of [
            ["vth", "open"],
            ["rth", "test"],
            ["isc", "short"],
          ] as const) {
            const reference = tableauPort(net, point, mode);
            const exact = ours[name];
            if (exact === null) {
              // Where the exact solve finds no result, the float system must be singular too.
              expect(reference, `${name} exists numerically but not exactly: ${JSON.stringify(net)}`).toBeNull();
              continue;
            }
            if (reference === null) continue; // singular at this point only (a removable case)
            const value = evaluate(exact.infix, point);
            expect(close(value, reference), `${name}: exact ${value} vs float ${reference} for ${JSON.stringify(net)}`).toBe(true);
            compared++;
          }
        },
      ),
      { numRuns: 150, seed: 20240611 },
    );
    expect(compared).toBeGreaterThan(200);
  }, 60_000); // a bounded run count, not a speed target: generous so a loaded CI machine does not fail it
});
