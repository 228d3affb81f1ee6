import { queryOptions, useQuery } from "@tanstack/react-query";
import type { RevisionReviewStatusDto } from "@shared/schemas/review";
import { apiPaths } from "@/config/paths";
import { api } from "@/lib/api-client";
import { queryKeys } from "@/lib/query-keys";

/** The review state of every revision of a study, oldest first. */
export function getStudyReviewStates(studyId: string, signal?: AbortSignal): Promise<RevisionReviewStatusDto[]> {
  return api.get<RevisionReviewStatusDto[]>(apiPaths.studies.reviewStates(studyId), { signal });
}

export function getStudyReviewStatesQueryOptions(studyId: string) {
  return queryOptions({
    queryKey: queryKeys.reviews.studyStates(studyId),
    queryFn: ({ signal }) => getStudyReviewStates(studyId, signal),
  });
}

export function useStudyReviewStates(studyId: string) {
  return useQuery(getStudyReviewStatesQueryOptions(studyId));
}

/** The review state of every revision of every study of a project. */
export function getProjectReviewStates(projectId: string, signal?: AbortSignal): Promise<RevisionReviewStatusDto[]> {
  return api.get<RevisionReviewStatusDto[]>(apiPaths.projects.reviewStates(projectId), { signal });
}

export function getProjectReviewStatesQueryOptions(projectId: string) {
  return queryOptions({
    queryKey: queryKeys.reviews.projectStates(projectId),
    queryFn: ({ signal }) => getProjectReviewStates(projectId, signal),
  });
}

export function useProjectReviewStates(projectId: string) {
  return useQuery(getProjectReviewStatesQueryOptions(projectId));
}
