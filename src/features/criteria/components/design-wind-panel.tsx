import { useEffect, useRef, useState } from "react";
import type { ProjectCriteria, ProjectCriteriaDto } from "@shared/schemas/criteria";
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
import { DesignWindDerivation } from "@/features/criteria/components/design-wind-derivation";
import { RequiredSpeedsTable } from "@/features/criteria/components/required-speeds-table";
import { SourceList } from "@/features/criteria/components/source-badge";
import { sig } from "@/features/criteria/utils/format";

interface DesignWindPanelProps {
  projectId: string;
  /** Analysts and administrators edit; reviewers and viewers read. The server enforces the same rule. */
  canEdit: boolean;
  className?: string;
}

function probabilityText(probability: ProjectCriteria["wind"]["probability"]): string {
  switch (probability.kind) {
    case "return-period":
      return `return period ${sig(probability.years)} years`;
    case "annual-probability":
      return `annual probability of exceedance ${sig(probability.value)}`;
    case "factor":
      return `c_prob = ${sig(probability.value)} given: ${probability.basis}`;
  }
}

function terrainText(terrain: ProjectCriteria["wind"]["terrain"]): string {
  return terrain.kind === "category"
    ? `category ${terrain.category} (EN 1991-1-4 Table 4.1)`
    : `z0 = ${sig(terrain.roughnessLength)} m, z_min = ${sig(terrain.minimumHeight)} m (site values)`;
}

function SavedView({ dto }: { dto: ProjectCriteriaDto & { criteria: ProjectCriteria; evaluated: NonNullable<ProjectCriteriaDto["evaluated"]> } }) {
  const { wind, notes } = dto.criteria;
  const { designWind, required } = dto.evaluated;
  return (
    <div className="space-y-4">
      <div className="grid gap-4 lg:grid-cols-[minmax(14rem,0.8fr)_minmax(0,2fr)]">
        <section aria-label="Wind inputs">
          <h3 className="mb-1 text-sm font-semibold tracking-wide text-ink-600 uppercase">Inputs</h3>
          <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-1 text-[0.95rem]">
            <dt className="text-ink-600">Basic wind speed v_b</dt>
            <dd className="num" data-testid="basic-speed">{sig(wind.basicSpeed)} m/s</dd>
            <dt className="text-ink-600">Probability</dt>
            <dd>{probabilityText(wind.probability)}</dd>
            <dt className="text-ink-600">Terrain</dt>
            <dd>{terrainText(wind.terrain)}</dd>
            <dt className="text-ink-600">Deck height z</dt>
            <dd className="num">{sig(wind.deckHeight)} m</dd>
            <dt className="text-ink-600">Orography c_o</dt>
            <dd className="num">{sig(wind.orographyFactor)}</dd>
          </dl>
        </section>
        <section aria-label="Design wind at deck level">
          <DesignWindDerivation wind={designWind} />
        </section>
      </div>
      <section aria-labelledby="required-speeds-heading" className="space-y-1">
        <h3 id="required-speeds-heading" className="text-sm font-semibold tracking-wide text-ink-600 uppercase">
          Required speeds
        </h3>
        <RequiredSpeedsTable required={required} meanSpeedMps={designWind.meanSpeedMps} />
      </section>
      {notes ? (
        <section aria-label="Notes on the criteria">
          <h3 className="text-sm font-semibold tracking-wide text-ink-600 uppercase">Notes</h3>
          <p className="max-w-prose whitespace-pre-line text-ink-800">{notes}</p>
        </section>
      ) : null}
      <details className="text-sm">
        <summary className="w-fit cursor-pointer font-semibold text-tide-700 hover:underline">
          Sources of the wind profile
        </summary>
        <SourceList sources={designWind.sources} className="mt-1" />
      </details>
    </div>
  );
}

/**
 * The project's design wind at deck level and acceptance criteria: every factor with its clause, the required
 * speed per phenomenon with its basis, the saved versions, and the editor for analysts.
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
            <SavedView dto={{ ...criteria.data, criteria: criteria.data.criteria, evaluated: criteria.data.evaluated }} />
          ) : (
            <p className="text-ink-700">
              No design wind recorded for this project yet
              {canEdit ? "." : ": an analyst of the project sets it."} Without it no required speeds or margins can be shown.
            </p>
          )}
          {!canEdit && criteria.data.version ? (
            <p className="text-sm text-ink-600">Read-only: the project's analysts edit the criteria.</p>
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
