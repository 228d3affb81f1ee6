import { useQueryClient } from "@tanstack/react-query";
import { useId, useState } from "react";
import type { FieldErrors, UseFormRegister } from "react-hook-form";
import { useNavigate } from "react-router-dom";
import { CHANGE_NOTE_MAX, staleParentDetailsSchema, type RevisionDto, type StaleParentDetails } from "@shared/schemas/revisions";
import type { StudyDocument } from "@shared/schemas/study";
import { Button } from "@/components/ui/button";
import { Card } from "@/components/ui/card";
import { ErrorPanel } from "@/components/ui/error-panel";
import { Field } from "@/components/ui/field";
import { paths } from "@/config/paths";
import { ApiError } from "@/lib/api-client";
import { formatDateTime } from "@/lib/format";
import { useCreateRevision } from "@/features/studies/api/create-revision";
import { getRevisionQueryOptions } from "@/features/studies/api/get-revision";
import { applyChanges, diffDocuments, type FieldChange } from "@/features/studies/utils/document-diff";

/** A document re-based onto a newer revision after a conflicting save. */
export interface RebasedDraft {
  revisionId: string;
  document: StudyDocument;
  baseDocument: StudyDocument;
  applied: FieldChange[];
  overridden: FieldChange[];
}

interface SaveRevisionPanelProps {
  projectId: string;
  studyId: string;
  revision: RevisionDto;
  /** The document the edit started from (to know which fields the user changed). */
  baseDocument: StudyDocument;
  /** The valid edited document, or null while the inputs have errors. */
  document: StudyDocument | null;
  register: UseFormRegister<StudyDocument>;
  errors: FieldErrors<StudyDocument>;
  blockedReason: string | null;
  onRebased: (draft: RebasedDraft) => void;
}

function staleDetails(error: unknown): StaleParentDetails | null {
  if (!(error instanceof ApiError) || error.status !== 409) return null;
  const parsed = staleParentDetailsSchema.safeParse(error.details);
  return parsed.success ? parsed.data : null;
}

/**
 * Saves the edited document as the study's next revision with a change note. When someone saved a newer
 * revision meanwhile, the server refuses (409) and nothing is lost: the panel offers to load that revision and
 * re-apply this session's edits on top of it, field by field.
 */
export function SaveRevisionPanel(props: SaveRevisionPanelProps) {
  const { projectId, studyId, revision, baseDocument, document, register, errors, blockedReason, onRebased } = props;
  const noteId = useId();
  const [note, setNote] = useState("");
  const [rebasing, setRebasing] = useState<{ failed: string | null; busy: boolean }>({ failed: null, busy: false });
  const create = useCreateRevision(studyId, projectId);
  const navigate = useNavigate();
  const queryClient = useQueryClient();
  const changes = document ? diffDocuments(baseDocument, document) : [];
  // From an older revision, saving puts these inputs on top of the latest (a restore, with or without edits).
  const isOlder = revision.number < revision.latestNumber;
  const parentRevision = isOlder ? revision.latestNumber : revision.number;
  const noteMissing = note.trim() === "";
  const conflict = staleDetails(create.error);

  const save = () => {
    if (!document || noteMissing) return;
    create.mutate(
      { parentRevision, changeNote: note.trim(), study: document },
      {
        onSuccess: (saved) => {
          setNote("");
          navigate(paths.app.study.getHref(projectId, studyId, saved.number), { replace: true });
        },
      },
    );
  };

  const rebase = async (details: StaleParentDetails) => {
    if (!document) return;
    setRebasing({ failed: null, busy: true });
    try {
      const latest = await queryClient.fetchQuery(getRevisionQueryOptions(details.latest.id));
      const edits = diffDocuments(baseDocument, document);
      const { document: rebased, overridden } = applyChanges(latest.study, edits);
      create.reset();
      setRebasing({ failed: null, busy: false });
      onRebased({ revisionId: latest.id, document: rebased, baseDocument: latest.study, applied: edits, overridden });
    } catch (error) {
      setRebasing({ failed: error instanceof Error ? error.message : String(error), busy: false });
    }
  };

  return (
    <Card
      title="Save as a new revision"
      subtitle={
        isOlder
          ? `Opened from revision ${revision.number}; saving stores these inputs as revision ${revision.latestNumber + 1}, on top of revision ${revision.latestNumber}`
          : `Starts from revision ${revision.number}; the server runs and stores the sweep`
      }
    >
      <div className="space-y-3">
        <Field label="Document name" {...register("name")} error={errors.name?.message} className="h-8" />
        <div className="space-y-1">
          <label htmlFor={noteId} className="block text-sm font-semibold text-ink-800">Change note</label>
          <textarea
            id={noteId}
            value={note}
            maxLength={CHANGE_NOTE_MAX}
            rows={2}
            onChange={(e) => setNote(e.target.value)}
            placeholder="What changed and why, e.g. torsional frequency from the updated global model"
            className="block w-full rounded-md border border-ink-300 bg-white px-2.5 py-1.5 text-[0.95rem] placeholder:text-ink-400 hover:border-ink-400"
          />
        </div>
        <div className="flex flex-wrap items-center gap-3">
          <Button onClick={save} isLoading={create.isPending} disabled={!document || noteMissing || (changes.length === 0 && !isOlder)}>
            Save revision
          </Button>
          <span className="text-sm text-ink-600">
            {!document
              ? `Cannot save: ${blockedReason}.`
              : changes.length === 0
                ? isOlder
                  ? `Unchanged from revision ${revision.number}: saving restores it as the latest — add a change note.`
                  : "No changes from the revision yet."
                : noteMissing
                  ? `${changes.length} field${changes.length > 1 ? "s" : ""} changed — add a change note.`
                  : `${changes.length} field${changes.length > 1 ? "s" : ""} changed.`}
          </span>
        </div>
        {conflict ? (
          <div role="alert" className="space-y-2 rounded-md border border-caution-400 bg-caution-100 px-3 py-2 text-sm">
            <p className="font-semibold text-caution-700">Revision {conflict.latest.number} was saved meanwhile</p>
            <p className="text-ink-900">
              {conflict.latest.author?.name ?? "Someone"} saved revision {conflict.latest.number} on{" "}
              {formatDateTime(conflict.latest.createdAt)}, after you started from revision {parentRevision}. Nothing
              was stored. Load it and re-apply your {changes.length} edit{changes.length === 1 ? "" : "s"} on top, then
              check and save again.
            </p>
            <Button variant="secondary" size="sm" isLoading={rebasing.busy} onClick={() => void rebase(conflict)}>
              Load revision {conflict.latest.number} and re-apply my edits
            </Button>
            {rebasing.failed ? <p className="text-signal-700">Could not load it: {rebasing.failed}</p> : null}
          </div>
        ) : create.isError ? (
          <ErrorPanel
            title="The revision was not saved"
            message={create.error.message}
            code={create.error instanceof ApiError ? create.error.code : undefined}
            onRetry={save}
          />
        ) : null}
        {create.isSuccess ? (
          <p role="status" className="text-sm font-semibold text-steady-700">Saved as revision {create.data.number}.</p>
        ) : null}
      </div>
    </Card>
  );
}
