import type { QueryClient } from "@tanstack/react-query";
import { useParams, type LoaderFunctionArgs } from "react-router-dom";
import { canUseWorkspace } from "@/lib/authorization";
import { useMe } from "@/features/auth/api/get-me";
import { getProjectQueryOptions, useProject } from "@/features/projects/api/get-project";
import { ProjectMembers } from "@/features/projects/components/project-members";
import { ProjectOverview } from "@/features/projects/components/project-overview";
import { getComparisonQueryOptions } from "@/features/studies/api/get-comparison";
import { getCriteriaQueryOptions } from "@/features/criteria/api/get-criteria";
import { DesignWindPanel } from "@/features/criteria/components/design-wind-panel";
import { ProjectStudies } from "@/features/studies/components/project-studies";
import { StudyLatestReviewState } from "@/features/review/components/revision-review-state";
import { requireAccess } from "@/app/routes/guards";

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request, params }: LoaderFunctionArgs) => {
    await requireAccess(queryClient, request, canUseWorkspace);
    if (params.projectId) {
      void queryClient.prefetchQuery(getProjectQueryOptions(params.projectId));
      void queryClient.prefetchQuery(getComparisonQueryOptions(params.projectId));
      void queryClient.prefetchQuery(getCriteriaQueryOptions(params.projectId));
    }
    return null;
  };

export function ProjectRoute() {
  const { projectId = "" } = useParams();
  const me = useMe();
  const isAdmin = me.data?.isAdmin ?? false;
  // The design wind shows once the project is known (its role decides who edits; the server checks again).
  const project = useProject(projectId);
  return (
    <div key={projectId}>
      <ProjectOverview projectId={projectId} isAdmin={isAdmin} />
      {project.data ? (
        <DesignWindPanel className="mt-4" projectId={projectId} canEdit={project.data.role === "reviewer" || isAdmin} />
      ) : null}
      <ProjectStudies
        projectId={projectId}
        canEdit={project.data?.role === "analyst"}
        renderReviewState={(studyId) => <StudyLatestReviewState projectId={projectId} studyId={studyId} />}
      />
      {isAdmin ? <ProjectMembers projectId={projectId} /> : null}
    </div>
  );
}
