import type { ReactNode } from "react";
import { Link } from "react-router-dom";
import type { AlternativeDto } from "@shared/schemas/alternatives";
import type { StabilityMargin } from "@shared/schemas/assessment";
import type { ComparisonDto, ComparisonRow } from "@shared/schemas/comparison";
import { Card } from "@/components/ui/card";
import { LoadingBlock } from "@/components/ui/spinner";
import { paths } from "@/config/paths";
import { ApiError } from "@/lib/api-client";
import { cn } from "@/lib/cn";
import { formatDate } from "@/lib/format";
import { divergenceFigure, flutterFigure, flutterTone, VERDICT_TEXT_TONE } from "@/lib/verdict";
import { useAlternatives } from "@/features/studies/api/get-alternatives";
import { useComparison } from "@/features/studies/api/get-comparison";
import { useDatasets } from "@/features/studies/api/get-datasets";
import { DatasetUpload } from "@/features/studies/components/dataset-upload";
import { NewAlternativeForm } from "@/features/studies/components/new-alternative-form";
import { NewStudyForm } from "@/features/studies/components/new-study-form";
import { queryErrorPanel } from "@/features/studies/components/study-workspace";

/**
 * The project's deck alternatives, each with its studies (latest critical speeds and margins against the
 * required speeds) and its aerodynamic data sets; the required speeds once the project has criteria.
 */
export function ProjectStudies({ projectId, canEdit, renderReviewState }: {
  projectId: string;
  canEdit: boolean;
  /** The review state of a study's newest revision, in its row (the review feature's, composed in src/app). */
  renderReviewState?: (studyId: string) => ReactNode;
}) {
  const alternatives = useAlternatives(projectId);
  const comparison = useComparison(projectId);

  return (
    <div className="mt-4">
      <section aria-labelledby="alternatives-heading" className="space-y-4">
        <div className="flex flex-wrap items-baseline justify-between gap-x-4 gap-y-1">
          <h2 id="alternatives-heading" className="text-lg font-semibold">Deck alternatives</h2>
          <RequiredLine comparison={comparison.data} />
          <Link to={paths.app.compare.getHref(projectId)} className="ml-auto text-sm font-semibold text-tide-700 hover:underline">Compare revisions →</Link>
        </div>
        {canEdit ? <NewAlternativeForm projectId={projectId} /> : null}
        {alternatives.isPending ? (
          <Card><LoadingBlock label="Loading the alternatives…" /></Card>
        ) : alternatives.isError ? (
          queryErrorPanel("The alternatives could not be loaded", alternatives.error, () => void alternatives.refetch(), alternatives.isFetching)
        ) : alternatives.data.length === 0 ? (
          <Card><p className="text-ink-700">No deck alternative yet.</p></Card>
        ) : (
          alternatives.data.map((alternative) => (
            <AlternativeCard key={alternative.id} projectId={projectId} alternative={alternative} canEdit={canEdit} renderReviewState={renderReviewState}
              rows={comparison.data?.rows.filter((r) => r.alternativeId === alternative.id) ?? null}
              comparisonError={comparison.isError ? comparison.error : null} />
          ))
        )}
      </section>
    </div>
  );
}

/** The required speeds the margins below are measured against (the design wind panel holds the detail). */
function RequiredLine({ comparison }: { comparison: ComparisonDto | undefined }) {
  if (!comparison) return null;
  const criteria = comparison.criteria;
  if (!criteria) return <p className="text-sm text-ink-600">No criteria yet: margins appear once the design wind is saved.</p>;
  return (
    <p className="num text-sm text-ink-700" data-testid="margins-basis">
      Margins against flutter <b className="text-ink-950">{criteria.requiredFlutterSpeedMps.toFixed(1)} m/s</b> and divergence{" "}
      <b className="text-ink-950">{criteria.requiredDivergenceSpeedMps.toFixed(1)} m/s</b> (criteria v{criteria.version}, v<sub>m</sub>{" "}
      {criteria.meanSpeedMps.toFixed(1)} m/s)
    </p>
  );
}

function MarginText({ margin }: { margin: StabilityMargin | undefined }) {
  if (!margin) return <span className="text-ink-600">—</span>;
  const word = margin.status === "undetermined" ? "extend" : margin.status === "not-evaluated" ? "—" : margin.status;
  return (
    <span className={cn("font-semibold", VERDICT_TEXT_TONE[margin.status])}>
      {word}
      {margin.margin !== null ? <span className="font-normal"> {margin.marginIsLowerBound ? "≥" : ""}{margin.margin.toFixed(2)}</span> : null}
    </span>
  );
}

function AlternativeCard({ projectId, alternative, canEdit, rows, comparisonError, renderReviewState }: {
  projectId: string; alternative: AlternativeDto; canEdit: boolean; rows: ComparisonRow[] | null; comparisonError: Error | null;
  renderReviewState?: (studyId: string) => ReactNode;
}) {
  const datasets = useDatasets(alternative.id);
  return (
    <Card
      title={alternative.name}
      subtitle={<span className="num">B = {alternative.deckWidthM} m · D = {alternative.deckDepthM} m · {alternative.studyCount} {alternative.studyCount === 1 ? "study" : "studies"} · {alternative.datasetCount} data {alternative.datasetCount === 1 ? "set" : "sets"}</span>}
      flush
    >
      {alternative.description ? <p className="px-4 pt-2 text-sm text-ink-700">{alternative.description}</p> : null}
      {comparisonError ? (
        <p className="px-4 py-2 text-sm text-signal-700">Studies could not be loaded: {comparisonError.message}</p>
      ) : rows === null ? (
        <LoadingBlock label="Loading the studies…" />
      ) : rows.length === 0 ? (
        <p className="px-4 py-2 text-sm text-ink-700">No study yet.</p>
      ) : (
        <div className="overflow-x-auto">
          <table className="w-full text-left text-sm" aria-label={`Studies of ${alternative.name}`}>
            <thead>
              <tr className="border-y border-ink-200 bg-ink-50 text-xs tracking-wide text-ink-600 uppercase">
                <th scope="col" className="px-4 py-1.5 font-semibold">Study</th>
                <th scope="col" className="px-2 py-1.5 font-semibold">Latest</th>
                <th scope="col" className="px-2 py-1.5 text-right font-semibold">Flutter</th>
                <th scope="col" className="px-2 py-1.5 text-right font-semibold">Divergence</th>
                <th scope="col" className="px-2 py-1.5 font-semibold">Flutter margin</th>
                <th scope="col" className="px-2 py-1.5 font-semibold">Div. margin</th>
                {renderReviewState ? <th scope="col" className="px-2 py-1.5 font-semibold">Review</th> : null}
              </tr>
            </thead>
            <tbody>
              {rows.map((row) => {
                const a = row.latest?.assessment.assessment;
                return (
                  <tr key={row.studyId} className="border-b border-ink-100 last:border-b-0 hover:bg-tide-50/60">
                    <th scope="row" className="px-4 py-1.5 font-semibold">
                      <Link to={paths.app.study.getHref(projectId, row.studyId)} className="text-tide-700 hover:underline">{row.studyName}</Link>
                    </th>
                    <td className="num px-2 py-1.5 whitespace-nowrap text-ink-700">
                      {row.latest ? <>r{row.latest.number} · {formatDate(row.latest.createdAt)}</> : "no revision"}
                    </td>
                    <td className="num px-2 py-1.5 text-right whitespace-nowrap">
                      {a ? <span className={cn("font-semibold", flutterTone(a))}>{flutterFigure(a)}</span> : "—"}
                    </td>
                    <td className="num px-2 py-1.5 text-right whitespace-nowrap">
                      {a ? <span title={a.divergence.marginBasis}>{divergenceFigure(a)}</span> : "—"}
                    </td>
                    <td className="num px-2 py-1.5 whitespace-nowrap"><MarginText margin={a?.margins?.flutter} /></td>
                    <td className="num px-2 py-1.5 whitespace-nowrap"><MarginText margin={a?.margins?.divergence} /></td>
                    {renderReviewState ? <td className="px-2 py-1.5">{renderReviewState(row.studyId)}</td> : null}
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
      )}
      <div className="border-t border-ink-100 px-4 py-2">
        <h3 className="text-xs font-semibold tracking-wide text-ink-600 uppercase">Aerodynamic data sets</h3>
        {datasets.isPending ? (
          <p className="text-sm text-ink-600">Loading…</p>
        ) : datasets.isError ? (
          <p className="text-sm text-signal-700">
            Could not be loaded: {datasets.error.message}
            {datasets.error instanceof ApiError ? ` (${datasets.error.code})` : ""}
          </p>
        ) : datasets.data.length === 0 ? (
          <p className="text-sm text-ink-700">None uploaded.</p>
        ) : (
          <ul className="text-sm">
            {datasets.data.map((d) => (
              <li key={d.id} className="num flex flex-wrap gap-x-2">
                <span className="font-semibold text-ink-900">{d.name}</span>
                <span className="text-ink-700">
                  {d.kind === "flutter-derivatives" ? `flutter derivatives at ${d.meanAngleDeg > 0 ? "+" : ""}${d.meanAngleDeg}°, Ur ${d.testedRange.min}–${d.testedRange.max}` : `static coefficients, ${d.testedRange.min}° to ${d.testedRange.max}°`}
                  {" · "}{d.provenance.flow} flow{d.provenance.facility ? ` · ${d.provenance.facility}` : ""}
                </span>
                {d.warnings.length > 0 ? <span className="text-caution-700">{d.warnings.length} warning{d.warnings.length > 1 ? "s" : ""}</span> : null}
              </li>
            ))}
          </ul>
        )}
        {canEdit ? <DatasetUpload alternativeId={alternative.id} projectId={projectId} /> : null}
      </div>
      {canEdit ? (
        <div className="border-t border-ink-100 px-4 py-2">
          <NewStudyForm projectId={projectId} alternative={alternative} studies={rows ?? []} />
        </div>
      ) : null}
    </Card>
  );
}
