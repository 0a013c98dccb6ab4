import { useId } from "react";

// The port: two nodes; Vth is V(plus) − V(minus) with the port open.
export function PortPicker({ nodes, plus, minus, onChange, disabled }: { nodes: string[]; plus: string; minus: string; onChange: (plus: string, minus: string) => void; disabled: boolean }) {
  const id = useId();
  const options = (current: string) => (nodes.includes(current) || !current ? nodes : [current, ...nodes]);
  const select = "mt-0.5 w-full rounded border border-rule bg-white px-2 py-1 font-mono text-xs disabled:text-ink/50";
  return (
    <fieldset className="grid grid-cols-2 gap-2" disabled={disabled}>
      <legend className="mb-1 text-sm font-medium">
        Port <span className="font-normal text-ink/60">(two open copper terminals)</span>
      </legend>
      <div>
        <label htmlFor={`${id}-plus`} className="block text-xs">
          + terminal (node)
        </label>
        <select id={`${id}-plus`} className={select} value={plus} onChange={(e) => onChange(e.target.value, minus)}>
          {options(plus).map((n) => (
            <option key={n} value={n}>
              {n}
            </option>
          ))}
        </select>
      </div>
      <div>
        <label htmlFor={`${id}-minus`} className="block text-xs">
          − terminal (node)
        </label>
        <select id={`${id}-minus`} className={select} value={minus} onChange={(e) => onChange(plus, e.target.value)}>
          {options(minus).map((n) => (
            <option key={n} value={n}>
              {n}
            </option>
          ))}
        </select>
      </div>
    </fieldset>
  );
}
