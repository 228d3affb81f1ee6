import type { QueryClient } from "@tanstack/react-query";
import { useParams, type LoaderFunctionArgs } from "react-router-dom";
import { canUseWorkspace } from "@/lib/authorization";
import { useMe } from "@/features/auth/api/get-me";
import { getProjectQueryOptions } from "@/features/projects/api/get-project";
import { ProjectOverview } from "@/features/projects/components/project-overview";
import { requireAccess } from "@/app/routes/guards";

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request, params }: LoaderFunctionArgs) => {
    await requireAccess(queryClient, request, canUseWorkspace);
    if (params.projectId) void queryClient.prefetchQuery(getProjectQueryOptions(params.projectId));
    return null;
  };

export function ProjectRoute() {
  const { projectId = "" } = useParams();
  const me = useMe();
  return <ProjectOverview key={projectId} projectId={projectId} isAdmin={me.data?.isAdmin ?? false} />;
}
