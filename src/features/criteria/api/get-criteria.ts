import { queryOptions, useQuery } from "@tanstack/react-query";
import type { ProjectCriteriaDto } from "@shared/schemas/criteria";
import { apiPaths } from "@/config/paths";
import { api } from "@/lib/api-client";
import { queryKeys } from "@/lib/query-keys";

/** The project's current design wind and acceptance criteria, evaluated by the server (v_m, required speeds). */
export function getCriteria(projectId: string, signal?: AbortSignal): Promise<ProjectCriteriaDto> {
  return api.get<ProjectCriteriaDto>(apiPaths.projects.criteria(projectId), { signal });
}

export function getCriteriaQueryOptions(projectId: string) {
  return queryOptions({
    queryKey: queryKeys.criteria.detail(projectId),
    queryFn: ({ signal }) => getCriteria(projectId, signal),
  });
}

export function useCriteria(projectId: string) {
  return useQuery(getCriteriaQueryOptions(projectId));
}
