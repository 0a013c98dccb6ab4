import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { AccountSettings } from "@/types/api";

export function updateAccountSettings(settings: AccountSettings) {
  return api<{ settings: AccountSettings }>("/me/settings", { method: "PATCH", json: settings });
}

export function useUpdateAccountSettings() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: updateAccountSettings, onSuccess: () => queryClient.invalidateQueries({ queryKey: ["me"] }) });
}
