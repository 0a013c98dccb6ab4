import { useMemo, useState } from "react";
import { useNavigate } from "react-router-dom";
import { Button } from "@/components/ui/button";
import { Dialog } from "@/components/ui/dialog";
import { TextField } from "@/components/ui/field";
import { InlineError } from "@/components/ui/states";
import { circuitOf, looksLikeJson, readNetworkText, NetlistEditor, editorDiagnostics } from "@/features/network-editor";
import { useCreateNetwork } from "../api/create-network";
import { BLANK_NETWORK, STARTING_NETWORKS } from "../lib/starting-networks";

export function CreateNetworkDialog({ teamId, open, onClose }: { teamId: string; open: boolean; onClose: () => void }) {
  const [title, setTitle] = useState("");
  const [start, setStart] = useState(STARTING_NETWORKS[0].id);
  const [text, setText] = useState(STARTING_NETWORKS[0].netlist);
  const read = useMemo(() => readNetworkText(text), [text]);
  const create = useCreateNetwork();
  const navigate = useNavigate();
  const errors = read.diagnostics.filter((d) => d.severity === "error");
  const unplaced = errors.filter((d) => d.line === undefined);
  return (
    <Dialog open={open} onClose={onClose} title="New network" wide>
      <form
        className="space-y-3"
        onSubmit={(event) => {
          event.preventDefault();
          if (!read.network || errors.length) return;
          // Text typed as a netlist is kept as typed; JSON pasted here is stored as a circuit only.
          create.mutate({ teamId, title: title.trim(), circuit: circuitOf(read.network), netlist: looksLikeJson(text) ? null : text }, { onSuccess: (created) => navigate(`/networks/${created.id}`) });
        }}
      >
        <fieldset>
          <legend className="text-sm font-medium">Start from</legend>
          <div className="mt-1 grid gap-1.5 sm:grid-cols-2">
            {[...STARTING_NETWORKS, { id: "blank", title: "Blank network", summary: "Only the ground and the port lines.", netlist: BLANK_NETWORK }].map((option) => (
              <label key={option.id} className={`flex cursor-pointer gap-2 rounded border p-2 text-xs ${start === option.id ? "border-copper bg-copper/5" : "border-rule"}`}>
                <input
                  type="radio"
                  name="starting-network"
                  value={option.id}
                  checked={start === option.id}
                  onChange={() => {
                    setStart(option.id);
                    setText(option.netlist);
                    if (!title.trim() || [...STARTING_NETWORKS].some((n) => n.title === title)) setTitle(option.id === "blank" ? "" : option.title);
                  }}
                  className="mt-0.5 accent-copper"
                />
                <span>
                  <span className="block font-medium text-ink">{option.title}</span>
                  <span className="text-ink/70">{option.summary}</span>
                </span>
              </label>
            ))}
          </div>
        </fieldset>
        <TextField label="Title" required value={title} onChange={(e) => setTitle(e.target.value)} maxLength={200} placeholder="e.g. Bridge amplifier output stage" />
        <NetlistEditor label="Network (Portfold netlist or our JSON)" value={text} onChange={setText} diagnostics={editorDiagnostics(read.diagnostics)} />
        {unplaced.map((d, i) => (
          <p key={i} className="text-xs text-signal">
            {d.message}
          </p>
        ))}
        <InlineError error={create.error} />
        <div className="flex justify-end gap-2">
          <Button onClick={onClose}>Cancel</Button>
          <Button type="submit" variant="primary" disabled={create.isPending || !read.network || errors.length > 0 || !title.trim()}>
            {create.isPending ? "Creating…" : "Create network"}
          </Button>
        </div>
      </form>
    </Dialog>
  );
}
