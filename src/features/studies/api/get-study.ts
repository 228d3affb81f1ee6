import { queryOptions, useQuery } from "@tanstack/react-query";
import type { StudyDto } from "@shared/schemas/studies";
import { apiPaths } from "@/config/paths";
import { api } from "@/lib/api-client";
import { queryKeys } from "@/lib/query-keys";

export function getStudy(studyId: string, signal?: AbortSignal): Promise<StudyDto> {
  return api.get<StudyDto>(apiPaths.studies.detail(studyId), { signal });
}

export function getStudyQueryOptions(studyId: string) {
  return queryOptions({
    queryKey: queryKeys.studies.detail(studyId),
    queryFn: ({ signal }) => getStudy(studyId, signal),
  });
}

export function useStudy(studyId: string) {
  return useQuery(getStudyQueryOptions(studyId));
}
