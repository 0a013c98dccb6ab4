import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";

function signOut() {
  return api<null>("/auth/logout", { method: "POST" });
}

export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    onSuccess: () => {
      queryClient.clear();
    },
  });
}
