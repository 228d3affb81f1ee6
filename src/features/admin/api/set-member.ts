import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { ProjectMember } from "@shared/schemas/projects";
import { apiPaths } from "@/config/paths";
import { api } from "@/lib/api-client";
import { queryKeys } from "@/lib/query-keys";
import type { ProjectRole } from "@/types/api";
import { getUsersQueryOptions } from "@/features/admin/api/get-users";

export interface SetMemberInput {
  projectId: string;
  userId: string;
  role: ProjectRole;
}

/** Adds the user to the project with the role, or changes the role they have. */
export function setMember({ projectId, userId, role }: SetMemberInput): Promise<ProjectMember> {
  return api.put<ProjectMember>(apiPaths.projects.member(projectId, userId), { role });
}

/**
 * Membership changes show in the accounts list, the project's member list, and — when administrators change
 * their own membership — in their project list and their own record.
 */
export function invalidateMembership(queryClient: ReturnType<typeof useQueryClient>, projectId: string) {
  return Promise.all([
    queryClient.invalidateQueries({ queryKey: getUsersQueryOptions().queryKey }),
    queryClient.invalidateQueries({ queryKey: queryKeys.projects.members(projectId) }),
    queryClient.invalidateQueries({ queryKey: queryKeys.projects.list() }),
    queryClient.invalidateQueries({ queryKey: queryKeys.me() }),
  ]);
}

export function useSetMember() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: setMember,
    onSuccess: (_member, { projectId }) => invalidateMembership(queryClient, projectId),
  });
}
