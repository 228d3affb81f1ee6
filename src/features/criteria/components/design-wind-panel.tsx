import { useEffect, useRef, useState } from "react";
import { Button } from "@/components/ui/button";
import { Card } from "@/components/ui/card";
import { CautionsLine } from "@/components/ui/cautions";
import { ErrorPanel } from "@/components/ui/error-panel";
import { LoadingBlock } from "@/components/ui/spinner";
import { ApiError } from "@/lib/api-client";
import { formatDateTime } from "@/lib/format";
import { useCriteria } from "@/features/criteria/api/get-criteria";
import { CriteriaForm } from "@/features/criteria/components/criteria-form";
import { CriteriaHistory } from "@/features/criteria/components/criteria-history";
import { SavedView } from "@/features/criteria/components/saved-criteria-view";

interface DesignWindPanelProps {
  projectId: string;
  /** Reviewers and administrators own the criteria; analysts and viewers read. The server enforces the same rule. */
  canEdit: boolean;
  className?: string;
}

/**
 * The project's design wind at deck level and acceptance criteria: every factor with its clause, the required
 * speed per phenomenon with its basis and who stands behind it, the saved versions, and the editor for the criteria
 * owners (reviewers and administrators).
 */
export function DesignWindPanel({ projectId, canEdit, className }: DesignWindPanelProps) {
  const criteria = useCriteria(projectId);
  const [editing, setEditing] = useState(false);
  const [showHistory, setShowHistory] = useState(false);
  const [savedVersion, setSavedVersion] = useState<number | null>(null);
  const editButton = useRef<HTMLSpanElement>(null);

  const returnFocus = useRef(false);
  const closeEditor = () => {
    returnFocus.current = true;
    setEditing(false);
  };
  useEffect(() => {
    // The editor has unmounted: give focus back to the control that opened it.
    if (!editing && returnFocus.current) {
      returnFocus.current = false;
      editButton.current?.querySelector("button")?.focus();
    }
  }, [editing]);

  const dto = criteria.data;
  const subtitle = dto?.version
    ? `Version ${dto.version}${dto.savedAt ? ` · saved ${formatDateTime(dto.savedAt)}` : ""}${dto.savedBy ? ` by ${dto.savedBy.name}` : ""}`
    : "EN 1991-1-4 §4.2–4.3 mean wind profile; factors per phenomenon";

  const actions = dto ? (
    <>
      {dto.version ? (
        <Button variant="ghost" size="sm" aria-expanded={showHistory} onClick={() => setShowHistory((v) => !v)}>
          {showHistory ? "Hide history" : "History"}
        </Button>
      ) : null}
      {canEdit && !editing ? (
        <span ref={editButton} className="contents">
          <Button
            variant="secondary"
            size="sm"
            onClick={() => {
              setSavedVersion(null);
              setEditing(true);
            }}
          >
            {dto.version ? "Edit criteria" : "Set the design wind"}
          </Button>
        </span>
      ) : null}
    </>
  ) : undefined;

  return (
    <Card
      title="Design wind and acceptance criteria"
      aria-label="Design wind and acceptance criteria"
      subtitle={subtitle}
      actions={actions}
      className={className}
    >
      {criteria.isPending ? (
        <LoadingBlock label="Loading the design wind…" />
      ) : criteria.isError ? (
        <ErrorPanel
          title="The design wind could not be loaded"
          message={criteria.error.message}
          code={criteria.error instanceof ApiError ? criteria.error.code : undefined}
          onRetry={() => void criteria.refetch()}
          isRetrying={criteria.isFetching}
        />
      ) : (
        <div className="space-y-4">
          {savedVersion !== null ? (
            <p role="status" className="rounded-md bg-steady-100 px-3 py-1.5 text-sm font-semibold text-steady-700">
              Saved as version {savedVersion}.
            </p>
          ) : null}
          {editing ? (
            <CriteriaForm
              key={criteria.data.version ?? 0}
              projectId={projectId}
              current={criteria.data}
              onSaved={(saved) => {
                setSavedVersion(saved.version);
                closeEditor();
              }}
              onCancel={closeEditor}
              onReload={() => criteria.refetch()}
            />
          ) : criteria.data.criteria && criteria.data.evaluated ? (
            <SavedView
              projectId={projectId}
              canEdit={canEdit}
              dto={{ ...criteria.data, criteria: criteria.data.criteria, evaluated: criteria.data.evaluated }}
            />
          ) : (
            <p className="text-ink-700">
              No design wind recorded for this project yet
              {canEdit ? "." : ": a reviewer of the project or an administrator sets it."} Without it no required speeds or margins can be shown.
            </p>
          )}
          {!canEdit && criteria.data.version ? (
            <p className="text-sm text-ink-600">Read-only: the project's reviewers and administrators own the criteria.</p>
          ) : null}
          {showHistory ? (
            <section aria-labelledby="criteria-history-heading" className="space-y-1 border-t border-ink-100 pt-3">
              <h3 id="criteria-history-heading" className="text-sm font-semibold tracking-wide text-ink-600 uppercase">
                Saved versions
              </h3>
              <CriteriaHistory projectId={projectId} />
            </section>
          ) : null}
          <CautionsLine />
        </div>
      )}
    </Card>
  );
}
