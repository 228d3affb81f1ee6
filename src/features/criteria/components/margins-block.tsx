import type { Margins } from "@shared/criteria/margins";
import type { RequiredSpeeds } from "@shared/criteria/required-speeds";
import type { ScreeningResult } from "@shared/criteria/screen-study";
import { sweepMargins } from "@shared/criteria/sweep-margins";
import type { SweepResult } from "@shared/schemas/result";
import { PHENOMENA } from "@shared/schemas/criteria";
import { cn } from "@/lib/cn";
import { PHENOMENON_LABEL } from "@/features/criteria/components/phenomenon-labels";
import { MarginStatusBadge } from "@/features/criteria/components/status-badge";
import { fixed } from "@/features/criteria/utils/format";

/**
 * Critical / required per phenomenon with its status: pass or fail for the stability limits, investigate or clear
 * for the vortex-shedding onset, not evaluated with the reason. Only a failed stability check takes the failure colour.
 */
export function MarginsTable({ margins, className }: { margins: Margins; className?: string }) {
  // relative: the caption's sr-only (absolute) text stays inside the scroller instead of widening the page.
  return (
    <div className={cn("relative overflow-x-auto", className)}>
      <table className="w-full text-sm" data-testid="margins-table">
        <caption className="sr-only">Margins: critical speed over required speed per phenomenon</caption>
        <thead>
          <tr className="border-b border-ink-200 text-left text-xs tracking-wide text-ink-600 uppercase">
            <th scope="col" className="py-1 pr-3 font-semibold">Phenomenon</th>
            <th scope="col" className="py-1 pr-3 text-right font-semibold">Critical</th>
            <th scope="col" className="py-1 pr-3 text-right font-semibold">Required</th>
            <th scope="col" className="py-1 pr-3 text-right font-semibold">Margin</th>
            <th scope="col" className="py-1 pr-3 font-semibold">Status</th>
            <th scope="col" className="py-1 font-semibold">Statement</th>
          </tr>
        </thead>
        <tbody>
          {PHENOMENA.map((phenomenon) => {
            const margin = margins[phenomenon];
            const critical =
              margin.criticalSpeedMps !== null
                ? `${fixed(margin.criticalSpeedMps, 2)} m/s`
                : margin.marginIsLowerBound && margin.margin !== null
                  ? `> ${fixed(margin.margin * margin.requiredSpeedMps, 1)} m/s`
                  : "—";
            const ratio = margin.margin === null ? "—" : `${margin.marginIsLowerBound ? "≥ " : ""}${fixed(margin.margin, 2)}`;
            return (
              <tr key={phenomenon} data-phenomenon={phenomenon} className="border-b border-ink-100 align-top last:border-b-0">
                <th scope="row" className="py-1.5 pr-3 text-left font-semibold whitespace-nowrap text-ink-900">
                  {PHENOMENON_LABEL[phenomenon]}
                </th>
                <td className="num py-1.5 pr-3 text-right whitespace-nowrap">{critical}</td>
                <td className="num py-1.5 pr-3 text-right whitespace-nowrap">{fixed(margin.requiredSpeedMps, 2)} m/s</td>
                <td
                  data-testid={`margin-${phenomenon}`}
                  className={cn(
                    "num py-1.5 pr-3 text-right font-semibold whitespace-nowrap",
                    margin.status === "fail" ? "text-signal-700" : "text-ink-950",
                  )}
                >
                  {ratio}
                </td>
                <td className="py-1.5 pr-3" data-testid={`status-${phenomenon}`}>
                  <MarginStatusBadge status={margin.status} />
                </td>
                <td className="py-1.5 text-ink-700">{margin.statement}</td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}

interface MarginsBlockProps {
  /** The stored (or previewed) sweep result. */
  result: Pick<SweepResult, "flutter" | "divergence" | "modes">;
  /** Required speeds from the project's criteria; null when the project has none yet. */
  required: RequiredSpeeds | null;
  /** The study's screening, for the onsets and for divergence beyond the swept range. */
  screening?: Pick<ScreeningResult, "divergence" | "galloping" | "vortexShedding"> | null;
  className?: string;
}

/**
 * Margins of a sweep result (with its screening) against the project's required speeds, by `sweepMargins`:
 * flutter and divergence from the sweep, onsets from the screening. Without criteria it says so.
 */
export function MarginsBlock({ result, required, screening, className }: MarginsBlockProps) {
  if (required === null) {
    return (
      <p className={cn("text-sm text-ink-700", className)}>
        No design wind is set for this project, so there are no required speeds to compare with. Set it on the project page.
      </p>
    );
  }
  return <MarginsTable className={className} margins={sweepMargins(result, required, screening ?? null)} />;
}
