import { queryOptions, useQuery } from "@tanstack/react-query";
import type { ProjectMember } from "@shared/schemas/projects";
import { apiPaths } from "@/config/paths";
import { api } from "@/lib/api-client";
import { queryKeys } from "@/lib/query-keys";

export function getProjectMembers(projectId: string, signal?: AbortSignal): Promise<ProjectMember[]> {
  return api.get<ProjectMember[]>(apiPaths.projects.members(projectId), { signal });
}

export function getProjectMembersQueryOptions(projectId: string) {
  return queryOptions({
    queryKey: queryKeys.projects.members(projectId),
    queryFn: ({ signal }) => getProjectMembers(projectId, signal),
  });
}

export function useProjectMembers(projectId: string) {
  return useQuery(getProjectMembersQueryOptions(projectId));
}
