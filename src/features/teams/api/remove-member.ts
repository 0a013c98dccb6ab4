import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";

function removeMember({ teamId, userId }: { teamId: string; userId: string }) {
  return api<null>(`/teams/${encodeURIComponent(teamId)}/members/${encodeURIComponent(userId)}`, { method: "DELETE" });
}

export function useRemoveMember() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: removeMember,
    onSuccess: (_data, { teamId }) => queryClient.invalidateQueries({ queryKey: ["teams", teamId, "members"] }),
  });
}
