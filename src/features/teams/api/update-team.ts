import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { TeamSettings } from "./get-team";

export function updateTeam({ teamId, ...changes }: { teamId: string; name?: string; requiredApprovals?: number }) {
  return api<TeamSettings>(`/teams/${encodeURIComponent(teamId)}`, { method: "PATCH", json: changes });
}

export function useUpdateTeam() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateTeam,
    // The count changes how every revision of the team reads.
    onSuccess: () => Promise.all([queryClient.invalidateQueries({ queryKey: ["teams"] }), queryClient.invalidateQueries({ queryKey: ["networks"] }), queryClient.invalidateQueries({ queryKey: ["me"] })]),
  });
}
