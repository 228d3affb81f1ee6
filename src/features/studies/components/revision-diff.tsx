import { ErrorPanel } from "@/components/ui/error-panel";
import { LoadingBlock } from "@/components/ui/spinner";
import { ApiError } from "@/lib/api-client";
import { useRevisionDiff } from "@/features/studies/api/get-revision-diff";
import { fieldLabel, formatValue } from "@/features/studies/utils/format-value";

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
        <div className="overflow-x-auto">
          <table className="w-full text-left text-sm" aria-label={`Changes from revision ${from.number} to revision ${to.number}`}>
            <thead>
              <tr className="border-y border-ink-200 bg-ink-50 text-xs tracking-wide text-ink-600 uppercase">
                <th scope="col" className="px-4 py-1.5 font-semibold">Field</th>
                <th scope="col" className="px-2 py-1.5 font-semibold normal-case">r{from.number}</th>
                <th scope="col" className="px-2 py-1.5 font-semibold normal-case">r{to.number}</th>
              </tr>
            </thead>
            <tbody>
              {changes.map((change) => (
                <tr key={change.path} className="border-b border-ink-100 align-top">
                  <th scope="row" className="px-4 py-1 font-normal">
                    <span className="block text-ink-900">{fieldLabel(change.path)}</span>
                    <span className="font-mono text-xs text-ink-600">{change.path}</span>
                  </th>
                  <td className="num px-2 py-1 break-all text-ink-700">{change.kind === "added" ? "—" : formatValue(change.old)}</td>
                  <td className="num px-2 py-1 font-semibold break-all text-ink-950">{change.kind === "removed" ? "—" : formatValue(change.new)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      ) : null}
    </div>
  );
}
