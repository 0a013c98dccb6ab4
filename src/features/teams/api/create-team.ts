import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { Team, TeamRequest } from "@/lib/api-contract";

function createTeam(input: TeamRequest) {
  return api<Team>("/teams", { method: "POST", json: input });
}

export function useCreateTeam() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: createTeam, onSuccess: () => queryClient.invalidateQueries({ queryKey: ["me"] }) });
}
