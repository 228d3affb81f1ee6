import { ErrorPanel } from "@/components/ui/error-panel";
import { LoadingBlock } from "@/components/ui/spinner";
import { ApiError } from "@/lib/api-client";
import { useRevisionDiff } from "@/features/studies/api/get-revision-diff";
import { DocumentChangesTable } from "@/features/studies/components/document-changes-table";

/** Field by field: what changed in the study document from one revision to another. */
export function RevisionDiff({ fromId, toId }: { fromId: string | null; toId: string | null }) {
  const diff = useRevisionDiff(fromId, toId);
  if (!fromId || !toId) return <p className="px-4 py-3 text-sm text-ink-600">Pick a “from” and a “to” revision in the list.</p>;
  if (fromId === toId) return <p className="px-4 py-3 text-sm text-ink-600">Pick two different revisions.</p>;
  if (diff.isPending) return <LoadingBlock label="Comparing the documents…" />;
  if (diff.isError) {
    return (
      <div className="p-3">
        <ErrorPanel title="The difference could not be computed" message={diff.error.message}
          code={diff.error instanceof ApiError ? diff.error.code : undefined} onRetry={() => void diff.refetch()} isRetrying={diff.isFetching} />
      </div>
    );
  }
  const { from, to, identical, changes } = diff.data;
  return (
    <div>
      <p className="px-4 py-2 text-sm text-ink-700">
        From <span className="font-semibold">r{from.number}</span> to <span className="font-semibold">r{to.number}</span>:{" "}
        {identical ? "the documents are identical." : `${changes.length} field${changes.length === 1 ? "" : "s"} changed.`}
      </p>
      {changes.length > 0 ? (
        <DocumentChangesTable
          changes={changes}
          fromLabel={`r${from.number}`}
          toLabel={`r${to.number}`}
          label={`Changes from revision ${from.number} to revision ${to.number}`}
        />
      ) : null}
    </div>
  );
}
