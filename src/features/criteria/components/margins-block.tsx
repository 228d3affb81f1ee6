import type { Assessment, StabilityCheck } from "@shared/schemas/assessment";
import { STABILITY_CHECKS } from "@shared/schemas/assessment";
import { VerdictBadge } from "@/components/ui/verdict-badge";
import { cn } from "@/lib/cn";
import { PHENOMENON_LABEL } from "@/features/criteria/components/phenomenon-labels";
import { fixed } from "@/features/criteria/utils/format";

/**
 * The stability margins of an assessment — critical ÷ required speed with its verdict and statement, the divergence
 * row naming the figure it uses — and, apart from them, the vortex-shedding onset as a screening result in its own
 * words. Only a failed check takes the failure colour.
 */
export function MarginsTable({ assessment, className }: { assessment: Assessment; className?: string }) {
  const margins = assessment.margins;
  if (!margins) {
    return <p className={cn("text-sm text-ink-700", className)}>{assessment.criteriaNote ?? "No criteria: no margins."}</p>;
  }
  const label = (check: StabilityCheck) =>
    check === "divergence"
      ? `${PHENOMENON_LABEL.divergence} (${assessment.divergence.governing === "static-instability" ? "static instability" : "closed form"})`
      : PHENOMENON_LABEL[check];
  // relative: the caption's sr-only (absolute) text stays inside the scroller instead of widening the page.
  return (
    <div className={cn("space-y-2", className)}>
      <div className="relative overflow-x-auto">
        <table className="w-full text-sm" data-testid="margins-table">
          <caption className="sr-only">Stability margins: critical speed over required speed</caption>
          <thead>
            <tr className="border-b border-ink-200 text-left text-xs tracking-wide text-ink-600 uppercase">
              <th scope="col" className="py-1 pr-3 font-semibold">Stability check</th>
              <th scope="col" className="py-1 pr-3 text-right font-semibold">Critical</th>
              <th scope="col" className="py-1 pr-3 text-right font-semibold">Required</th>
              <th scope="col" className="py-1 pr-3 text-right font-semibold">Margin</th>
              <th scope="col" className="py-1 pr-3 font-semibold">Verdict</th>
              <th scope="col" className="py-1 font-semibold">Statement</th>
            </tr>
          </thead>
          <tbody>
            {STABILITY_CHECKS.map((check) => {
              const margin = margins[check];
              const critical =
                margin.criticalSpeedMps !== null
                  ? `${fixed(margin.criticalSpeedMps, 2)} m/s`
                  : margin.marginIsLowerBound && margin.margin !== null
                    ? `> ${fixed(margin.margin * margin.requiredSpeedMps, 2)} m/s`
                    : "—";
              const ratio = margin.margin === null ? "—" : `${margin.marginIsLowerBound ? "≥ " : ""}${fixed(margin.margin, 2)}`;
              return (
                <tr key={check} data-phenomenon={check} className="border-b border-ink-100 align-top last:border-b-0">
                  <th scope="row" className="py-1.5 pr-3 text-left font-semibold text-ink-900">{label(check)}</th>
                  <td className="num py-1.5 pr-3 text-right whitespace-nowrap">{critical}</td>
                  <td className="num py-1.5 pr-3 text-right whitespace-nowrap">{fixed(margin.requiredSpeedMps, 2)} m/s</td>
                  <td
                    data-testid={`margin-${check}`}
                    className={cn("num py-1.5 pr-3 text-right font-semibold whitespace-nowrap", margin.status === "fail" ? "text-signal-700" : "text-ink-950")}
                  >
                    {ratio}
                  </td>
                  <td className="py-1.5 pr-3" data-testid={`status-${check}`}>
                    <VerdictBadge status={margin.status} />
                  </td>
                  <td className="py-1.5 text-ink-700">{margin.statement}</td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
      <p className="flex items-start gap-2 text-sm" data-testid="vortex-screening">
        <VerdictBadge status={assessment.vortexShedding.status} className="mt-0.5" />
        <span>
          <span className="font-semibold">Vortex shedding (screening, not a stability margin):</span> {assessment.vortexShedding.statement}
        </span>
      </p>
    </div>
  );
}
