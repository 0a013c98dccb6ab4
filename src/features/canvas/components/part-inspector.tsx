import { useState } from "react";
import type { Element } from "@/lib/engine-netlist";

const field = "w-full rounded border border-rule bg-white px-1.5 py-0.5 font-mono text-xs focus:border-copper focus:outline-none";

// The selected part's name, value and control; a field takes effect on Enter or when it loses focus.
export function PartInspector({ element, nodes, elements, onChange }: { element: Element; nodes: string[]; elements: string[]; onChange: (next: Element) => void }) {
  const [draft, setDraft] = useState<Element>(element);
  const apply = (next: Element = draft) => {
    // A name must be new and spellable in the netlist, or the text would stop reading.
    const nameOk = /^[\p{L}\p{N}_]+$/u.test(next.name) && (next.name === element.name || !elements.includes(next.name));
    if (JSON.stringify(next) !== JSON.stringify(element) && nameOk) onChange(next);
  };
  const keys = { onBlur: () => apply(), onKeyDown: (e: React.KeyboardEvent) => e.key === "Enter" && apply() };
  const listId = `nodes-${element.name}`;
  return (
    <fieldset className="grid grid-cols-[auto_1fr] items-center gap-x-2 gap-y-1 rounded border border-rule bg-paper p-2 text-xs" aria-label={`Part ${element.name}`}>
      <legend className="px-1 font-medium">
        {element.name} <span className="font-normal text-ink/60">({element.kind})</span>
      </legend>
      <datalist id={listId}>
        {nodes.map((n) => (
          <option key={n} value={n} />
        ))}
      </datalist>
      <label htmlFor={`${listId}-name`}>Name</label>
      <input id={`${listId}-name`} className={field} value={draft.name} onChange={(e) => setDraft({ ...draft, name: e.target.value })} {...keys} />
      {draft.kind !== "opamp" && (
        <>
          <label htmlFor={`${listId}-value`}>{"control" in draft ? "Gain" : "Value"}</label>
          <input id={`${listId}-value`} className={field} value={draft.value} onChange={(e) => setDraft({ ...draft, value: e.target.value })} {...keys} />
        </>
      )}
      {"control" in draft && "nodes" in draft.control && (
        <>
          <span>Controlled by</span>
          <span className="flex items-center gap-1 font-mono">
            across(
            <input aria-label="Controlling node (first)" list={listId} className={`${field} w-16`} value={draft.control.nodes[0]} onChange={(e) => setDraft({ ...draft, control: { nodes: [e.target.value, (draft.control as { nodes: [string, string] }).nodes[1]] } })} {...keys} />,
            <input aria-label="Controlling node (second)" list={listId} className={`${field} w-16`} value={draft.control.nodes[1]} onChange={(e) => setDraft({ ...draft, control: { nodes: [(draft.control as { nodes: [string, string] }).nodes[0], e.target.value] } })} {...keys} />)
          </span>
        </>
      )}
      {"control" in draft && "element" in draft.control && (
        <>
          <label htmlFor={`${listId}-through`}>Controlled by</label>
          <select id={`${listId}-through`} className={field} value={draft.control.element} onChange={(e) => { const next = { ...draft, control: { element: e.target.value } }; setDraft(next); apply(next); }}>
            {elements.map((n) => (
              <option key={n} value={n}>
                through({n})
              </option>
            ))}
          </select>
        </>
      )}
      {draft.kind === "opamp" && <p className="col-span-2 text-ink/60">Ideal op-amp: inputs held equal, output referenced to ground; wire its three pins.</p>}
    </fieldset>
  );
}
