import { useId, useMemo, useState } from "react";
import { useNavigate } from "react-router-dom";
import { diffJson } from "@shared/diff-json";
import { CHANGE_NOTE_MAX, type RevisionDto } from "@shared/schemas/revisions";
import type { StudyDocument } from "@shared/schemas/study";
import { Button } from "@/components/ui/button";
import { Card } from "@/components/ui/card";
import { paths } from "@/config/paths";
import { useImportRevision } from "@/features/studies/api/import-revision";
import { DocumentChangesTable } from "@/features/studies/components/document-changes-table";
import { issuesOf, StudyIssueList } from "@/features/studies/components/study-issue-list";

interface ImportPreviewProps {
  projectId: string;
  studyId: string;
  /** The study's newest revision: the import goes on top of it, and is compared with it. */
  current: RevisionDto;
  file: File;
  /** The file's document as the study format reads it. */
  study: StudyDocument;
  onClose: () => void;
}

/**
 * Before a study file becomes a revision: every field it would change against the study's newest revision, and the
 * change note the revision is stored with. Nothing is uploaded until the analyst confirms.
 */
export function ImportPreview({ projectId, studyId, current, file, study, onClose }: ImportPreviewProps) {
  const noteId = useId();
  const [note, setNote] = useState("");
  const navigate = useNavigate();
  const importRevision = useImportRevision(studyId, projectId);
  const changes = useMemo(() => diffJson(current.study, study), [current.study, study]);
  const next = current.number + 1;
  const noteMissing = note.trim() === "";

  const confirm = () => {
    if (noteMissing || changes.length === 0) return;
    importRevision.mutate(
      { file, parentRevision: current.number, changeNote: note.trim() },
      { onSuccess: (saved) => navigate(paths.app.study.getHref(projectId, studyId, saved.number), { replace: true }) },
    );
  };
  const error = importRevision.error;
  const issues = issuesOf(error);

  return (
    <Card
      title={`Import ${file.name} as revision ${next}`}
      subtitle={`Compared with revision ${current.number}, the study's newest; nothing is stored until you import`}
      aria-label="Import a study file"
      flush
    >
      <p className="px-4 py-2 text-sm text-ink-800" data-testid="import-summary">
        {changes.length === 0
          ? `The file holds the same inputs as revision ${current.number}: importing it would change nothing.`
          : `${changes.length} field${changes.length === 1 ? "" : "s"} would change from revision ${current.number}.`}
      </p>
      {changes.length > 0 ? (
        <DocumentChangesTable
          changes={changes}
          fromLabel={`r${current.number}`}
          toLabel="file"
          label={`Changes the import would make to revision ${current.number}`}
        />
      ) : null}
      <div className="space-y-2 px-4 py-3">
        <label htmlFor={noteId} className="block text-sm font-semibold text-ink-800">
          Change note of revision {next}
        </label>
        <textarea
          id={noteId}
          value={note}
          maxLength={CHANGE_NOTE_MAX}
          rows={2}
          onChange={(e) => setNote(e.target.value)}
          placeholder="What the file changes and why, e.g. modal damping from the updated global model"
          className="block w-full rounded-md border border-ink-300 bg-white px-2.5 py-1.5 text-[0.95rem] placeholder:text-ink-400 hover:border-ink-400"
        />
        <div className="flex flex-wrap items-center gap-2">
          <Button onClick={confirm} isLoading={importRevision.isPending} disabled={noteMissing || changes.length === 0}>
            Import as revision {next}
          </Button>
          <Button variant="secondary" onClick={onClose} disabled={importRevision.isPending}>
            Cancel
          </Button>
          {changes.length > 0 && noteMissing ? <span className="text-sm text-ink-600">Write the change note first.</span> : null}
        </div>
        {error ? (
          <div role="alert" className="text-sm font-semibold text-signal-700">
            <p>
              The study file was not imported{issues.length > 0 ? ` (${issues.length} problem${issues.length === 1 ? "" : "s"})` : ""}; nothing
              was stored. {issues.length === 0 ? error.message : null}
            </p>
            {issues.length > 0 ? <StudyIssueList issues={issues} /> : null}
          </div>
        ) : null}
      </div>
    </Card>
  );
}
