import { useQueryClient } from "@tanstack/react-query";
import { useRef, useState, type ChangeEvent } from "react";
import { useNavigate } from "react-router-dom";
import type { RevisionDto } from "@shared/schemas/revisions";
import { ENGINE_VERSION } from "@shared/engine/version";
import { Button } from "@/components/ui/button";
import { apiPaths, paths } from "@/config/paths";
import { getRevisionQueryOptions } from "@/features/studies/api/get-revision";
import { getRevisionsQueryOptions } from "@/features/studies/api/get-revisions";
import { useRerunRevision } from "@/features/studies/api/rerun-revision";
import { ImportPreview } from "@/features/studies/components/import-preview";
import { issuesOf, StudyIssueList } from "@/features/studies/components/study-issue-list";
import { readStudyFile, type StudyFileReading } from "@/features/studies/utils/read-study-file";

interface StudyFileActionsProps {
  projectId: string;
  studyId: string;
  revision: RevisionDto;
  canEdit: boolean;
}

/** A chosen study file: read in the browser, with the study's newest revision it would go on top of. */
type Picked = { file: File } & ({ state: "reading" } | { state: "read"; reading: StudyFileReading; current: RevisionDto } | { state: "failed"; message: string });

/**
 * The study as a file and the engine behind the stored result: download the revision's document, import a study
 * file as the next revision (after seeing what it changes and writing the change note), and re-run a revision stored
 * by an older engine.
 */
export function StudyFileActions({ projectId, studyId, revision, canEdit }: StudyFileActionsProps) {
  const fileInput = useRef<HTMLInputElement>(null);
  const navigate = useNavigate();
  const queryClient = useQueryClient();
  const rerun = useRerunRevision(studyId, projectId);
  const [picked, setPicked] = useState<Picked | null>(null);
  const olderEngine = revision.engineVersion !== ENGINE_VERSION;

  /** The newest revision of the study (the one shown, or the newest of its list). */
  const newestRevision = async (): Promise<RevisionDto> => {
    if (revision.number === revision.latestNumber) return revision;
    const list = await queryClient.fetchQuery(getRevisionsQueryOptions(studyId));
    const newest = list.reduce((a, b) => (b.number > a.number ? b : a));
    return queryClient.fetchQuery(getRevisionQueryOptions(newest.id));
  };

  const onFile = async (event: ChangeEvent<HTMLInputElement>) => {
    const file = event.target.files?.[0];
    event.target.value = "";
    if (!file) return;
    setPicked({ file, state: "reading" });
    try {
      const [reading, current] = await Promise.all([readStudyFile(file), newestRevision()]);
      setPicked({ file, state: "read", reading, current });
    } catch (error) {
      setPicked({ file, state: "failed", message: error instanceof Error ? error.message : String(error) });
    }
  };

  const rerunIssues = issuesOf(rerun.error);
  return (
    <div className="space-y-2 text-sm">
      <div className="flex flex-wrap items-center gap-2">
        <a href={apiPaths.revisions.export(revision.id)} download
          className="inline-flex h-7 items-center rounded-md border border-ink-300 bg-surface px-2.5 font-semibold text-ink-800 hover:bg-ink-50">
          Download study file (r{revision.number})
        </a>
        {canEdit ? (
          <>
            <input ref={fileInput} type="file" accept=".json,application/json" className="sr-only" tabIndex={-1}
              aria-label="Study file to import" onChange={(e) => void onFile(e)} />
            <Button size="sm" variant="secondary" isLoading={picked?.state === "reading"} onClick={() => fileInput.current?.click()}>
              Import a study file…
            </Button>
          </>
        ) : null}
      </div>
      {olderEngine ? (
        <p className="flex flex-wrap items-center gap-2 rounded-sm bg-caution-100 px-2 py-1 text-caution-700">
          Stored with engine {revision.engineVersion}; this release computes with engine {ENGINE_VERSION}.
          {canEdit ? (
            <Button size="sm" variant="secondary" isLoading={rerun.isPending}
              onClick={() => rerun.mutate({ revisionId: revision.id, parentRevision: revision.latestNumber }, {
                onSuccess: (saved) => navigate(paths.app.study.getHref(projectId, studyId, saved.number), { replace: true }),
              })}>
              Re-run as a new revision
            </Button>
          ) : null}
        </p>
      ) : null}
      {picked?.state === "read" && picked.reading.ok ? (
        <ImportPreview projectId={projectId} studyId={studyId} current={picked.current} file={picked.file}
          study={picked.reading.study} onClose={() => setPicked(null)} />
      ) : picked?.state === "read" || picked?.state === "failed" ? (
        <div role="alert" className="space-y-1 rounded-md border border-signal-100 bg-signal-50 px-3 py-2 font-semibold text-signal-700">
          <p>
            {picked.file.name} cannot be imported:{" "}
            {picked.state === "failed" ? picked.message : !picked.reading.ok ? picked.reading.problem : ""}. Nothing was uploaded.
          </p>
          {picked.state === "read" && !picked.reading.ok ? <StudyIssueList issues={picked.reading.issues} /> : null}
          <Button size="sm" variant="secondary" onClick={() => setPicked(null)}>Dismiss</Button>
        </div>
      ) : null}
      {rerun.error ? (
        <div role="alert" className="font-semibold text-signal-700">
          {rerunIssues.length > 0 ? (
            <>
              <p>The revision was not re-run ({rerunIssues.length} problem{rerunIssues.length === 1 ? "" : "s"}); nothing was stored.</p>
              <StudyIssueList issues={rerunIssues} />
            </>
          ) : (
            <p>{rerun.error.message}</p>
          )}
        </div>
      ) : null}
    </div>
  );
}
