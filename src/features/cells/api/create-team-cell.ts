import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { Cell } from "@/lib/api-contract";
import type { CellDefinition } from "@/lib/engine-netlist";
import { teamCellsQueryOptions } from "./get-team-cells";

/** Save a team cell; the server answers 400 invalid_cell with the engine's diagnostics, 409 cell_name_taken. */
function createTeamCell({ teamId, definition }: { teamId: string; definition: CellDefinition }): Promise<Cell> {
  return api<Cell>(`/teams/${encodeURIComponent(teamId)}/cells`, { method: "POST", json: { definition } });
}

export function useCreateTeamCell() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createTeamCell,
    onSuccess: (_cell, { teamId }) => queryClient.invalidateQueries({ queryKey: teamCellsQueryOptions(teamId).queryKey }),
  });
}
