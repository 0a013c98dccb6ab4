// Networks sized for the solver's caps: a mesh whose exact solve takes long, wide ones, a trivial one.
export interface CircuitJson {
  ground: string;
  port: { plus: string; minus: string };
  elements: Record<string, unknown>[];
}

/**
 * A resistive mesh with every pair of its n nodes joined by its own symbolic resistance, driven
 * from one node: the determinant behind Rth sums over spanning trees, n^(n-2) of them for a
 * complete graph (Cayley's formula), so the exact solve grows steeply with n.
 */
export function completeMesh(n: number, tag = "g"): CircuitJson {
  const nodes = ["0", ...Array.from({ length: n - 1 }, (_, i) => `k${i + 1}`)];
  const elements: Record<string, unknown>[] = [{ name: "Drive", kind: "voltage", nodes: ["k1", "0"], value: "Vd" }];
  let count = 0;
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) {
      count += 1;
      elements.push({ name: `leg_${i}_${j}`, kind: "resistor", nodes: [nodes[i], nodes[j]], value: `${tag}${count}` });
    }
  }
  return { ground: "0", port: { plus: nodes[n - 1], minus: "0" }, elements };
}

/** A chain of `count` resistors to ground, each with the given value builder: wide but trivial to solve. */
export function resistorChain(count: number, value: (index: number) => string): CircuitJson {
  const elements: Record<string, unknown>[] = [{ name: "Source", kind: "voltage", nodes: ["t0", "0"], value: "Vs" }];
  for (let i = 1; i <= count; i++) elements.push({ name: `link${i}`, kind: "resistor", nodes: [`t${i - 1}`, `t${i}`], value: value(i) });
  return { ground: "0", port: { plus: `t${count}`, minus: "0" }, elements };
}

/**
 * A sensor seen as a source behind its own resistance, read at its terminals: Vth = Vs, Rth = Rs,
 * Isc = Vs/Rs (common practice), so no result is larger than one term over one term.
 */
export const sensorSource: CircuitJson = {
  ground: "0",
  port: { plus: "out", minus: "0" },
  elements: [
    { name: "Sensor", kind: "voltage", nodes: ["emf", "0"], value: "Vs" },
    { name: "Winding", kind: "resistor", nodes: ["emf", "out"], value: "Rs" },
  ],
};
