import { useMutation, useQueryClient } from "@tanstack/react-query";
import { apiPaths } from "@/config/paths";
import { api } from "@/lib/api-client";
import { invalidateMembership } from "@/features/admin/api/set-member";

export function removeMember({ projectId, userId }: { projectId: string; userId: string }): Promise<void> {
  return api.delete<void>(apiPaths.projects.member(projectId, userId));
}

export function useRemoveMember() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: removeMember,
    onSuccess: (_data, { projectId }) => invalidateMembership(queryClient, projectId),
  });
}
