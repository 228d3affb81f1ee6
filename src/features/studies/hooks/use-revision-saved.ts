import { useQueryClient } from "@tanstack/react-query";
import type { RevisionDto } from "@shared/schemas/revisions";
import { queryKeys } from "@/lib/query-keys";
import { getComparisonQueryOptions } from "@/features/studies/api/get-comparison";
import { getRevisionQueryOptions } from "@/features/studies/api/get-revision";
import { getRevisionsQueryOptions } from "@/features/studies/api/get-revisions";
import { getStudyQueryOptions } from "@/features/studies/api/get-study";

/**
 * After a new revision is stored (save, import, re-run): it becomes the cached revision, and the study, its
 * revision list, the project's comparison and every review state are refetched — a newer revision supersedes the
 * drafts and returned revisions before it.
 */
export function useRevisionSaved(studyId: string, projectId: string) {
  const queryClient = useQueryClient();
  return (revision: RevisionDto) => {
    queryClient.setQueryData(getRevisionQueryOptions(revision.id).queryKey, revision);
    void queryClient.invalidateQueries({ queryKey: getStudyQueryOptions(studyId).queryKey });
    void queryClient.invalidateQueries({ queryKey: getRevisionsQueryOptions(studyId).queryKey });
    void queryClient.invalidateQueries({ queryKey: getComparisonQueryOptions(projectId).queryKey });
    void queryClient.invalidateQueries({ queryKey: queryKeys.reviews.all() });
  };
}
