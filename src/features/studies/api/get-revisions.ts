import { queryOptions, useQuery } from "@tanstack/react-query";
import type { RevisionSummaryDto } from "@shared/schemas/revisions";
import { apiPaths } from "@/config/paths";
import { api } from "@/lib/api-client";
import { queryKeys } from "@/lib/query-keys";

/** Every revision of a study, newest first as the API sends them (the timeline sorts by number anyway). */
export function getRevisions(studyId: string, signal?: AbortSignal): Promise<RevisionSummaryDto[]> {
  return api.get<RevisionSummaryDto[]>(apiPaths.studies.revisions(studyId), { signal });
}

export function getRevisionsQueryOptions(studyId: string) {
  return queryOptions({
    queryKey: queryKeys.studies.revisions(studyId),
    queryFn: ({ signal }) => getRevisions(studyId, signal),
    select: (rows) => [...rows].sort((a, b) => b.number - a.number),
  });
}

export function useRevisions(studyId: string) {
  return useQuery(getRevisionsQueryOptions(studyId));
}
