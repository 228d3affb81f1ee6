import { useState, type ReactNode } from "react";
import type { RevisionSummaryDto } from "@shared/schemas/revisions";
import { Link } from "react-router-dom";
import { Card } from "@/components/ui/card";
import { PageHeader } from "@/components/ui/page-header";
import { LoadingBlock } from "@/components/ui/spinner";
import { paths } from "@/config/paths";
import { useRevisions } from "@/features/studies/api/get-revisions";
import { useStudy } from "@/features/studies/api/get-study";
import { RevisionDiff } from "@/features/studies/components/revision-diff";
import { RevisionTimeline } from "@/features/studies/components/revision-timeline";
import { RevisionTrend } from "@/features/studies/components/revision-trend";
import { queryErrorPanel } from "@/features/studies/components/study-workspace";

/** The study's history: timeline, field-by-field diff of any two revisions, and the trend of critical speeds. */
export function StudyRevisions({ projectId, studyId, renderReviewState }: {
  projectId: string;
  studyId: string;
  /** Each revision's review state in the timeline (composed in src/app). */
  renderReviewState?: (revision: RevisionSummaryDto) => ReactNode;
}) {
  const study = useStudy(studyId);
  const revisions = useRevisions(studyId);
  const [picked, setPicked] = useState<{ from: string | null; to: string | null }>({ from: null, to: null });
  const list = revisions.data ?? [];
  const fromId = picked.from ?? list[1]?.id ?? null;
  const toId = picked.to ?? list[0]?.id ?? null;

  return (
    <>
      <PageHeader
        eyebrow={
          <span className="flex gap-3">
            <Link to={paths.app.project.getHref(projectId)} className="text-tide-700 hover:underline">← Project</Link>
            <Link to={paths.app.study.getHref(projectId, studyId)} className="text-tide-700 hover:underline">Open the study</Link>
          </span>
        }
        title={study.data ? `${study.data.name} — revisions` : "Revisions"}
        description={study.data ? `${study.data.alternativeName} · ${study.data.revisionCount} revisions, each stored with its result and never changed` : undefined}
        actions={
          <Link to={paths.app.compare.getHref(projectId, [fromId, toId].filter((x): x is string => x !== null))}
            className="rounded-md border border-ink-300 bg-surface px-3 py-1.5 text-sm font-semibold text-ink-800 hover:bg-ink-50">
            Compare the picked two
          </Link>
        }
      />
      {revisions.isPending ? (
        <LoadingBlock label="Loading the revisions…" />
      ) : revisions.isError ? (
        queryErrorPanel("The revisions could not be loaded", revisions.error, () => void revisions.refetch(), revisions.isFetching)
      ) : (
        <div className="grid items-start gap-4 lg:grid-cols-[minmax(0,1fr)_minmax(0,1fr)]">
          <Card title="Timeline" subtitle="Newest first" flush>
            <RevisionTimeline projectId={projectId} studyId={studyId} revisions={list} fromId={fromId} toId={toId}
              onPick={(side, id) => setPicked((p) => ({ from: p.from ?? fromId, to: p.to ?? toId, [side]: id }))}
              renderReviewState={renderReviewState} />
          </Card>
          <div className="space-y-4">
            <Card title="Critical speed by revision">
              <RevisionTrend revisions={list} />
            </Card>
            <Card title="What changed" flush>
              <RevisionDiff fromId={fromId} toId={toId} />
            </Card>
          </div>
        </div>
      )}
    </>
  );
}
