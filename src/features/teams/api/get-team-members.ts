import { queryOptions, useQuery } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { Role } from "@/types/api";

export interface TeamMember {
  userId: string;
  name: string;
  email: string;
  role: Role;
}

export async function getTeamMembers(teamId: string): Promise<TeamMember[]> {
  const body = await api<TeamMember[] | { members: TeamMember[] }>(`/teams/${encodeURIComponent(teamId)}/members`);
  return Array.isArray(body) ? body : body.members;
}

export const teamMembersQueryOptions = (teamId: string) =>
  queryOptions({ queryKey: ["teams", teamId, "members"], queryFn: () => getTeamMembers(teamId) });

export function useTeamMembers(teamId: string | undefined) {
  return useQuery({ ...teamMembersQueryOptions(teamId ?? ""), enabled: Boolean(teamId) });
}
