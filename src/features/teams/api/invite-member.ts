import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { Role } from "@/types/api";

export function inviteMember({ teamId, ...input }: { teamId: string; email: string; role: Role }) {
  return api<unknown>(`/teams/${encodeURIComponent(teamId)}/invitations`, { method: "POST", json: input });
}

export function useInviteMember() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: inviteMember,
    onSuccess: (_data, { teamId }) => queryClient.invalidateQueries({ queryKey: ["teams", teamId, "members"] }),
  });
}
