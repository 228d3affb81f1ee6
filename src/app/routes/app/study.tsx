import type { QueryClient } from "@tanstack/react-query";
import { useParams, type LoaderFunctionArgs } from "react-router-dom";
import { canUseWorkspace, roleInProject } from "@/lib/authorization";
import { useMe } from "@/features/auth/api/get-me";
import { getStudyQueryOptions } from "@/features/studies/api/get-study";
import { getRevisionsQueryOptions } from "@/features/studies/api/get-revisions";
import { useCriteria } from "@/features/criteria/api/get-criteria";
import { StudyChecks } from "@/features/criteria/components/study-checks";
import { ReviewPanel } from "@/features/review/components/review-panel";
import { RevisionReviewState } from "@/features/review/components/revision-review-state";
import { StudyWorkspace } from "@/features/studies/components/study-workspace";
import { requireAccess } from "@/app/routes/guards";

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request, params }: LoaderFunctionArgs) => {
    await requireAccess(queryClient, request, canUseWorkspace);
    if (params.studyId) {
      void queryClient.prefetchQuery(getStudyQueryOptions(params.studyId));
      void queryClient.prefetchQuery(getRevisionsQueryOptions(params.studyId));
    }
    return null;
  };

export function StudyRoute() {
  const { projectId = "", studyId = "" } = useParams();
  const me = useMe();
  const role = me.data ? roleInProject(me.data, projectId) : null;
  const criteria = useCriteria(projectId);
  return (
    <StudyWorkspace
      key={studyId}
      projectId={projectId}
      studyId={studyId}
      readOnly={role !== "analyst"}
      criteria={criteria}
      renderChecks={(study, assessment) => <StudyChecks projectId={projectId} study={study} assessment={assessment} />}
      renderRevisionState={(revision) => <RevisionReviewState studyId={studyId} revisionId={revision.id} />}
      // The review of the revision being viewed, across both columns (beside the long result column it left a
      // hole): analysts submit it, its reviewer returns or signs it.
      renderFullWidth={(revision) =>
        me.data ? (
          <ReviewPanel revisionId={revision.id} projectId={projectId} userId={me.data.id} role={role} isAdmin={me.data.isAdmin} />
        ) : null
      }
    />
  );
}
