import { queryOptions, useQuery } from "@tanstack/react-query";
import { apiPaths } from "@/config/paths";
import { api } from "@/lib/api-client";
import { queryKeys } from "@/lib/query-keys";
import type { Project } from "@/types/api";

export function getProject(projectId: string, signal?: AbortSignal): Promise<Project> {
  return api.get<Project>(apiPaths.projects.detail(projectId), { signal });
}

export function getProjectQueryOptions(projectId: string) {
  return queryOptions({
    queryKey: queryKeys.projects.detail(projectId),
    queryFn: ({ signal }) => getProject(projectId, signal),
  });
}

export function useProject(projectId: string) {
  return useQuery(getProjectQueryOptions(projectId));
}
