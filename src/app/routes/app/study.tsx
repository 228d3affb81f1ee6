import type { QueryClient } from "@tanstack/react-query";
import { useParams, type LoaderFunctionArgs } from "react-router-dom";
import { canUseWorkspace, roleInProject } from "@/lib/authorization";
import { useMe } from "@/features/auth/api/get-me";
import { getStudyQueryOptions } from "@/features/studies/api/get-study";
import { getRevisionsQueryOptions } from "@/features/studies/api/get-revisions";
import { StudyChecks } from "@/features/criteria/components/study-checks";
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
  const canEdit = me.data ? roleInProject(me.data, projectId) === "analyst" : false;
  return (
    <StudyWorkspace
      key={studyId}
      projectId={projectId}
      studyId={studyId}
      readOnly={!canEdit}
      renderChecks={(study, result) => <StudyChecks projectId={projectId} study={study} result={result} />}
    />
  );
}
