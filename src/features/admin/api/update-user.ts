import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { AdminUser, UserPatch } from "@shared/schemas/users";
import { apiPaths } from "@/config/paths";
import { api } from "@/lib/api-client";
import { queryKeys } from "@/lib/query-keys";
import { getUsersQueryOptions } from "@/features/admin/api/get-users";

export function updateUser(userId: string, patch: UserPatch): Promise<AdminUser> {
  return api.patch<AdminUser>(apiPaths.users.detail(userId), patch);
}

/** Renames an account or sets its administrator flag; the signed-in user's own record is re-read too. */
export function useUpdateUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ userId, patch }: { userId: string; patch: UserPatch }) => updateUser(userId, patch),
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: getUsersQueryOptions().queryKey }),
        queryClient.invalidateQueries({ queryKey: queryKeys.me() }),
      ]),
  });
}
