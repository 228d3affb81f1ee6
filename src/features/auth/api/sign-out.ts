import { useMutation, useQueryClient } from "@tanstack/react-query";
import { apiPaths } from "@/config/paths";
import { api } from "@/lib/api-client";
import { queryKeys } from "@/lib/query-keys";

export function signOut(): Promise<void> {
  return api.post<void>(apiPaths.auth.signOut, undefined, { redirectOnUnauthorized: false });
}

/** Ends the session on the server, then forgets every cached answer so nothing outlives the session. */
export function useSignOut({ onSuccess }: { onSuccess?: () => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    onSuccess: () => {
      // Mark the session gone first, so the sign-in page's check sees it, then drop everything else.
      queryClient.setQueryData(queryKeys.me(), null);
      queryClient.removeQueries({ predicate: (query) => query.queryKey[0] !== queryKeys.me()[0] });
      onSuccess?.();
    },
  });
}
