import { useState } from "react";
import type { Assessment } from "@shared/schemas/assessment";
import type { ScreeningOptions, ScreeningStudy } from "@shared/schemas/criteria";
import { Card } from "@/components/ui/card";
import { ErrorPanel } from "@/components/ui/error-panel";
import { LoadingBlock } from "@/components/ui/spinner";
import { ApiError } from "@/lib/api-client";
import { cn } from "@/lib/cn";
import { useScreening } from "@/features/criteria/api/run-screening";
import { MarginsTable } from "@/features/criteria/components/margins-block";
import { ScreeningOptionsForm } from "@/features/criteria/components/screening-options-form";
import { ScreeningTable } from "@/features/criteria/components/screening-table";

interface StudyChecksProps {
  projectId: string;
  /** The study document being viewed; null while it is not valid (nothing is screened). */
  study: ScreeningStudy | null;
  /** The shown result's assessment: its margins, its divergence figures, its vortex-shedding screening. */
  assessment?: Assessment | null;
  /** Measured values to start from (St, a_G, static coefficients); the user can change them in the panel. */
  options?: ScreeningOptions;
  className?: string;
}

/**
 * The criteria side of a study for the workspace: the assessment's margins (stability checks, and the vortex-shedding
 * onset as a screening result) and the screening table, fed by POST /api/screening with the study and the project —
 * with measured values the user may try there; the stored assessment uses the study's own data.
 */
export function StudyChecks({ projectId, study, assessment, options: initialOptions, className }: StudyChecksProps) {
  const [options, setOptions] = useState<ScreeningOptions>(initialOptions ?? {});
  const screening = useScreening(study ? { study, projectId, options: Object.keys(options).length ? options : undefined } : null);
  const tried = Object.keys(options).length > 0;

  return (
    <div className={cn("space-y-4", className)}>
      {assessment ? (
        <Card title="Margins" aria-label="Margins" subtitle="Critical ÷ required speed from the result's assessment: stability limits pass when ≥ 1">
          <MarginsTable assessment={assessment} />
        </Card>
      ) : null}
      <Card
        title="Screening: vortex shedding, galloping, divergence"
        aria-label="Screening"
        subtitle={
          tried
            ? "With the measured values below — a trial: the margins above are the assessment's, from the study's own data"
            : "EN 1991-1-4 Annex E and Den Hartog; simplified single-mode checks"
        }
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
            <ScreeningTable screening={screening.data} divergence={assessment?.divergence ?? null} />
          )}
        </div>
      </Card>
    </div>
  );
}
