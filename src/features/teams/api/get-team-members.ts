import { queryOptions, useQuery } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { MemberList } from "@/lib/api-contract";

function getTeamMembers(teamId: string) {
  return api<MemberList>(`/teams/${encodeURIComponent(teamId)}/members`).then((body) => body.members);
}

const teamMembersQueryOptions = (teamId: string) =>
  queryOptions({ queryKey: ["teams", teamId, "members"], queryFn: () => getTeamMembers(teamId) });

export function useTeamMembers(teamId: string | undefined) {
  return useQuery({ ...teamMembersQueryOptions(teamId ?? ""), enabled: Boolean(teamId) });
}
