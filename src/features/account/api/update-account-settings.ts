import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { SettingsAnswer, SettingsRequest } from "@/lib/api-contract";

function updateAccountSettings(settings: SettingsRequest) {
  return api<SettingsAnswer>("/me/settings", { method: "PATCH", json: settings });
}

export function useUpdateAccountSettings() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: updateAccountSettings, onSuccess: () => queryClient.invalidateQueries({ queryKey: ["me"] }) });
}
