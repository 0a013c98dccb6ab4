import { queryOptions, useQuery } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { CellList } from "@/lib/api-contract";

// A cell's id is the one a network's cell instance names.
function getTeamCells(teamId: string) {
  return api<CellList>(`/teams/${encodeURIComponent(teamId)}/cells`).then((body) => body.cells);
}

export const teamCellsQueryOptions = (teamId: string) => queryOptions({ queryKey: ["teams", teamId, "cells"], queryFn: () => getTeamCells(teamId) });

/** The team's own cells for the drawing's palette; nothing while there is no team. */
export function useTeamCells(teamId: string | undefined) {
  return useQuery({ ...teamCellsQueryOptions(teamId ?? ""), enabled: Boolean(teamId) });
}
