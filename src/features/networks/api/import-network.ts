import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { Network } from "@/lib/api-contract";

// Multipart upload of our JSON or our text netlist; the server answers with per-line diagnostics when it refuses.
function importNetwork({ teamId, file, title }: { teamId: string; file: File; title?: string }) {
  const form = new FormData();
  form.append("file", file);
  if (title) form.append("title", title);
  return api<Network>(`/teams/${encodeURIComponent(teamId)}/networks/import`, { method: "POST", body: form });
}

export function useImportNetwork() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: importNetwork,
    onSuccess: (_data, { teamId }) => queryClient.invalidateQueries({ queryKey: ["teams", teamId, "networks"] }),
  });
}
