import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { Role } from "@/types/api";

export function changeMemberRole({ teamId, userId, role }: { teamId: string; userId: string; role: Role }) {
  return api<unknown>(`/teams/${encodeURIComponent(teamId)}/members/${encodeURIComponent(userId)}`, { method: "PATCH", json: { role } });
}

export function useChangeMemberRole() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: changeMemberRole,
    onSuccess: (_data, { teamId }) => queryClient.invalidateQueries({ queryKey: ["teams", teamId, "members"] }),
  });
}
