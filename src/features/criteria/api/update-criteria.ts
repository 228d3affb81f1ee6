import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { ProjectCriteria, ProjectCriteriaDto } from "@shared/schemas/criteria";
import { apiPaths } from "@/config/paths";
import { api } from "@/lib/api-client";
import { queryKeys } from "@/lib/query-keys";
import { getCriteriaHistoryQueryOptions } from "@/features/criteria/api/get-criteria-history";
import { getCriteriaQueryOptions } from "@/features/criteria/api/get-criteria";

export interface UpdateCriteriaInput {
  criteria: ProjectCriteria;
  /** The version the edit started from (null: none saved yet); a newer saved version answers 409. */
  baseVersion: number | null;
}

/** Saves the criteria as the project's next version. */
export function updateCriteria(projectId: string, input: UpdateCriteriaInput): Promise<ProjectCriteriaDto> {
  return api.put<ProjectCriteriaDto>(apiPaths.projects.criteria(projectId), {
    criteria: input.criteria,
    baseVersion: input.baseVersion,
  });
}

/**
 * On success the answer becomes the cached current version; the history, the screenings (they read the
 * required speeds), the project's comparison, the revisions and the review queue (their assessments) are refetched.
 */
export function useUpdateCriteria(projectId: string, options: { onSuccess?: (saved: ProjectCriteriaDto) => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: UpdateCriteriaInput) => updateCriteria(projectId, input),
    onSuccess: async (saved) => {
      queryClient.setQueryData(getCriteriaQueryOptions(projectId).queryKey, saved);
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: getCriteriaHistoryQueryOptions(projectId).queryKey }),
        queryClient.invalidateQueries({ queryKey: queryKeys.criteria.screenings() }),
        // The project's comparison carries margins computed against the criteria (studies feature's key).
        queryClient.invalidateQueries({ queryKey: queryKeys.comparison(projectId) }),
        // So do the revisions, the studies' latest revisions and the review queue: each carries the assessment
        // against the current criteria, and a new criteria version gives a new one.
        queryClient.invalidateQueries({ queryKey: queryKeys.revisions.all() }),
        queryClient.invalidateQueries({ queryKey: queryKeys.studies.all() }),
        queryClient.invalidateQueries({ queryKey: queryKeys.reviews.queue() }),
      ]);
      options.onSuccess?.(saved);
    },
  });
}
