import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { Team, TeamChangesRequest } from "@/lib/api-contract";

function updateTeam({ teamId, ...changes }: TeamChangesRequest & { teamId: string }) {
  return api<Team>(`/teams/${encodeURIComponent(teamId)}`, { method: "PATCH", json: changes });
}

export function useUpdateTeam() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateTeam,
    // The count changes how every revision of the team reads.
    onSuccess: () => Promise.all([queryClient.invalidateQueries({ queryKey: ["teams"] }), queryClient.invalidateQueries({ queryKey: ["networks"] }), queryClient.invalidateQueries({ queryKey: ["me"] })]),
  });
}
