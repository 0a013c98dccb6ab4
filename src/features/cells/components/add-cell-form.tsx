import { useMemo, useState } from "react";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { InlineError } from "@/components/ui/states";
import { NetlistEditor, editorDiagnostics } from "@/features/network-editor";
import { ApiError } from "@/lib/api-client";
import type { CellDefinition } from "@/lib/engine-netlist";
import type { Diagnostic } from "@/lib/api-contract";
import { useCreateTeamCell } from "../api/create-team-cell";
import { lineOfDiagnostic, readCellForm, type CellFormInput } from "../lib/cell-form";

const EMPTY: CellFormInput = { id: "", title: "", terminals: "", symbols: "", elements: "" };

const ELEMENTS_HINT = "# one element a line; node 0 is the network's ground\nupper resistor t m = Ra\nlower resistor m 0 = Rb";

interface Sent {
  definition: CellDefinition;
  elements: string;
  lines: ReadonlyMap<string, number>;
}

// Editors and owners add a cell from netlist lines; the server's verdict stays beside the form, and the form keeps what was typed.
export function AddCellForm({ teamId }: { teamId: string }) {
  const create = useCreateTeamCell();
  const [form, setForm] = useState<CellFormInput>(EMPTY);
  const [sent, setSent] = useState<Sent | null>(null);
  const [saved, setSaved] = useState<string | null>(null);
  const read = useMemo(() => readCellForm(form), [form]);
  const set = (key: keyof CellFormInput) => (value: string) => {
    setSaved(null);
    setForm((f) => ({ ...f, [key]: value }));
  };

  const refusal = create.error instanceof ApiError && (create.error.code === "invalid_cell" || create.error.code === "cell_name_taken") ? create.error : null;
  const idTaken = refusal?.code === "cell_name_taken" ? refusal.message : undefined;
  const serverDiagnostics = (refusal?.diagnostics ?? []).map((d): Diagnostic => ({ ...d, line: sent ? lineOfDiagnostic(d, sent.definition, sent.lines) : undefined }));
  // Lines are only marked while the text is the one the server judged.
  const marked = sent?.elements === form.elements ? serverDiagnostics.filter((d) => d.line !== undefined) : [];
  const ready = read.definition !== null && form.id.trim() !== "" && form.title.trim() !== "" && read.definition.terminals.length > 0;

  return (
    <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_minmax(0,22rem)]">
      <form
        aria-label="Add a cell"
        className="space-y-3"
        onSubmit={(event) => {
          event.preventDefault();
          if (!ready || !read.definition) return;
          const definition = read.definition;
          setSent({ definition, elements: form.elements, lines: read.lines });
          create.mutate(
            { teamId, definition },
            {
              onSuccess: (cell) => {
                setForm(EMPTY);
                setSaved(cell.id);
              },
            },
          );
        }}
      >
        <h3 className="text-sm font-semibold">Add a cell</h3>
        <div className="grid gap-3 sm:grid-cols-2">
          <TextField
            label="Cell id"
            required
            value={form.id}
            onChange={(e) => set("id")(e.target.value)}
            error={idTaken}
            hint="Letters, digits, underscore, hyphen. A network places it by this id."
            placeholder="e.g. bias-divider"
            spellCheck={false}
          />
          <TextField label="Cell name" required value={form.title} onChange={(e) => set("title")(e.target.value)} placeholder="e.g. Bias divider for the sensor input" />
          <TextField
            label="Terminals"
            required
            value={form.terminals}
            onChange={(e) => set("terminals")(e.target.value)}
            hint="Comma-separated node names the network connects; not 0, which is the ground."
            placeholder="e.g. t, m"
            spellCheck={false}
          />
          <TextField
            label="Symbols"
            value={form.symbols}
            onChange={(e) => set("symbols")(e.target.value)}
            hint={
              form.symbols.trim() === "" ? (
                <>Leave empty to take them from the values{read.symbols.length > 0 ? <>: <span className="font-mono">{read.symbols.join(", ")}</span></> : "."}</>
              ) : (
                "Comma-separated; an instance may rename each one."
              )
            }
            placeholder="from the values"
            spellCheck={false}
          />
        </div>
        <NetlistEditor
          label="Elements (netlist lines)"
          value={form.elements}
          onChange={set("elements")}
          diagnostics={editorDiagnostics([...read.diagnostics, ...marked])}
        />
        {form.elements.trim() === "" && (
          <p className="text-xs text-ink/60">
            For example:
            <code className="mt-1 block whitespace-pre font-mono text-[12px] text-ink/70">{ELEMENTS_HINT}</code>
          </p>
        )}
        <div className="flex flex-wrap items-center gap-3">
          <Button type="submit" variant="primary" disabled={create.isPending || !ready}>
            {create.isPending ? "Saving…" : "Add cell"}
          </Button>
          {saved && (
            <p role="status" className="text-xs text-verdigris">
              Cell {saved} added. Place it with <code className="font-mono">{`<name> cell ${saved} <terminal>=<node> …`}</code>
            </p>
          )}
          {!refusal && <InlineError error={create.error} />}
        </div>
      </form>
      <aside aria-label="Cell check" className="text-sm">
        {refusal ? (
          <div role="alert" className="rounded border border-signal/40 bg-signal/5 px-4 py-3">
            <p className="font-medium text-signal">{refusal.code === "cell_name_taken" ? "That id is taken" : "The server refused this cell"}</p>
            <p className="mt-1 text-ink/80">{refusal.message}</p>
            {serverDiagnostics.length > 0 && (
              <ul className="mt-2 space-y-1.5" aria-label="Diagnostics">
                {serverDiagnostics.map((d, i) => (
                  <li key={i} className="border-l-2 border-signal/60 pl-2 text-xs leading-relaxed">
                    {d.line !== undefined && <span className="mr-1 font-mono text-ink/60">line {d.line}</span>}
                    <span data-diagnostic-code={d.code}>{d.message}</span>
                  </li>
                ))}
              </ul>
            )}
            <p className="mt-2 text-xs text-ink/60">What you typed is kept; correct it and add the cell again.</p>
          </div>
        ) : (
          <div className="rounded border border-rule px-4 py-3 text-xs leading-relaxed text-ink/70">
            <p className="font-medium text-ink">How a cell is checked</p>
            <p className="mt-1">
              Each line is an element, <code className="font-mono">name kind node node = value</code>. Its nodes are the terminals, 0 for the ground, or
              nodes of its own. Every terminal has to be on an element. The server checks the values and names before it keeps the cell.
            </p>
            {read.diagnostics.length > 0 && <p className="mt-2 text-signal">{read.diagnostics.length === 1 ? "One line" : `${read.diagnostics.length} lines`} to correct, marked in the elements.</p>}
          </div>
        )}
      </aside>
    </div>
  );
}
