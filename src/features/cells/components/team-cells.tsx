import { useState } from "react";
import { Button } from "@/components/ui/button";
import type { Cell } from "@/lib/api-contract";
import { EmptyState, ErrorState, InlineError, LoadingState } from "@/components/ui/states";
import { BUILT_IN_CELLS } from "@/lib/engine-netlist";
import { useDeleteTeamCell } from "../api/delete-team-cell";
import { useTeamCells } from "../api/get-team-cells";

const BUILT_IN = [...BUILT_IN_CELLS.keys()].join(", ");

// The team's own cells; editors and owners delete one after confirming (revisions solved before keep its definition).
export function TeamCells({ teamId, canEdit }: { teamId: string; canEdit: boolean }) {
  const cells = useTeamCells(teamId);
  const remove = useDeleteTeamCell();
  const [confirming, setConfirming] = useState<string | null>(null);
  if (cells.isLoading) return <LoadingState label="Loading cells…" />;
  if (cells.isError) return <ErrorState error={cells.error} title="The cells could not be loaded" />;
  const list = cells.data ?? [];
  if (list.length === 0) {
    return (
      <EmptyState title="No cells in this team yet.">
        Every network can place the built-in cells ({BUILT_IN}).{canEdit ? " Add the team's own below." : ""}
      </EmptyState>
    );
  }
  return (
    <div>
      <table className="w-full text-sm">
        <caption className="sr-only">Cells of the team</caption>
        <thead>
          <tr className="border-b border-ink/30 text-left">
            <th scope="col" className="py-1 pr-3 font-medium">Cell</th>
            <th scope="col" className="py-1 pr-3 font-medium">Title</th>
            <th scope="col" className="py-1 pr-3 font-medium">Terminals</th>
            <th scope="col" className="py-1 pr-3 font-medium">Symbols</th>
            <th scope="col" className="py-1 pr-3 font-medium">Author</th>
            {canEdit && (
              <th scope="col">
                <span className="sr-only">Delete</span>
              </th>
            )}
          </tr>
        </thead>
        <tbody>
          {list.map((cell) => (
            <CellRow
              key={cell.id}
              cell={cell}
              canEdit={canEdit}
              confirming={confirming === cell.id}
              deleting={remove.isPending && remove.variables?.cellId === cell.id}
              onAsk={() => setConfirming(cell.id)}
              onCancel={() => setConfirming(null)}
              onDelete={() => remove.mutate({ teamId, cellId: cell.id }, { onSuccess: () => setConfirming(null) })}
            />
          ))}
        </tbody>
      </table>
      <div className="mt-1">
        <InlineError error={remove.error} />
      </div>
    </div>
  );
}

function CellRow({
  cell,
  canEdit,
  confirming,
  deleting,
  onAsk,
  onCancel,
  onDelete,
}: {
  cell: Cell;
  canEdit: boolean;
  confirming: boolean;
  deleting: boolean;
  onAsk: () => void;
  onCancel: () => void;
  onDelete: () => void;
}) {
  const { terminals, symbols } = cell.definition;
  return (
    <tr className="border-b border-rule align-top" data-cell={cell.id}>
      <td className="py-1.5 pr-3 font-mono text-[13px]">{cell.id}</td>
      <td className="py-1.5 pr-3">{cell.title || <span className="text-ink/50">untitled</span>}</td>
      <td className="py-1.5 pr-3 font-mono text-[13px]">{terminals.join(", ")}</td>
      <td className="py-1.5 pr-3 font-mono text-[13px]">{symbols.length > 0 ? symbols.join(", ") : <span className="font-sans text-ink/50">none</span>}</td>
      <td className="py-1.5 pr-3">{cell.author?.name ?? <span className="text-ink/50">former member</span>}</td>
      {canEdit && (
        <td className="py-1 text-right">
          {confirming ? (
            <span role="group" aria-label={`Delete cell ${cell.id}?`} className="inline-flex flex-wrap items-center justify-end gap-2">
              <span className="text-xs text-ink/70">Delete {cell.id}? New solves of networks placing it will fail.</span>
              <Button variant="danger" className="px-2 py-0.5 text-xs" onClick={onDelete} disabled={deleting} autoFocus>
                {deleting ? "Deleting…" : "Delete"}
              </Button>
              <Button variant="quiet" className="px-2 py-0.5 text-xs" onClick={onCancel} disabled={deleting}>
                Keep
              </Button>
            </span>
          ) : (
            <button type="button" className="text-xs text-ink/60 hover:text-signal" onClick={onAsk} aria-label={`Delete cell ${cell.id}`}>
              Delete
            </button>
          )}
        </td>
      )}
    </tr>
  );
}
