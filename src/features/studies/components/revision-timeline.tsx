import type { ReactNode } from "react";
import { Link } from "react-router-dom";
import type { RevisionSummaryDto } from "@shared/schemas/revisions";
import { paths } from "@/config/paths";
import { cn } from "@/lib/cn";
import { formatDateTime } from "@/lib/format";
import { divergenceFigure, flutterFigure, flutterTone, warningCountText } from "@/lib/verdict";

interface RevisionTimelineProps {
  projectId: string;
  studyId: string;
  revisions: readonly RevisionSummaryDto[];
  fromId: string | null;
  toId: string | null;
  onPick: (side: "from" | "to", revisionId: string) => void;
  /** Each revision's review state (the review feature's, composed in src/app). */
  renderReviewState?: (revision: RevisionSummaryDto) => ReactNode;
}

/** Newest first: who saved what and why, its review state, the critical speeds the server found; pick two to diff. */
export function RevisionTimeline({ projectId, studyId, revisions, fromId, toId, onPick, renderReviewState }: RevisionTimelineProps) {
  return (
    <ol aria-label="Revisions, newest first" className="divide-y divide-ink-100">
      {revisions.map((revision) => {
        const a = revision.assessment.assessment;
        return (
          <li key={revision.id} className={cn("grid grid-cols-[3.5rem_minmax(0,1fr)_auto] gap-3 px-4 py-2.5", (revision.id === fromId || revision.id === toId) && "bg-tide-50")}>
            <div className="text-center">
              <span className="num block text-lg leading-tight font-semibold text-ink-950">r{revision.number}</span>
              {!revision.superseded ? <span className="text-xs font-semibold text-tide-700">latest</span> : null}
            </div>
            <div className="min-w-0 space-y-0.5">
              <p className="text-sm text-ink-700">
                <span className="font-semibold text-ink-900">{revision.author?.name ?? "Unknown author"}</span>
                {" · "}
                <time dateTime={revision.createdAt}>{formatDateTime(revision.createdAt)}</time>
              </p>
              {renderReviewState ? <div>{renderReviewState(revision)}</div> : null}
              <p className="text-[0.95rem] text-ink-950">{revision.changeNote || <span className="text-ink-600 italic">No change note (first revision)</span>}</p>
              <p className="num text-sm">
                <span className={cn("font-semibold", flutterTone(a))}>Flutter {flutterFigure(a)}</span>
                {a.flutter.found ? <span className="text-ink-700"> · {a.flutter.frequencyHz.toFixed(4)} Hz · {a.flutter.kind}</span> : null}
                <span className="text-ink-700" title={a.divergence.marginBasis}> · divergence {divergenceFigure(a)}</span>
              </p>
              {a.warningCount > 0 ? (
                <p className="text-xs text-caution-700" title={[...new Set(a.warnings.map((w) => w.title))].join(" · ")}>
                  {warningCountText(a)}: {[...new Set(a.warnings.map((w) => w.title))].join(" · ")}
                </p>
              ) : null}
            </div>
            <div className="flex flex-col items-end gap-1 text-sm">
              <Link to={paths.app.study.getHref(projectId, studyId, revision.number)} className="font-semibold text-tide-700 hover:underline">
                Open r{revision.number}
              </Link>
              <div className="flex gap-2" role="group" aria-label={`Compare revision ${revision.number}`}>
                <label className="flex items-center gap-1 text-ink-700">
                  <input type="radio" name="diff-from" checked={revision.id === fromId} onChange={() => onPick("from", revision.id)} className="accent-tide-600" />
                  from
                </label>
                <label className="flex items-center gap-1 text-ink-700">
                  <input type="radio" name="diff-to" checked={revision.id === toId} onChange={() => onPick("to", revision.id)} className="accent-tide-600" />
                  to
                </label>
              </div>
            </div>
          </li>
        );
      })}
    </ol>
  );
}
