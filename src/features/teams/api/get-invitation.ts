import { queryOptions, useQuery } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { InvitationPreview } from "@/lib/api-contract";

// Readable without an account, so the invited person sees what they are joining before signing in.
function getInvitation(token: string) {
  return api<InvitationPreview>(`/invitations/${encodeURIComponent(token)}`);
}

const invitationQueryOptions = (token: string) =>
  queryOptions({ queryKey: ["invitations", token], queryFn: () => getInvitation(token), retry: false });

export function useInvitation(token: string) {
  return useQuery({ ...invitationQueryOptions(token), enabled: Boolean(token) });
}
