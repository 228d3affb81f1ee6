import type { QueryClient } from "@tanstack/react-query";
import type { LoaderFunctionArgs } from "react-router-dom";
import { PageHeader } from "@/components/ui/page-header";
import { canUseWorkspace } from "@/lib/authorization";
import { useMe } from "@/features/auth/api/get-me";
import { getProjectsQueryOptions } from "@/features/projects/api/get-projects";
import { ProjectsTable } from "@/features/projects/components/projects-table";
import { requireAccess } from "@/app/routes/guards";

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requireAccess(queryClient, request, canUseWorkspace);
    // Start the fetch now but don't hold the page for it: the table shows its own loading state.
    void queryClient.prefetchQuery(getProjectsQueryOptions());
    return null;
  };

export function ProjectsRoute() {
  const me = useMe();
  return (
    <>
      <PageHeader
        title="Projects"
        description="Each project is one crossing: its deck alternatives, their studies and revisions, and the signed summaries."
      />
      <ProjectsTable isAdmin={me.data?.isAdmin ?? false} />
    </>
  );
}
