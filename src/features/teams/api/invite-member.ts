import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { CreatedInvitation, InvitationRequest } from "@/lib/api-contract";

function inviteMember({ teamId, ...input }: InvitationRequest & { teamId: string }) {
  return api<CreatedInvitation>(`/teams/${encodeURIComponent(teamId)}/invitations`, { method: "POST", json: input });
}

export function useInviteMember() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: inviteMember,
    onSuccess: (_data, { teamId }) => queryClient.invalidateQueries({ queryKey: ["teams", teamId, "members"] }),
  });
}
