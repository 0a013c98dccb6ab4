import { queryOptions, useQuery } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { Team } from "@/lib/api-contract";

function getTeam(teamId: string) {
  return api<Team>(`/teams/${encodeURIComponent(teamId)}`);
}

const teamQueryOptions = (teamId: string) => queryOptions({ queryKey: ["teams", teamId, "settings"], queryFn: () => getTeam(teamId) });

export function useTeam(teamId: string) {
  return useQuery({ ...teamQueryOptions(teamId), enabled: Boolean(teamId) });
}
