import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import { teamCellsQueryOptions } from "./get-team-cells";

/** Remove a team cell; revisions already solved keep its definition inside their circuit. */
function deleteTeamCell({ teamId, cellId }: { teamId: string; cellId: string }): Promise<null> {
  return api<null>(`/teams/${encodeURIComponent(teamId)}/cells/${encodeURIComponent(cellId)}`, { method: "DELETE" });
}

export function useDeleteTeamCell() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteTeamCell,
    onSuccess: (_data, { teamId }) => queryClient.invalidateQueries({ queryKey: teamCellsQueryOptions(teamId).queryKey }),
  });
}
