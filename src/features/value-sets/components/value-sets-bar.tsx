import { useId, useState } from "react";
import { Button } from "@/components/ui/button";
import { InlineError } from "@/components/ui/states";
import type { ValueSet } from "@/lib/api-contract";
import { useDeleteValueSet } from "../api/delete-value-set";
import { useSaveValueSet } from "../api/save-value-set";

// Named value sets of the network: choose one to fill Values; editors save what is typed under a name.
export function ValueSetsBar({
  networkId,
  sets,
  canSave,
  values,
  onChoose,
}: {
  networkId?: string;
  sets: ValueSet[];
  canSave: boolean;
  values: Record<string, string>;
  onChoose: (values: Record<string, string>) => void;
}) {
  const selectId = useId();
  const [chosen, setChosen] = useState("");
  const [name, setName] = useState("");
  const save = useSaveValueSet();
  const remove = useDeleteValueSet();
  const typed = Object.fromEntries(Object.entries(values).filter(([, v]) => v.trim() !== ""));
  const current = sets.find((s) => s.id === chosen);
  if (sets.length === 0 && !canSave) return null;
  return (
    <div className="mb-3 space-y-1.5 rounded border border-rule bg-white/40 p-2 text-xs" aria-label="Value sets">
      {sets.length > 0 && (
        <div className="flex flex-wrap items-end gap-2">
          <div className="min-w-0 flex-1">
            <label htmlFor={selectId} className="block font-medium">
              Value set
            </label>
            <select
              id={selectId}
              value={chosen}
              onChange={(e) => {
                setChosen(e.target.value);
                const set = sets.find((s) => s.id === e.target.value);
                if (set) {
                  onChoose(set.values);
                  setName(set.name);
                }
              }}
              className="mt-0.5 w-full rounded border border-rule bg-white px-1.5 py-1"
            >
              <option value="">— choose a saved set —</option>
              {sets.map((s) => (
                <option key={s.id} value={s.id}>
                  {s.name} ({Object.keys(s.values).length} values)
                </option>
              ))}
            </select>
          </div>
          {canSave && networkId && current && (
            <button type="button" className="pb-1 text-ink/60 hover:text-signal" onClick={() => remove.mutate({ networkId, setId: current.id }, { onSuccess: () => setChosen("") })}>
              Delete
            </button>
          )}
        </div>
      )}
      {canSave && networkId && (
        <form
          className="flex flex-wrap items-end gap-2"
          onSubmit={(event) => {
            event.preventDefault();
            if (name.trim() && Object.keys(typed).length > 0) save.mutate({ networkId, name: name.trim(), values: typed }, { onSuccess: (set) => setChosen(set.id) });
          }}
        >
          <label className="min-w-0 flex-1">
            <span className="block font-medium">Save these values as</span>
            <input value={name} maxLength={80} onChange={(e) => setName(e.target.value)} placeholder="e.g. nominal" className="mt-0.5 w-full rounded border border-rule bg-white px-1.5 py-1" />
          </label>
          <Button type="submit" className="px-2 py-1 text-xs" disabled={!name.trim() || Object.keys(typed).length === 0 || save.isPending}>
            {save.isPending ? "Saving…" : "Save set"}
          </Button>
        </form>
      )}
      <InlineError error={save.error ?? remove.error} />
    </div>
  );
}
