import { useState } from "react";
import type { SweepResult } from "@shared/schemas/result";
import type { ScreeningOptions, ScreeningStudy } from "@shared/schemas/criteria";
import { Card } from "@/components/ui/card";
import { ErrorPanel } from "@/components/ui/error-panel";
import { LoadingBlock } from "@/components/ui/spinner";
import { ApiError } from "@/lib/api-client";
import { cn } from "@/lib/cn";
import { useCriteria } from "@/features/criteria/api/get-criteria";
import { useScreening } from "@/features/criteria/api/run-screening";
import { MarginsBlock } from "@/features/criteria/components/margins-block";
import { ScreeningOptionsForm } from "@/features/criteria/components/screening-options-form";
import { ScreeningTable } from "@/features/criteria/components/screening-table";

interface StudyChecksProps {
  projectId: string;
  /** The study document being viewed; null while it is not valid (nothing is screened). */
  study: ScreeningStudy | null;
  /** Its sweep result, for the margins of flutter and divergence and the engine's divergence beside the closed form. */
  result?: Pick<SweepResult, "flutter" | "divergence" | "modes" | "warnings"> | null;
  /** Measured values to start from (St, a_G, static coefficients); the user can change them in the panel. */
  options?: ScreeningOptions;
  className?: string;
}

/**
 * The criteria side of a study for the workspace: margins per phenomenon (from `sweepMargins`, when a result is
 * there) and the screening table, fed by POST /api/screening with the study and the project.
 */
export function StudyChecks({ projectId, study, result, options: initialOptions, className }: StudyChecksProps) {
  const [options, setOptions] = useState<ScreeningOptions>(initialOptions ?? {});
  const criteria = useCriteria(projectId);
  const screening = useScreening(study ? { study, projectId, options: Object.keys(options).length ? options : undefined } : null);
  const required = criteria.data?.evaluated?.required ?? null;

  return (
    <div className={cn("space-y-4", className)}>
      {result ? (
        <Card title="Margins" aria-label="Margins" subtitle="Critical / required speed: stability limits pass when ≥ 1; a vortex-shedding onset below it is to investigate">
          {criteria.isPending || (screening.isPending && study !== null) ? (
            <LoadingBlock label="Loading the required speeds…" className="min-h-16" />
          ) : criteria.isError ? (
            <ErrorPanel
              title="The project's criteria could not be loaded"
              message={criteria.error.message}
              onRetry={() => void criteria.refetch()}
              isRetrying={criteria.isFetching}
            />
          ) : (
            <MarginsBlock result={result} required={required} screening={screening.data ?? null} />
          )}
        </Card>
      ) : null}
      <Card
        title="Screening: vortex shedding, galloping, divergence"
        aria-label="Screening"
        subtitle="EN 1991-1-4 Annex E and Den Hartog; simplified single-mode checks"
        aria-busy={screening.isFetching || undefined}
      >
        <div className="space-y-3">
          <ScreeningOptionsForm value={options} onApply={setOptions} disabled={study === null} />
          {study === null ? (
            <p className="text-sm text-ink-700">Screening waits for a valid study (fix the highlighted inputs).</p>
          ) : screening.isPending ? (
            <LoadingBlock label="Screening the study…" />
          ) : screening.isError ? (
            <ErrorPanel
              title="The screening could not be run"
              message={screening.error.message}
              code={screening.error instanceof ApiError ? screening.error.code : undefined}
              onRetry={() => void screening.refetch()}
              isRetrying={screening.isFetching}
            />
          ) : (
            <ScreeningTable
              screening={screening.data}
              engine={result ? { speedMps: result.divergence?.speed ?? null, warnings: result.warnings } : null}
            />
          )}
        </div>
      </Card>
    </div>
  );
}
