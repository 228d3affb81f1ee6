import { useMutation, useQueryClient } from "@tanstack/react-query";
import { apiPaths } from "@/config/paths";
import { api } from "@/lib/api-client";
import { queryKeys } from "@/lib/query-keys";
import { getUsersQueryOptions } from "@/features/admin/api/get-users";

/** Deletes a project that holds no work yet; the server answers 409 (with counts) when it does. */
export function deleteProject(projectId: string): Promise<void> {
  return api.delete<void>(apiPaths.projects.detail(projectId));
}

export function useDeleteProject({ onSuccess }: { onSuccess?: () => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteProject,
    onSuccess: async (_data, projectId) => {
      queryClient.removeQueries({ queryKey: queryKeys.projects.detail(projectId) });
      queryClient.removeQueries({ queryKey: queryKeys.projects.members(projectId) });
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: queryKeys.projects.list() }),
        queryClient.invalidateQueries({ queryKey: getUsersQueryOptions().queryKey }),
      ]);
      onSuccess?.();
    },
  });
}
