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
          <label htmlFor={`${listId}-value`}>Value</label>
          <input id={`${listId}-value`} className={field} value={draft.value} onChange={(e) => setDraft({ ...draft, value: e.target.value })} {...keys} />
          {(draft.kind === "voltage" || draft.kind === "current") && (
            <p className="col-span-2 text-ink/60">
              A source value may name its controls: across(node, node) for a voltage, through(element) for a current; nodes here: {nodes.join(", ") || "none yet"}.
            </p>
          )}
        </>
      )}
      {draft.kind === "opamp" && <p className="col-span-2 text-ink/60">Ideal op-amp: inputs held equal, output referenced to ground; wire its three pins.</p>}
    </fieldset>
  );
}
