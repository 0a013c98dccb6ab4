import { useId, useState } from "react";
import { useNavigate } from "react-router-dom";
import { Button } from "@/components/ui/button";
import { Dialog } from "@/components/ui/dialog";
import { TextField } from "@/components/ui/field";
import { ErrorState } from "@/components/ui/states";
import { ApiError } from "@/lib/api-client";
import { NETLIST_EXTENSION } from "@/lib/engine-netlist";
import { useImportNetwork } from "../api/import-network";

const MAX_BYTES = 256 * 1024;

export function ImportNetworkDialog({ teamId, open, onClose }: { teamId: string; open: boolean; onClose: () => void }) {
  const fileId = useId();
  const [file, setFile] = useState<File | null>(null);
  const [title, setTitle] = useState("");
  const importNetwork = useImportNetwork();
  const navigate = useNavigate();
  const tooLarge = file ? file.size > MAX_BYTES : false;
  const error = importNetwork.error;
  const lines = error instanceof ApiError && error.fields ? Object.entries(error.fields) : [];
  // Each diagnostic the server read in the file, with its line and column.
  const diagnostics = error instanceof ApiError ? (error.diagnostics ?? []) : [];
  return (
    <Dialog open={open} onClose={onClose} title="Import a network from a file">
      <form
        className="space-y-3"
        onSubmit={(event) => {
          event.preventDefault();
          if (file && !tooLarge) importNetwork.mutate({ teamId, file, title: title.trim() || undefined }, { onSuccess: (created) => navigate(`/networks/${created.id}`) });
        }}
      >
        <div>
          <label htmlFor={fileId} className="block text-sm font-medium">
            File
          </label>
          <input id={fileId} type="file" accept={`.json,${NETLIST_EXTENSION},.txt,application/json,text/plain`} className="mt-1 block w-full text-sm" onChange={(e) => setFile(e.target.files?.[0] ?? null)} />
          <p className="mt-1 text-xs text-ink/60">Our JSON or a Portfold netlist ({NETLIST_EXTENSION}), up to 256 kB.</p>
          {tooLarge && <p className="mt-1 text-xs text-signal">This file is larger than 256 kB.</p>}
        </div>
        <TextField label="Title (optional; taken from the file otherwise)" value={title} onChange={(e) => setTitle(e.target.value)} />
        {error && (
          <ErrorState error={error} title="The file could not be imported">
            {diagnostics.length > 0 && (
              <ul className="mt-1 max-h-48 space-y-0.5 overflow-y-auto text-xs" aria-label="Problems in the file">
                {diagnostics.map((d, i) => (
                  <li key={i} className="font-mono">
                    {d.line !== undefined ? `line ${d.line}${d.column !== undefined ? `, column ${d.column}` : ""}: ` : d.path ? `${d.path.join(".")}: ` : ""}
                    <span className="font-sans">{d.message.replace(/^line \d+(, column \d+)?:\s*/i, "")}</span>
                  </li>
                ))}
              </ul>
            )}
            {diagnostics.length === 0 && lines.length > 0 && (
              <ul className="mt-1 list-disc pl-4 text-xs">
                {lines.map(([where, message]) => (
                  <li key={where}>
                    {where}: {message}
                  </li>
                ))}
              </ul>
            )}
          </ErrorState>
        )}
        <div className="flex justify-end gap-2">
          <Button onClick={onClose}>Cancel</Button>
          <Button type="submit" variant="primary" disabled={!file || tooLarge || importNetwork.isPending}>
            {importNetwork.isPending ? "Importing…" : "Import"}
          </Button>
        </div>
      </form>
    </Dialog>
  );
}
