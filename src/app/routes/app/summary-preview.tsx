import type { QueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { Link, useParams, type LoaderFunctionArgs } from "react-router-dom";
import { ErrorPanel } from "@/components/ui/error-panel";
import { LoadingBlock } from "@/components/ui/spinner";
import { paths } from "@/config/paths";
import { ApiError } from "@/lib/api-client";
import { canUseWorkspace } from "@/lib/authorization";
import { getSummaryPreviewQueryOptions, useSummaryPreview } from "@/features/review/api/get-summary-preview";
import { SignedNotice, SummaryPreviewDecision, SummaryPreviewHead, UnconfirmedCriterionNote } from "@/features/review/components/summary-preview-parts";
import { SummaryView } from "@/features/summaries/components/summary-view";
import { requireAccess } from "@/app/routes/guards";

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request, params }: LoaderFunctionArgs) => {
    await requireAccess(queryClient, request, canUseWorkspace);
    if (params.revisionId) void queryClient.prefetchQuery(getSummaryPreviewQueryOptions(params.revisionId));
    return null;
  };

/** The summary id a 409 "already signed" names, when that is the refusal. */
function signedSummaryId(error: Error): string | null {
  if (!(error instanceof ApiError) || error.status !== 409) return null;
  const details = error.details as { summaryId?: unknown } | undefined;
  return typeof details?.summaryId === "string" ? details.summaryId : null;
}

/**
 * The reviewer reads the summary of a revision exactly as it will be signed — the signed summary's own view, fed
 * the server's preview — and signs (or returns) below it. Once signed, the page points to the signed summary.
 */
export function SummaryPreviewRoute() {
  const { revisionId = "" } = useParams();
  const preview = useSummaryPreview(revisionId);
  const [signed, setSigned] = useState<{ summaryId: string; studyName: string; revisionNumber: number } | null>(null);
  if (signed) return <SignedNotice {...signed} />;
  if (preview.isError) {
    const summaryId = signedSummaryId(preview.error);
    if (summaryId) {
      return (
        <p role="status" className="rounded-md border border-steady-100 bg-steady-100 px-3 py-2 text-steady-700">
          {preview.error.message}{" "}
          <Link className="font-semibold underline" to={paths.app.summary.getHref(summaryId)}>
            Open the signed summary
          </Link>
        </p>
      );
    }
    return (
      <ErrorPanel
        title="The summary preview could not be built"
        message={preview.error.message}
        code={preview.error instanceof ApiError ? preview.error.code : undefined}
        onRetry={() => void preview.refetch()}
        isRetrying={preview.isFetching}
      />
    );
  }
  if (preview.isPending) return <LoadingBlock label="Building the summary as it would be signed…" />;
  const data = preview.data;
  return (
    <SummaryView
      summary={{ id: `preview-${data.revisionId}`, payload: data.payload, branches: data.branches, branchSampling: data.branchSampling }}
      preview={{
        head: <SummaryPreviewHead preview={data} />,
        criterionNote: (phenomenon) => <UnconfirmedCriterionNote preview={data} phenomenon={phenomenon} />,
        decision: (
          <SummaryPreviewDecision
            preview={data}
            onOutdated={() => void preview.refetch()}
            onSigned={(summaryId) => setSigned({ summaryId, studyName: data.payload.study.name, revisionNumber: data.revisionNumber })}
          />
        ),
      }}
    />
  );
}
