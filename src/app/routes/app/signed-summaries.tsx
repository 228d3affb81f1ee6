import type { QueryClient } from "@tanstack/react-query";
import type { LoaderFunctionArgs } from "react-router-dom";
import { PageHeader } from "@/components/ui/page-header";
import { canReadSignedSummaries } from "@/lib/authorization";
import { getSummariesQueryOptions } from "@/features/summaries/api/get-summaries";
import { SummariesTable } from "@/features/summaries/components/summaries-table";
import { requireAccess } from "@/app/routes/guards";

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requireAccess(queryClient, request, canReadSignedSummaries);
    void queryClient.prefetchQuery(getSummariesQueryOptions());
    return null;
  };

export function SignedSummariesRoute() {
  return (
    <>
      <PageHeader
        title="Signed summaries"
        description="Stability summaries signed by the project's reviewing engineer, for the projects you are invited to. Each one is checked against the published keys when you open it."
      />
      <SummariesTable />
    </>
  );
}
