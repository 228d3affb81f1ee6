import { queryOptions, useQuery } from "@tanstack/react-query";
import type { ComparisonDto } from "@shared/schemas/comparison";
import { apiPaths } from "@/config/paths";
import { api } from "@/lib/api-client";
import { queryKeys } from "@/lib/query-keys";

/** Latest critical speeds and margins of every study of the project, and each study's trend over revisions. */
export function getComparison(projectId: string, signal?: AbortSignal): Promise<ComparisonDto> {
  return api.get<ComparisonDto>(apiPaths.projects.comparison(projectId), { signal });
}

export function getComparisonQueryOptions(projectId: string) {
  return queryOptions({
    queryKey: queryKeys.comparison(projectId),
    queryFn: ({ signal }) => getComparison(projectId, signal),
  });
}

export function useComparison(projectId: string) {
  return useQuery(getComparisonQueryOptions(projectId));
}
