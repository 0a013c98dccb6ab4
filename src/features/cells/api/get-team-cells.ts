import { queryOptions, useQuery } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { CellDefinition } from "@/lib/engine-netlist";

export interface TeamCell {
  /** The id a network's cell instance names. */
  id: string;
  teamId: string;
  title: string;
  definition: CellDefinition;
  author: { id: string; name: string } | null;
  createdAt: string;
  updatedAt: string;
}

export async function getTeamCells(teamId: string): Promise<TeamCell[]> {
  const body = await api<{ cells: TeamCell[] }>(`/teams/${encodeURIComponent(teamId)}/cells`);
  return body.cells;
}

export const teamCellsQueryOptions = (teamId: string) => queryOptions({ queryKey: ["teams", teamId, "cells"], queryFn: () => getTeamCells(teamId) });

/** The team's own cells for the drawing's palette; nothing while there is no team. */
export function useTeamCells(teamId: string | undefined) {
  return useQuery({ ...teamCellsQueryOptions(teamId ?? ""), enabled: Boolean(teamId) });
}
