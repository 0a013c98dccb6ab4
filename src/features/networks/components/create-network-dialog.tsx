import { useMemo, useState } from "react";
import { useNavigate } from "react-router-dom";
import { Button } from "@/components/ui/button";
import { Dialog } from "@/components/ui/dialog";
import { TextField } from "@/components/ui/field";
import { InlineError } from "@/components/ui/states";
import { circuitOf, readNetworkText } from "@/features/network-editor/lib/netlist";
import { NetlistEditor, editorDiagnostics } from "@/features/network-editor/components/netlist-editor";
import { useCreateNetwork } from "../api/create-network";

// A starting point of our own scenario: a sensor buffer behind a finite-gain amplifier.
const STARTER = `# sensor buffer: finite-gain amplifier wired as a follower
ground 0
port out 0
Sensor voltage in 0 = Vs
Amp voltage x 0 = mu * across(in, out)
OutputRes resistor x out = R0
`;

export function CreateNetworkDialog({ teamId, open, onClose }: { teamId: string; open: boolean; onClose: () => void }) {
  const [title, setTitle] = useState("");
  const [text, setText] = useState(STARTER);
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
          create.mutate({ teamId, title: title.trim(), circuit: circuitOf(read.network) }, { onSuccess: (created) => navigate(`/networks/${created.id}`) });
        }}
      >
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
