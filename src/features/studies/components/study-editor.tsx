import { zodResolver } from "@hookform/resolvers/zod";
import { useMemo, useState, type ReactNode } from "react";
import { useForm, useWatch } from "react-hook-form";
import { assessRevision } from "@shared/assessment/assess-revision";
import type { Assessment } from "@shared/schemas/assessment";
import type { ProjectCriteriaDto } from "@shared/schemas/criteria";
import type { DatasetDto } from "@shared/schemas/datasets";
import type { SweepResult } from "@shared/schemas/result";
import type { RevisionDto } from "@shared/schemas/revisions";
import { studyDocumentSchema, type StudyAerodynamics, type StudyDocument } from "@shared/schemas/study";
import { Button } from "@/components/ui/button";
import { Card } from "@/components/ui/card";
import { ErrorPanel } from "@/components/ui/error-panel";
import { ApiError } from "@/lib/api-client";
import { formatDateTime } from "@/lib/format";
import { useRunSweep } from "@/features/studies/api/run-sweep";
import { AerodynamicsEditor } from "@/features/studies/components/aerodynamics-editor";
import { LeaveGuard } from "@/features/studies/components/leave-guard";
import { LivePreview } from "@/features/studies/components/live-preview";
import { ResultPlots } from "@/features/studies/components/result-plots";
import { ResultSummary } from "@/features/studies/components/result-summary";
import { SaveRevisionPanel, type RebasedDraft } from "@/features/studies/components/save-revision-panel";
import { StepsTable, type StepsSource } from "@/features/studies/components/steps-table";
import { StudyFileActions } from "@/features/studies/components/study-file-actions";
import { StructureFields } from "@/features/studies/components/structure-fields";
import { SweepFields } from "@/features/studies/components/sweep-fields";
import { useMediaQuery } from "@/features/studies/hooks/use-media-query";
import { useSweepPreview } from "@/features/studies/hooks/use-sweep-preview";
import type { CellError } from "@/features/studies/utils/derivative-grid";
import { diffDocuments } from "@/features/studies/utils/document-diff";

export interface StudyEditorProps {
  projectId: string;
  studyId: string;
  /** The revision the edit starts from (its document and stored result). */
  revision: RevisionDto;
  /** A document to start from instead of the revision's (after a re-base), with what was re-applied. */
  draft: RebasedDraft | null;
  readOnly: boolean;
  criteria: ProjectCriteriaDto | null;
  datasets: readonly DatasetDto[];
  /** Why the alternative's data sets could not be loaded, if they could not. */
  datasetsError: string | null;
  onRebased: (draft: RebasedDraft) => void;
  /** Further panels under the result (screening, all margins), composed in by the route, from the shown result's assessment. */
  renderChecks?: (document: StudyDocument, assessment: Assessment, revision: RevisionDto) => ReactNode;
  /** A panel across the full width under both columns (the revision's review), composed in by the route. */
  renderFullWidth?: (revision: RevisionDto) => ReactNode;
}

interface ShownResult {
  result: SweepResult;
  /** The document it was computed from (to tell when the inputs have moved on). */
  document: StudyDocument;
  /** What a reader is told about it: the revision's stored assessment, or, for an unsaved run, the same assessment computed here. */
  assessment: Assessment;
  source: string;
  /** Where its full step table comes from. */
  steps: StepsSource;
}

const keyOf = (value: unknown) => JSON.stringify(value);

/**
 * The study workspace proper: structure, aerodynamics and sweep inputs on the left, the browser preview and the
 * server's result on the right. Run asks the server for an unsaved result; Save stores a new revision.
 */
export function StudyEditor(props: StudyEditorProps) {
  const { projectId, studyId, revision, draft, readOnly, criteria, datasets, datasetsError, onRebased, renderChecks, renderFullWidth } = props;
  const startDocument = draft?.document ?? revision.study;
  const form = useForm<StudyDocument>({
    resolver: zodResolver(studyDocumentSchema),
    mode: "onChange",
    defaultValues: startDocument,
  });
  const { register, control, formState, setValue } = form;
  const values = useWatch({ control }) as StudyDocument;
  const [gridErrors, setGridErrors] = useState<CellError[]>([]);
  const [showKmh, setShowKmh] = useState(false);
  const [shown, setShown] = useState<ShownResult>(() => ({
    result: revision.result,
    document: revision.study,
    assessment: revision.assessment.assessment,
    source: `Stored with revision ${revision.number}`,
    steps: { revisionId: revision.id },
  }));
  const runSweep = useRunSweep();
  // Stable while typing, so the plots redraw only when a new result arrives.
  const resultRuns = useMemo(() => [{ name: "Result", result: shown.result, assessment: shown.assessment }], [shown.result, shown.assessment]);

  const valuesKey = keyOf(values);
  const parsed = useMemo(() => studyDocumentSchema.safeParse(values), [valuesKey]); // eslint-disable-line react-hooks/exhaustive-deps
  const document = parsed.success && gridErrors.length === 0 ? parsed.data : null;
  const blockedReason =
    gridErrors.length > 0
      ? `the derivative table has ${gridErrors.length} error${gridErrors.length > 1 ? "s" : ""}`
      : parsed.success
        ? null
        : "fix the marked inputs";
  // The preview starts from the revision's stored result while the inputs are still the revision's.
  const [known] = useState(() => ({ key: keyOf(form.getValues()), result: revision.result }));
  const preview = useSweepPreview(readOnly ? null : document, valuesKey, draft ? undefined : known);
  const unsaved = useMemo(
    () => (readOnly ? 0 : diffDocuments(revision.study, document ?? values).length + gridErrors.length),
    [valuesKey, gridErrors.length], // eslint-disable-line react-hooks/exhaustive-deps
  );
  const resultIsStale = useMemo(() => diffDocuments(shown.document, document ?? values).length > 0, [shown.document, valuesKey]); // eslint-disable-line react-hooks/exhaustive-deps

  const onAerodynamics = (aero: StudyAerodynamics | null, errors: CellError[]) => {
    setGridErrors(errors);
    if (aero) setValue("aerodynamics", aero, { shouldDirty: true, shouldValidate: true });
  };

  const run = () => {
    if (!document) return;
    runSweep.mutate(document, {
      onSuccess: (result) =>
        setShown({
          result,
          document,
          // Not stored: the same assessment function the server stores for a revision, against the current criteria.
          assessment: assessRevision({
            document,
            result,
            criteria: criteria?.version != null && criteria.criteria ? { version: criteria.version, criteria: criteria.criteria } : null,
          }),
          source: `Server run at ${formatDateTime(new Date().toISOString())} — not saved`,
          steps: { document },
        }),
    });
  };

  // Two columns from Tailwind's lg width (64rem; media queries read rem at the browser's 16 px). In one column
  // the preview sits right under the structure, where the edits happen, instead of after the whole form.
  const twoColumns = useMediaQuery("(min-width: 64rem)");
  const previewCard = readOnly ? null : (
    <Card title="Live preview" subtitle="Damping ratio computed in this browser while you edit">
      <LivePreview state={preview} blockedReason={blockedReason} />
    </Card>
  );

  return (
    <div className="space-y-4">
      <LeaveGuard when={unsaved > 0} what={`This study has unsaved changes (${unsaved} field${unsaved === 1 ? "" : "s"}).`} />
      {draft ? (
        <div role="status" className="rounded-md border-l-4 border-l-tide-600 bg-tide-50 px-4 py-2 text-sm">
          <p className="font-semibold text-ink-900">
            Your {draft.applied.length} edit{draft.applied.length === 1 ? "" : "s"} re-applied on revision {revision.number}.
          </p>
          {draft.overridden.length > 0 ? (
            <p className="text-ink-700">
              Revision {revision.number} had also changed {draft.overridden.map((c) => c.path).join(", ")}; your values
              were kept there — check them before saving.
            </p>
          ) : null}
        </div>
      ) : null}

      <div className="grid grid-cols-[minmax(0,1fr)] items-start gap-4 lg:grid-cols-[minmax(0,11fr)_minmax(0,12fr)]">
        <form
          aria-label="Study inputs"
          className="space-y-4"
          onSubmit={(event) => {
            event.preventDefault();
            if (!readOnly) run();
          }}
        >
          <Card title="Structure" subtitle="Section model per unit length, about the deck centre">
            <StructureFields register={register} control={control} errors={formState.errors} readOnly={readOnly} />
          </Card>
          {twoColumns ? null : previewCard}
          <Card title="Aerodynamics" subtitle="Scanlan derivatives on the full width B, K = Bω/U, h and L downward">
            <AerodynamicsEditor value={values.aerodynamics ?? startDocument.aerodynamics} readOnly={readOnly} datasets={datasets} datasetsError={datasetsError} onChange={onAerodynamics} />
          </Card>
          <Card
            title="Sweep"
            subtitle="Mean wind speed at deck level"
            actions={
              <label className="flex items-center gap-1.5 text-sm text-ink-700">
                <input type="checkbox" checked={showKmh} onChange={(e) => setShowKmh(e.target.checked)} className="size-4 accent-tide-600" />
                Show km/h
              </label>
            }
          >
            <SweepFields register={register} values={values} errors={formState.errors} readOnly={readOnly} showKmh={showKmh} />
            {!readOnly ? (
              <div className="mt-3 flex flex-wrap items-center gap-3">
                <Button type="submit" variant="accent" isLoading={runSweep.isPending} disabled={!document}>
                  Run sweep
                </Button>
                <span className="text-sm text-ink-600">
                  {document ? "Computed on the server; nothing is stored until you save." : `Cannot run: ${blockedReason}.`}
                </span>
              </div>
            ) : null}
            {runSweep.isError ? (
              <ErrorPanel
                className="mt-3"
                title="The sweep did not run"
                message={runSweep.error.message}
                code={runSweep.error instanceof ApiError ? runSweep.error.code : undefined}
                onRetry={run}
              />
            ) : null}
          </Card>
          {!readOnly ? (
            <SaveRevisionPanel
              projectId={projectId}
              studyId={studyId}
              revision={revision}
              baseDocument={draft?.baseDocument ?? revision.study}
              document={document}
              register={register}
              errors={formState.errors}
              blockedReason={blockedReason}
              onRebased={onRebased}
            />
          ) : null}
          <Card title="Study file" subtitle="The revision's document as stillspan.study/1 JSON">
            <StudyFileActions projectId={projectId} studyId={studyId} revision={revision} canEdit={!readOnly} />
          </Card>
        </form>

        <div className="space-y-4">
          {twoColumns ? previewCard : null}
          <Card
            title="Result"
            subtitle={<span data-testid="result-source">{shown.source}</span>}
            aria-busy={runSweep.isPending || undefined}
          >
            {!readOnly ? (
              <p className={resultIsStale ? "mb-2 rounded-sm bg-caution-100 px-2 py-1 text-sm text-caution-700" : "mb-2 rounded-sm bg-ink-50 px-2 py-1 text-sm text-ink-700"}>
                {resultIsStale ? "The inputs have changed since this result. Run the sweep to update it." : "This result belongs to the inputs as they are now."}
              </p>
            ) : null}
            <ResultSummary assessment={shown.assessment} showKmh={showKmh} />
            <p className="mt-2 font-mono text-xs text-ink-600">engine {shown.result.engine}</p>
          </Card>
          <ResultPlots runs={resultRuns} dimmed={runSweep.isPending} />
          {renderChecks?.(shown.document, shown.assessment, revision)}
        </div>
      </div>
      {renderFullWidth?.(revision)}
      <Card title="Steps" subtitle="Every tracked pole by speed, locally refined steps included; long sweeps are thinned here" flush>
        <StepsTable result={shown.result} source={shown.steps} />
      </Card>
    </div>
  );
}
