import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";

export function acceptInvitation({ token }: { token: string }) {
  return api<{ team: { id: string; name: string; role: string } }>(`/invitations/${encodeURIComponent(token)}/accept`, { method: "POST" });
}

export function useAcceptInvitation() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: acceptInvitation, onSuccess: () => queryClient.invalidateQueries({ queryKey: ["me"] }) });
}
