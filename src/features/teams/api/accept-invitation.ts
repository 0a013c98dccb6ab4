import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { AcceptedInvitation } from "@/lib/api-contract";

function acceptInvitation({ token }: { token: string }) {
  return api<AcceptedInvitation>(`/invitations/${encodeURIComponent(token)}/accept`, { method: "POST" });
}

export function useAcceptInvitation() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: acceptInvitation, onSuccess: () => queryClient.invalidateQueries({ queryKey: ["me"] }) });
}
