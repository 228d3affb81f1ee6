import { Link } from "react-router-dom";
import type { StabilityMargin } from "@shared/schemas/assessment";
import type { ReviewQueueItemDto } from "@shared/schemas/review";
import { Card } from "@/components/ui/card";
import { ErrorPanel } from "@/components/ui/error-panel";
import { LoadingBlock } from "@/components/ui/spinner";
import { paths } from "@/config/paths";
import { ApiError } from "@/lib/api-client";
import { cn } from "@/lib/cn";
import { formatDateTime } from "@/lib/format";
import { divergenceFigure, flutterFigure, flutterTone, VERDICT_TEXT_TONE, VERDICT_WORD, warningCountText } from "@/lib/verdict";
import { useReviewQueue } from "@/features/review/api/get-review-queue";

/** "margin 1.05 against 52.09 m/s · pass"; a lower bound is written "≥". */
function MarginLine({ margin }: { margin: StabilityMargin | undefined }) {
  if (!margin) return <span className="text-ink-600">no criteria yet</span>;
  const ratio = margin.margin === null ? "—" : `${margin.marginIsLowerBound ? "≥ " : ""}${margin.margin.toFixed(2)}`;
  return (
    <span className="text-sm">
      margin <span className="num font-semibold">{ratio}</span> against{" "}
      <span className="num">{margin.requiredSpeedMps.toFixed(2)} m/s</span> ·{" "}
      <span className={cn("font-semibold", VERDICT_TEXT_TONE[margin.status])}>{VERDICT_WORD[margin.status]}</span>
    </span>
  );
}

function QueueItem({ item }: { item: ReviewQueueItemDto }) {
  const newer = item.latestNumber > item.revisionNumber;
  // Everything stated here is the revision's assessment: the figures, margins and warning count the study shows.
  const a = item.assessment.assessment;
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
      <dl className="mb-3 grid grid-cols-1 gap-x-6 gap-y-2 text-[0.95rem] sm:grid-cols-3">
        <div>
          <dt className="text-xs tracking-wide text-ink-600 uppercase">Flutter</dt>
          <dd className={cn("num font-semibold", flutterTone(a))} data-testid="queue-flutter">{flutterFigure(a)}</dd>
          {a.flutter.found ? <dd className="text-sm text-ink-700">{a.flutter.testedRange.statement.split(" (")[0]}</dd> : null}
          <dd>
            <MarginLine margin={a.margins?.flutter} />
          </dd>
        </div>
        <div>
          <dt className="text-xs tracking-wide text-ink-600 uppercase">Divergence</dt>
          <dd className="num font-semibold" data-testid="queue-divergence">{divergenceFigure(a)}</dd>
          <dd className="text-xs text-ink-600">{a.divergence.marginBasis}</dd>
          <dd>
            <MarginLine margin={a.margins?.divergence} />
          </dd>
        </div>
        <div>
          <dt className="text-xs tracking-wide text-ink-600 uppercase">Warnings</dt>
          <dd className={a.warningCount > 0 ? "font-semibold text-caution-700" : "text-ink-700"} data-testid="queue-warnings">
            {a.warningCount === 0 ? "none" : warningCountText(a)}
          </dd>
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
      <Link
        className="inline-flex h-9 items-center rounded-md bg-tide-700 px-3.5 font-semibold text-white hover:bg-tide-600"
        to={paths.app.summaryPreview.getHref(item.revisionId)}
      >
        Read the summary to sign or return
      </Link>
    </Card>
  );
}

/**
 * The reviewer's queue: every revision waiting for their review. A revision is signed (or returned) from its summary
 * preview — the summary exactly as it will be signed — which each row links to.
 */
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
  const waiting = queue.data;
  return (
    <div className="space-y-4">
      {waiting.length === 0 ? (
        <Card title="Nothing waiting">
          <p className="text-ink-700">No revision is waiting for your review. Analysts' submissions to you appear here.</p>
        </Card>
      ) : (
        waiting.map((item) => <QueueItem key={item.revisionId} item={item} />)
      )}
    </div>
  );
}
