import { queryOptions, useQuery } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { Role } from "@/types/api";

export interface TeamSettings {
  id: string;
  name: string;
  personal: boolean;
  role: Role;
  requiredApprovals: number;
}

export function getTeam(teamId: string) {
  return api<TeamSettings>(`/teams/${encodeURIComponent(teamId)}`);
}

export const teamQueryOptions = (teamId: string) => queryOptions({ queryKey: ["teams", teamId, "settings"], queryFn: () => getTeam(teamId) });

export function useTeam(teamId: string) {
  return useQuery({ ...teamQueryOptions(teamId), enabled: Boolean(teamId) });
}
