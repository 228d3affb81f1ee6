import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { RevisionDto } from "@shared/schemas/revisions";
import { apiPaths } from "@/config/paths";
import { api } from "@/lib/api-client";
import { getComparisonQueryOptions } from "@/features/studies/api/get-comparison";
import { getRevisionQueryOptions } from "@/features/studies/api/get-revision";
import { getRevisionsQueryOptions } from "@/features/studies/api/get-revisions";
import { getStudyQueryOptions } from "@/features/studies/api/get-study";

interface RerunRevisionInput {
  revisionId: string;
  /** The study's newest revision as the page shows it: the re-run goes on top of it (409 when a newer one exists). */
  parentRevision: number;
}

/** Computes a revision's document again with the server's current engine, stored as the study's next revision. */
export function rerunRevision({ revisionId, parentRevision }: RerunRevisionInput): Promise<RevisionDto> {
  return api.post<RevisionDto>(apiPaths.revisions.rerun(revisionId), { parentRevision });
}

export function useRerunRevision(studyId: string, projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: rerunRevision,
    onSuccess: (revision) => {
      queryClient.setQueryData(getRevisionQueryOptions(revision.id).queryKey, revision);
      void queryClient.invalidateQueries({ queryKey: getStudyQueryOptions(studyId).queryKey });
      void queryClient.invalidateQueries({ queryKey: getRevisionsQueryOptions(studyId).queryKey });
      void queryClient.invalidateQueries({ queryKey: getComparisonQueryOptions(projectId).queryKey });
    },
  });
}
