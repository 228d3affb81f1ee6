import { useRef, type ChangeEvent } from "react";
import { useNavigate } from "react-router-dom";
import type { RevisionDto } from "@shared/schemas/revisions";
import { ENGINE_VERSION } from "@shared/engine/version";
import { Button } from "@/components/ui/button";
import { apiPaths, paths } from "@/config/paths";
import { ApiError } from "@/lib/api-client";
import { useImportRevision } from "@/features/studies/api/import-revision";
import { useRerunRevision } from "@/features/studies/api/rerun-revision";
import { fieldLabel } from "@/features/studies/utils/format-value";

interface StudyFileActionsProps {
  projectId: string;
  studyId: string;
  revision: RevisionDto;
  canEdit: boolean;
}

/**
 * The study as a file and the engine behind the stored result: download the revision's document, import a study
 * file as the next revision, and re-run a revision stored by an older engine.
 */
export function StudyFileActions({ projectId, studyId, revision, canEdit }: StudyFileActionsProps) {
  const fileInput = useRef<HTMLInputElement>(null);
  const navigate = useNavigate();
  const importRevision = useImportRevision(studyId, projectId);
  const rerun = useRerunRevision(studyId, projectId);
  const toRevision = (saved: RevisionDto) => navigate(paths.app.study.getHref(projectId, studyId, saved.number), { replace: true });
  const olderEngine = revision.engineVersion !== ENGINE_VERSION;

  const onFile = (event: ChangeEvent<HTMLInputElement>) => {
    const file = event.target.files?.[0];
    event.target.value = "";
    if (!file) return;
    importRevision.mutate(
      { file, parentRevision: revision.latestNumber, changeNote: `Imported from the study file ${file.name}` },
      { onSuccess: toRevision },
    );
  };

  const error = importRevision.error ?? rerun.error;
  // The server lists each bad value of a study file with its JSON path; show each once, by the field's name.
  const studyIssues =
    error instanceof ApiError && Array.isArray(error.details)
      ? (error.details as Array<{ path?: unknown; message?: unknown }>).flatMap((d) =>
          typeof d?.path === "string" && d.path.startsWith("$") ? [{ path: d.path, message: String(d.message ?? "") }] : [],
        )
      : [];
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
              aria-label="Study file to import" onChange={onFile} />
            <Button size="sm" variant="secondary" isLoading={importRevision.isPending} onClick={() => fileInput.current?.click()}>
              Import a study file…
            </Button>
          </>
        ) : null}
      </div>
      {olderEngine ? (
        <p className="flex flex-wrap items-center gap-2 rounded-sm bg-caution-100 px-2 py-1 text-caution-700">
          Stored with engine {revision.engineVersion}; this release computes with engine {ENGINE_VERSION}.
          {canEdit ? (
            <Button size="sm" variant="secondary" isLoading={rerun.isPending} onClick={() => rerun.mutate({ revisionId: revision.id, parentRevision: revision.latestNumber }, { onSuccess: toRevision })}>
              Re-run as a new revision
            </Button>
          ) : null}
        </p>
      ) : null}
      {error ? (
        <div role="alert" className="font-semibold text-signal-700">
          {studyIssues.length > 0 ? (
            <>
              <p>
                {importRevision.error ? "The study file was not imported" : "The revision was not re-run"} ({studyIssues.length}{" "}
                problem{studyIssues.length === 1 ? "" : "s"}); nothing was stored.
              </p>
              <ul className="list-disc pl-5 font-normal text-ink-900">
                {studyIssues.slice(0, 10).map((d, i) => (
                  <li key={i}>
                    {fieldLabel(d.path)}: {d.message} <code className="text-xs text-ink-600">{d.path}</code>
                  </li>
                ))}
                {studyIssues.length > 10 ? <li>… and {studyIssues.length - 10} more</li> : null}
              </ul>
            </>
          ) : (
            <p>{error.message}</p>
          )}
        </div>
      ) : null}
    </div>
  );
}
