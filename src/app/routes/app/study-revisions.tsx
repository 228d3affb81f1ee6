import type { QueryClient } from "@tanstack/react-query";
import { useParams, type LoaderFunctionArgs } from "react-router-dom";
import { canUseWorkspace } from "@/lib/authorization";
import { getRevisionsQueryOptions } from "@/features/studies/api/get-revisions";
import { StudyRevisions } from "@/features/studies/components/study-revisions";
import { RevisionReviewState } from "@/features/review/components/revision-review-state";
import { requireAccess } from "@/app/routes/guards";

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request, params }: LoaderFunctionArgs) => {
    await requireAccess(queryClient, request, canUseWorkspace);
    if (params.studyId) void queryClient.prefetchQuery(getRevisionsQueryOptions(params.studyId));
    return null;
  };

export function StudyRevisionsRoute() {
  const { projectId = "", studyId = "" } = useParams();
  return (
    <StudyRevisions
      key={studyId}
      projectId={projectId}
      studyId={studyId}
      renderReviewState={(revision) => <RevisionReviewState studyId={studyId} revisionId={revision.id} />}
    />
  );
}
