import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { CreateRevisionInput, RevisionDto } from "@shared/schemas/revisions";
import { apiPaths } from "@/config/paths";
import { api } from "@/lib/api-client";
import { getComparisonQueryOptions } from "@/features/studies/api/get-comparison";
import { getRevisionQueryOptions } from "@/features/studies/api/get-revision";
import { getRevisionsQueryOptions } from "@/features/studies/api/get-revisions";
import { getStudyQueryOptions } from "@/features/studies/api/get-study";

/**
 * Saves the edited document as the study's next revision; the server runs the sweep and stores the result. A
 * revision saved by someone else since `parentRevision` answers 409 `stale_parent` (see the re-base panel).
 */
export function createRevision(studyId: string, input: CreateRevisionInput): Promise<RevisionDto> {
  return api.post<RevisionDto>(apiPaths.studies.revisions(studyId), input as unknown as Record<string, unknown>);
}

export function useCreateRevision(studyId: string, projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateRevisionInput) => createRevision(studyId, input),
    onSuccess: (revision) => {
      queryClient.setQueryData(getRevisionQueryOptions(revision.id).queryKey, revision);
      void queryClient.invalidateQueries({ queryKey: getStudyQueryOptions(studyId).queryKey });
      void queryClient.invalidateQueries({ queryKey: getRevisionsQueryOptions(studyId).queryKey });
      void queryClient.invalidateQueries({ queryKey: getComparisonQueryOptions(projectId).queryKey });
    },
  });
}
