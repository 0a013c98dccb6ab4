import { ELEMENT_KINDS, type Element, type ElementKind, type EngineNetwork } from "@/lib/engine-netlist";
import { Button } from "@/components/ui/button";

const cell = "w-full min-w-0 rounded border border-transparent bg-transparent px-1 py-0.5 font-mono text-xs hover:border-rule focus:border-copper focus:bg-white focus:outline-none";

// The option text is the netlist's own word for the kind, so table and text read alike.
const KIND_MEANING: Record<ElementKind, string> = {
  resistor: "resistor",
  conductance: "conductance",
  capacitor: "capacitor, impedance 1/(sC)",
  inductor: "inductor, impedance sL",
  voltage: "voltage source; a value naming across(…) or through(…) makes it a controlled source",
  current: "current source; a value naming across(…) or through(…) makes it a controlled source",
  opamp: "ideal op-amp (nullor)",
};

// Changing the kind keeps name and nodes and fills in what the new kind needs.
function rekind(e: Element, kind: ElementKind): Element {
  const nodes: [string, string] = e.kind === "opamp" ? [e.output, "0"] : e.nodes;
  const value = e.kind === "opamp" ? "1" : e.value;
  if (kind === "opamp") return { name: e.name, kind, inputs: ["p", "n"], output: nodes[0] };
  return { name: e.name, kind, nodes, value };
}

function nextName(network: EngineNetwork): string {
  const names = new Set(network.elements.map((e) => e.name));
  for (let i = 1; ; i += 1) if (!names.has(`part${i}`)) return `part${i}`;
}

// The element table form: one row per element, kept in step with the text (edits here rewrite the text).
export function ElementTable({
  network,
  onChange,
  readOnly,
}: {
  network: EngineNetwork | null;
  onChange: (network: EngineNetwork) => void;
  readOnly: boolean;
}) {
  if (!network) {
    return <p className="text-sm text-ink/70">The table follows the text once the text reads without errors.</p>;
  }
  const update = (index: number, element: Element) =>
    onChange({ ...network, elements: network.elements.map((e, i) => (i === index ? element : e)) });
  const remove = (index: number) => onChange({ ...network, elements: network.elements.filter((_, i) => i !== index) });
  const add = () =>
    onChange({ ...network, elements: [...network.elements, { name: nextName(network), kind: "resistor", nodes: ["a", network.ground], value: "R" }] });

  return (
    <div>
      <div className="overflow-x-auto">
        <table className="w-full table-fixed border-collapse text-xs">
          <caption className="sr-only">Elements of the network</caption>
          <thead>
            <tr className="border-b border-rule text-left text-ink/60">
              <th scope="col" className="w-[15%] py-1 font-medium">Name</th>
              <th scope="col" className="w-[18%] py-1 font-medium">Kind</th>
              <th scope="col" className="w-[22%] py-1 font-medium">Nodes</th>
              <th scope="col" className="w-[40%] py-1 font-medium" title="A source's value may name across(node, node) or through(element)">Value</th>
              <th scope="col" className="w-[5%] py-1"><span className="sr-only">Remove</span></th>
            </tr>
          </thead>
          <tbody>
            {network.elements.map((e, i) => (
              <tr key={i} className="border-b border-rule/60 align-top">
                <td className="py-0.5">
                  <input aria-label={`Name of element ${i + 1}`} className={cell} value={e.name} readOnly={readOnly} onChange={(ev) => update(i, { ...e, name: ev.target.value })} />
                </td>
                <td className="py-0.5">
                  <select aria-label={`Kind of ${e.name}`} title={KIND_MEANING[e.kind]} className={cell} value={e.kind} disabled={readOnly} onChange={(ev) => update(i, rekind(e, ev.target.value as ElementKind))}>
                    {ELEMENT_KINDS.map((k) => (
                      <option key={k} value={k} title={KIND_MEANING[k]}>
                        {k}
                      </option>
                    ))}
                  </select>
                </td>
                <td className="py-0.5">
                  {e.kind === "opamp" ? (
                    <div className="grid grid-cols-3 gap-0.5">
                      <input aria-label={`Non-inverting input of ${e.name}`} title="non-inverting input" className={cell} value={e.inputs[0]} readOnly={readOnly} onChange={(ev) => update(i, { ...e, inputs: [ev.target.value, e.inputs[1]] })} />
                      <input aria-label={`Inverting input of ${e.name}`} title="inverting input" className={cell} value={e.inputs[1]} readOnly={readOnly} onChange={(ev) => update(i, { ...e, inputs: [e.inputs[0], ev.target.value] })} />
                      <input aria-label={`Output of ${e.name}`} title="output" className={cell} value={e.output} readOnly={readOnly} onChange={(ev) => update(i, { ...e, output: ev.target.value })} />
                    </div>
                  ) : (
                    <div className="grid grid-cols-2 gap-0.5">
                      <input aria-label={`First node of ${e.name}`} className={cell} value={e.nodes[0]} readOnly={readOnly} onChange={(ev) => update(i, { ...e, nodes: [ev.target.value, e.nodes[1]] })} />
                      <input aria-label={`Second node of ${e.name}`} className={cell} value={e.nodes[1]} readOnly={readOnly} onChange={(ev) => update(i, { ...e, nodes: [e.nodes[0], ev.target.value] })} />
                    </div>
                  )}
                </td>
                <td className="py-0.5">
                  {e.kind === "opamp" ? (
                    <span className="px-1 text-ink/40">none</span>
                  ) : (
                    <input aria-label={`Value of ${e.name}`} className={cell} value={e.value} readOnly={readOnly} onChange={(ev) => update(i, { ...e, value: ev.target.value })} />
                  )}
                </td>
                <td className="py-0.5 text-right">
                  {!readOnly && (
                    <button type="button" onClick={() => remove(i)} className="px-1 text-ink/50 hover:text-signal" aria-label={`Remove ${e.name}`}>
                      ×
                    </button>
                  )}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {!readOnly && (
        <div className="mt-2 flex items-center justify-between gap-2">
          <Button onClick={add} className="shrink-0 whitespace-nowrap">Add element</Button>
          <p className="text-[11px] text-ink/60">Edits here rewrite the text in its standard layout; comments in the text are not kept.</p>
        </div>
      )}
    </div>
  );
}
