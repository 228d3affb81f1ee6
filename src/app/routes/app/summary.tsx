import type { QueryClient } from "@tanstack/react-query";
import { useParams, type LoaderFunctionArgs } from "react-router-dom";
import { ErrorPanel } from "@/components/ui/error-panel";
import { LoadingBlock } from "@/components/ui/spinner";
import { ApiError } from "@/lib/api-client";
import { canReadSignedSummaries } from "@/lib/authorization";
import { useSummary } from "@/features/summaries/api/get-summary";
import { SummaryView } from "@/features/summaries/components/summary-view";
import { requireAccess } from "@/app/routes/guards";

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requireAccess(queryClient, request, canReadSignedSummaries);
    return null;
  };

export function SummaryRoute() {
  const { summaryId = "" } = useParams();
  const summary = useSummary(summaryId);
  if (summary.isPending) return <LoadingBlock label="Loading the signed summary…" />;
  if (summary.isError) {
    return (
      <ErrorPanel
        title="The signed summary could not be loaded"
        message={summary.error.message}
        code={summary.error instanceof ApiError ? summary.error.code : undefined}
        onRetry={() => void summary.refetch()}
        isRetrying={summary.isFetching}
      />
    );
  }
  return <SummaryView summary={summary.data} />;
}
