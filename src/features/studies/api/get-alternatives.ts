import { queryOptions, useQuery } from "@tanstack/react-query";
import type { AlternativeDto } from "@shared/schemas/alternatives";
import { apiPaths } from "@/config/paths";
import { api } from "@/lib/api-client";
import { queryKeys } from "@/lib/query-keys";

export function getAlternatives(projectId: string, signal?: AbortSignal): Promise<AlternativeDto[]> {
  return api.get<AlternativeDto[]>(apiPaths.projects.alternatives(projectId), { signal });
}

export function getAlternativesQueryOptions(projectId: string) {
  return queryOptions({
    queryKey: queryKeys.alternatives.list(projectId),
    queryFn: ({ signal }) => getAlternatives(projectId, signal),
  });
}

export function useAlternatives(projectId: string) {
  return useQuery(getAlternativesQueryOptions(projectId));
}
