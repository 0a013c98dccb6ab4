// Structural checks of a network that need no algebra: names, port, controls.

import type { Diagnostic, Network } from "../types";
import { diagnostic } from "./diagnostics";
import { elementNodes, isControlled, isVoltageControlled } from "./elements";

export function checkStructure(network: Network): Diagnostic[] {
  const out: Diagnostic[] = [];
  const { elements, port, ground } = network;
  if (elements.length === 0) {
    out.push(diagnostic("empty-network", "the network has no elements; add at least one element between the port nodes"));
    return out;
  }

  const byName = new Map<string, number>();
  elements.forEach((e, i) => {
    const prev = byName.get(e.name);
    if (prev !== undefined) {
      out.push(
        diagnostic("duplicate-name", `two elements are named "${e.name}" (entries ${prev + 1} and ${i + 1}); names must be unique`, {
          elements: [e.name],
          path: ["elements", i, "name"],
        }),
      );
    } else byName.set(e.name, i);
  });

  const nodes = new Set<string>([ground]);
  for (const e of elements) for (const n of elementNodes(e)) nodes.add(n);

  for (const which of ["plus", "minus"] as const) {
    const n = port[which];
    if (!nodes.has(n)) {
      out.push(
        diagnostic("port-unknown-node", `the port's ${which} terminal "${n}" is not a node of any element`, {
          nodes: [n],
          path: ["port", which],
        }),
      );
    }
  }
  if (port.plus === port.minus) {
    out.push(
      diagnostic("port-same-node", `both port terminals are node "${port.plus}"; a port needs two different nodes`, {
        nodes: [port.plus],
        path: ["port"],
      }),
    );
  }

  elements.forEach((e, i) => {
    if (!isControlled(e)) return;
    const c = e.control;
    const voltageControlled = isVoltageControlled(e.kind);
    if ("element" in c) {
      if (voltageControlled) {
        out.push(
          diagnostic(
            "control-kind-mismatch",
            `"${e.name}" is a ${e.kind}, controlled by a voltage; give it across(<node>, <node>), or make it a ${e.kind === "vcvs" ? "ccvs" : "cccs"} to use the current of "${c.element}"`,
            { elements: [e.name], path: ["elements", i, "control"] },
          ),
        );
        return;
      }
      if (c.element === e.name) {
        out.push(
          diagnostic("control-self", `"${e.name}" is controlled by its own current; a source cannot set its own controlling variable`, {
            elements: [e.name],
            path: ["elements", i, "control", "element"],
          }),
        );
        return;
      }
      const j = byName.get(c.element);
      if (j === undefined) {
        out.push(
          diagnostic("control-missing-element", `"${e.name}" is controlled by the current of "${c.element}", but no element has that name`, {
            elements: [e.name],
            path: ["elements", i, "control", "element"],
          }),
        );
        return;
      }
      if (elements[j].kind === "opamp") {
        out.push(
          diagnostic(
            "control-unsupported",
            `"${e.name}" is controlled by the current of op-amp "${c.element}", which has no single reference current; control it by the current of an element in the output path instead`,
            { elements: [e.name, c.element], path: ["elements", i, "control", "element"] },
          ),
        );
      }
    } else {
      if (!voltageControlled) {
        out.push(
          diagnostic(
            "control-kind-mismatch",
            `"${e.name}" is a ${e.kind}, controlled by a current; give it through(<element>), or make it a ${e.kind === "ccvs" ? "vcvs" : "vccs"} to use the voltage across(${c.nodes[0]}, ${c.nodes[1]})`,
            { elements: [e.name], path: ["elements", i, "control"] },
          ),
        );
        return;
      }
      for (const n of c.nodes) {
        if (!nodes.has(n)) {
          out.push(
            diagnostic("control-unknown-node", `"${e.name}" is controlled across node "${n}", which no element touches`, {
              elements: [e.name],
              nodes: [n],
              path: ["elements", i, "control", "nodes"],
            }),
          );
        }
      }
    }
  });
  return out;
}
