import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { Phenomenon, ProjectCriteria, ProjectCriteriaDto } from "@shared/schemas/criteria";
import { apiPaths } from "@/config/paths";
import { api } from "@/lib/api-client";
import { queryKeys } from "@/lib/query-keys";
import { getCriteriaHistoryQueryOptions } from "@/features/criteria/api/get-criteria-history";
import { getCriteriaQueryOptions } from "@/features/criteria/api/get-criteria";

export interface UpdateCriteriaInput {
  criteria: ProjectCriteria;
  /** The version the edit started from (null: none saved yet); a newer saved version answers 409. */
  baseVersion: number | null;
  /** Phenomena whose basis the saver confirms as it stands with this version (recorded with their name). */
  confirmBases?: Phenomenon[];
}

/** Saves the criteria as the project's next version. */
export function updateCriteria(projectId: string, input: UpdateCriteriaInput): Promise<ProjectCriteriaDto> {
  return api.put<ProjectCriteriaDto>(apiPaths.projects.criteria(projectId), {
    criteria: input.criteria,
    baseVersion: input.baseVersion,
    ...(input.confirmBases?.length ? { confirmBases: input.confirmBases } : {}),
  });
}

/**
 * On success the answer becomes the cached current version; the history, the screenings (they read the
 * required speeds), the project's comparison, the revisions, the review queue (their assessments) and the summary
 * previews are refetched.
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
        // So do the revisions, the studies' latest revisions, the review queue and the summary previews: each carries
        // the assessment against the current criteria (a new criteria version gives a new one), and a preview states
        // whether the criteria's bases stand confirmed.
        queryClient.invalidateQueries({ queryKey: queryKeys.revisions.all() }),
        queryClient.invalidateQueries({ queryKey: queryKeys.studies.all() }),
        queryClient.invalidateQueries({ queryKey: queryKeys.reviews.all() }),
      ]);
      options.onSuccess?.(saved);
    },
  });
}
