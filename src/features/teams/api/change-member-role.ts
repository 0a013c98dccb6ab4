import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { MemberList, RoleRequest } from "@/lib/api-contract";

function changeMemberRole({ teamId, userId, role }: RoleRequest & { teamId: string; userId: string }) {
  return api<MemberList>(`/teams/${encodeURIComponent(teamId)}/members/${encodeURIComponent(userId)}`, { method: "PATCH", json: { role } });
}

export function useChangeMemberRole() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: changeMemberRole,
    onSuccess: (_data, { teamId }) => queryClient.invalidateQueries({ queryKey: ["teams", teamId, "members"] }),
  });
}
