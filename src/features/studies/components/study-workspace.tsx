import type { UseQueryResult } from "@tanstack/react-query";
import { useEffect, useState, type ReactNode } from "react";
import { Link, useSearchParams } from "react-router-dom";
import type { ProjectCriteriaDto } from "@shared/schemas/criteria";
import type { RevisionDto } from "@shared/schemas/revisions";
import { Card } from "@/components/ui/card";
import { ErrorPanel } from "@/components/ui/error-panel";
import { PageHeader } from "@/components/ui/page-header";
import { LoadingBlock } from "@/components/ui/spinner";
import { paths } from "@/config/paths";
import { ApiError } from "@/lib/api-client";
import { formatDateTime } from "@/lib/format";
import { useDatasets } from "@/features/studies/api/get-datasets";
import { useRevision } from "@/features/studies/api/get-revision";
import { useRevisions } from "@/features/studies/api/get-revisions";
import { useStudy } from "@/features/studies/api/get-study";
import type { RebasedDraft } from "@/features/studies/components/save-revision-panel";
import { StudyEditor, type StudyEditorProps } from "@/features/studies/components/study-editor";

interface StudyWorkspaceProps {
  projectId: string;
  studyId: string;
  /** Reviewers (and administrators who are not the project's analysts) see everything, edit nothing. */
  readOnly: boolean;
  /** The project's criteria, for the margins (loaded by the criteria feature; src/app composes the two). */
  criteria: UseQueryResult<ProjectCriteriaDto>;
  renderChecks?: StudyEditorProps["renderChecks"];
  renderFullWidth?: StudyEditorProps["renderFullWidth"];
  /** The shown revision's review state, beside its number in the header (the review feature's, composed in src/app). */
  renderRevisionState?: (revision: RevisionDto) => ReactNode;
}

export function queryErrorPanel(title: string, error: Error, retry: () => void, isRetrying: boolean) {
  const missing = error instanceof ApiError && (error.status === 404 || error.status === 403);
  return (
    <ErrorPanel
      title={missing ? `${title}: not available` : title}
      message={missing ? "It does not exist, or you are not a member of its project." : error.message}
      code={error instanceof ApiError ? error.code : undefined}
      onRetry={missing ? undefined : retry}
      isRetrying={isRetrying}
    />
  );
}

/** Loads the study, the revision to start from (the latest, or `?revision=N`) and the data sets. */
export function StudyWorkspace({ projectId, studyId, readOnly, criteria, renderChecks, renderFullWidth, renderRevisionState }: StudyWorkspaceProps) {
  const [search] = useSearchParams();
  const wanted = Number(search.get("revision")) || null;
  const study = useStudy(studyId);
  const revisions = useRevisions(studyId);
  const datasets = useDatasets(study.data?.alternativeId ?? null);
  const [draft, setDraft] = useState<RebasedDraft | null>(null);
  // Opening another revision (or landing on the one just saved) ends a re-based draft.
  useEffect(() => setDraft(null), [wanted]);

  const wantedId = wanted !== null ? (revisions.data?.find((r) => r.number === wanted)?.id ?? null) : null;
  const revisionId = draft?.revisionId ?? wantedId ?? (wanted === null ? (study.data?.latestRevision?.id ?? null) : null);
  const revision = useRevision(revisionId);

  const back = (
    <span className="flex flex-wrap items-center gap-x-1.5">
      <Link to={paths.app.project.getHref(projectId)} className="text-tide-700 hover:underline">← Project</Link>
      {study.data ? <span className="text-ink-600">· {study.data.alternativeName}</span> : null}
    </span>
  );

  if (study.isPending) {
    return (<><PageHeader eyebrow={back} title="Study" /><LoadingBlock label="Loading the study…" /></>);
  }
  if (study.isError) {
    return (<><PageHeader eyebrow={back} title="Study" />{queryErrorPanel("The study could not be loaded", study.error, () => void study.refetch(), study.isFetching)}</>);
  }
  const s = study.data;
  const latest = s.latestRevision;
  const actions = (
    <>
      <Link to={paths.app.studyRevisions.getHref(projectId, studyId)} className="rounded-md border border-ink-300 bg-surface px-3 py-1.5 text-sm font-semibold text-ink-800 hover:bg-ink-50">
        Revisions ({s.revisionCount})
      </Link>
      <Link to={paths.app.compare.getHref(projectId)} className="rounded-md border border-ink-300 bg-surface px-3 py-1.5 text-sm font-semibold text-ink-800 hover:bg-ink-50">
        Compare
      </Link>
    </>
  );

  const header = (
    <PageHeader
      eyebrow={back}
      title={s.name}
      description={
        revision.data ? (
          <span className="inline-flex flex-wrap items-center gap-x-2">
            <span className="num">
              Revision {revision.data.number}
              {revision.data.number === revision.data.latestNumber ? " (latest)" : ` of ${revision.data.latestNumber} — an older revision`}
              {" · "}
              {revision.data.author?.name ?? "unknown author"}, {formatDateTime(revision.data.createdAt)}
              {revision.data.changeNote ? ` · “${revision.data.changeNote}”` : ""}
            </span>
            {renderRevisionState?.(revision.data)}
          </span>
        ) : (s.purpose || undefined)
      }
      actions={actions}
    />
  );

  if (!latest) {
    return (<>{header}<Card title="No revision yet"><p className="text-ink-700">This study has no saved revision. Its first revision is created with the study or imported from a study file.</p></Card></>);
  }
  if (wanted !== null && revisions.isSuccess && wantedId === null && !draft) {
    return (<>{header}<ErrorPanel title={`Revision ${wanted} does not exist`} message={<Link className="text-tide-700 underline" to={paths.app.study.getHref(projectId, studyId)}>Open the latest revision</Link>} /></>);
  }
  if (revision.isError) {
    return (<>{header}{queryErrorPanel("The revision could not be loaded", revision.error, () => void revision.refetch(), revision.isFetching)}</>);
  }
  if (!revision.data) {
    return (<>{header}<LoadingBlock label="Loading the revision…" /></>);
  }

  return (
    <>
      {header}
      {readOnly ? (
        <p className="mb-3 rounded-md bg-ink-100 px-3 py-1.5 text-sm text-ink-800">
          Read-only: you see the inputs and the stored result of this revision. Analysts of the project edit and run it.
        </p>
      ) : null}
      {criteria.isError && !(criteria.error instanceof ApiError && criteria.error.status === 404) ? (
        <p className="mb-3 text-sm text-signal-700">The project's criteria could not be loaded ({criteria.error.message}); margins are not shown.</p>
      ) : null}
      <StudyEditor
        key={`${revision.data.id}:${draft ? "rebased" : "plain"}`}
        projectId={projectId}
        studyId={studyId}
        revision={revision.data}
        draft={draft && draft.revisionId === revision.data.id ? draft : null}
        readOnly={readOnly}
        criteria={criteria.data?.criteria ? criteria.data : null}
        datasets={datasets.data ?? []}
        datasetsError={datasets.isError ? datasets.error.message : null}
        onRebased={setDraft}
        renderChecks={renderChecks}
        renderFullWidth={renderFullWidth}
      />
    </>
  );
}
