import { queryOptions, useQuery } from "@tanstack/react-query";
import type { ProjectCriteriaVersionDto } from "@shared/schemas/criteria";
import { apiPaths } from "@/config/paths";
import { api } from "@/lib/api-client";
import { queryKeys } from "@/lib/query-keys";

/** Every saved version of the project's criteria, newest first. */
export function getCriteriaHistory(projectId: string, signal?: AbortSignal): Promise<ProjectCriteriaVersionDto[]> {
  return api.get<ProjectCriteriaVersionDto[]>(apiPaths.projects.criteriaHistory(projectId), { signal });
}

export function getCriteriaHistoryQueryOptions(projectId: string) {
  return queryOptions({
    queryKey: queryKeys.criteria.history(projectId),
    queryFn: ({ signal }) => getCriteriaHistory(projectId, signal),
  });
}

export function useCriteriaHistory(projectId: string, options: { enabled?: boolean } = {}) {
  return useQuery({ ...getCriteriaHistoryQueryOptions(projectId), enabled: options.enabled ?? true });
}
