import { queryOptions } from "@tanstack/react-query";
import type { StudyDto } from "@shared/schemas/studies";
import { apiPaths } from "@/config/paths";
import { api } from "@/lib/api-client";
import { queryKeys } from "@/lib/query-keys";

export function getAlternativeStudies(alternativeId: string, signal?: AbortSignal): Promise<StudyDto[]> {
  return api.get<StudyDto[]>(apiPaths.alternatives.studies(alternativeId), { signal });
}

export function getAlternativeStudiesQueryOptions(alternativeId: string) {
  return queryOptions({
    queryKey: queryKeys.studies.list(alternativeId),
    queryFn: ({ signal }) => getAlternativeStudies(alternativeId, signal),
  });
}
