import { Link } from "react-router-dom";
import type { ReviewQueueItemDto } from "@shared/schemas/review";
import { Card } from "@/components/ui/card";
import { ErrorPanel } from "@/components/ui/error-panel";
import { LoadingBlock } from "@/components/ui/spinner";
import { paths } from "@/config/paths";
import { ApiError } from "@/lib/api-client";
import { formatDateTime } from "@/lib/format";
import { useReviewQueue } from "@/features/review/api/get-review-queue";
import { ReviewDecisionForm } from "@/features/review/components/review-decision-form";

const mps = (v: number | null) => (v === null ? "none found" : `${v.toFixed(1)} m/s`);

function QueueItem({ item }: { item: ReviewQueueItemDto }) {
  const newer = item.latestNumber > item.revisionNumber;
  return (
    <Card
      title={
        <>
          {item.studyName} <span className="font-normal text-ink-600">· revision {item.revisionNumber}</span>
        </>
      }
      subtitle={`${item.projectName} · ${item.alternativeName}`}
      actions={
        <Link
          className="text-sm font-semibold text-tide-700 underline-offset-2 hover:underline"
          to={paths.app.study.getHref(item.projectId, item.studyId, item.revisionNumber)}
        >
          Open in the workspace
        </Link>
      }
      aria-label={`Review of ${item.studyName}, revision ${item.revisionNumber}`}
    >
      <dl className="mb-3 grid grid-cols-2 gap-x-6 gap-y-1 text-[0.95rem] sm:grid-cols-4">
        <div>
          <dt className="text-xs tracking-wide text-ink-600 uppercase">Flutter</dt>
          <dd className="num font-semibold">{mps(item.flutterSpeedMps)}</dd>
        </div>
        <div>
          <dt className="text-xs tracking-wide text-ink-600 uppercase">Divergence</dt>
          <dd className="num font-semibold">{item.divergenceSpeedMps === null ? "not possible" : `${item.divergenceSpeedMps.toFixed(1)} m/s`}</dd>
        </div>
        <div>
          <dt className="text-xs tracking-wide text-ink-600 uppercase">Submitted</dt>
          <dd>
            {item.requestedBy.name}, <time dateTime={item.submittedAt}>{formatDateTime(item.submittedAt)}</time>
          </dd>
        </div>
        <div>
          <dt className="text-xs tracking-wide text-ink-600 uppercase">Engine · content hash</dt>
          <dd className="num truncate" title={item.documentSha256}>
            {item.engineVersion} · {item.documentSha256.slice(0, 12)}…
          </dd>
        </div>
      </dl>
      {item.changeNote ? <p className="mb-2 text-ink-700"><span className="font-semibold">Change:</span> {item.changeNote}</p> : null}
      {item.note ? (
        <blockquote className="mb-3 border-l-3 border-tide-600 pl-3 text-ink-800">{item.note}</blockquote>
      ) : null}
      {newer ? (
        <p className="mb-3 rounded-md bg-caution-100 px-3 py-1.5 text-sm text-caution-700">
          Revision {item.latestNumber} of this study already exists; you are reviewing revision {item.revisionNumber}.
        </p>
      ) : null}
      <ReviewDecisionForm revisionId={item.revisionId} revisionNumber={item.revisionNumber} />
    </Card>
  );
}

/** The reviewer's queue: every revision waiting for their review, each with its decision form. */
export function ReviewQueue() {
  const queue = useReviewQueue();
  if (queue.isPending) return <LoadingBlock label="Loading the revisions waiting for you…" />;
  if (queue.isError) {
    return (
      <ErrorPanel
        title="The review queue could not be loaded"
        message={queue.error.message}
        code={queue.error instanceof ApiError ? queue.error.code : undefined}
        onRetry={() => void queue.refetch()}
        isRetrying={queue.isFetching}
      />
    );
  }
  if (queue.data.length === 0) {
    return (
      <Card title="Nothing waiting">
        <p className="text-ink-700">No revision is waiting for your review. Analysts' submissions to you appear here.</p>
      </Card>
    );
  }
  return (
    <div className="space-y-4">
      {queue.data.map((item) => (
        <QueueItem key={item.revisionId} item={item} />
      ))}
    </div>
  );
}
