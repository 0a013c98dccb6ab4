import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";

export function createTeam(input: { name: string }) {
  return api<{ id: string; name: string }>("/teams", { method: "POST", json: input });
}

export function useCreateTeam() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: createTeam, onSuccess: () => queryClient.invalidateQueries({ queryKey: ["me"] }) });
}
