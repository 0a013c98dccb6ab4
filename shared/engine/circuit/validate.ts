// Structural checks of a network that need no algebra: names, port, controls.

import type { Diagnostic, Network } from "../types";
import { diagnostic } from "./diagnostics";
import { elementNodes, sourceControls } from "./elements";

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
    const path = ["elements", i, "value"];
    for (const c of sourceControls(e)) {
      if ("element" in c) {
        if (c.element === e.name) {
          out.push(
            diagnostic("control-self", `"${e.name}" names through(${e.name}), its own current; a source cannot set its own controlling variable`, {
              elements: [e.name],
              path,
            }),
          );
          continue;
        }
        const j = byName.get(c.element);
        if (j === undefined) {
          out.push(
            diagnostic("control-missing-element", `"${e.name}" names through(${c.element}), but no element has that name`, {
              elements: [e.name],
              path,
            }),
          );
          continue;
        }
        if (elements[j].kind === "opamp") {
          out.push(
            diagnostic(
              "control-unsupported",
              `"${e.name}" names through(${c.element}), the current of op-amp "${c.element}", which has no single reference current; name the current of an element in the output path instead`,
              { elements: [e.name, c.element], path },
            ),
          );
        }
        continue;
      }
      for (const n of c.nodes) {
        if (!nodes.has(n)) {
          out.push(
            diagnostic("control-unknown-node", `"${e.name}" names across(${c.nodes[0]}, ${c.nodes[1]}), but no element touches node "${n}"`, {
              elements: [e.name],
              nodes: [n],
              path,
            }),
          );
        }
      }
    }
  });
  return out;
}
