import type { QueryClient } from "@tanstack/react-query";
import { useParams, type LoaderFunctionArgs } from "react-router-dom";
import { canUseWorkspace } from "@/lib/authorization";
import { getComparisonQueryOptions } from "@/features/studies/api/get-comparison";
import { CompareView } from "@/features/studies/components/compare-view";
import { requireAccess } from "@/app/routes/guards";

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request, params }: LoaderFunctionArgs) => {
    await requireAccess(queryClient, request, canUseWorkspace);
    if (params.projectId) void queryClient.prefetchQuery(getComparisonQueryOptions(params.projectId));
    return null;
  };

export function CompareRoute() {
  const { projectId = "" } = useParams();
  return <CompareView key={projectId} projectId={projectId} />;
}
