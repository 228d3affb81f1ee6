import { evaluateCriteria } from "@shared/criteria/evaluate-criteria";
import { unconfirmedBases } from "@shared/criteria/basis-confirmation";
import type { ProjectCriteria, ProjectCriteriaVersionDto } from "@shared/schemas/criteria";
import { ErrorPanel } from "@/components/ui/error-panel";
import { LoadingBlock } from "@/components/ui/spinner";
import { ApiError } from "@/lib/api-client";
import { formatDateTime } from "@/lib/format";
import { useCriteriaHistory } from "@/features/criteria/api/get-criteria-history";
import { PHENOMENON_LABEL } from "@/features/criteria/components/phenomenon-labels";
import { fixed, sig } from "@/features/criteria/utils/format";

function windSummary(criteria: ProjectCriteria): string {
  const { wind } = criteria;
  const terrain =
    wind.terrain.kind === "category"
      ? `category ${wind.terrain.category}`
      : `z0 ${sig(wind.terrain.roughnessLength)} m`;
  const probability =
    wind.probability.kind === "return-period"
      ? `T ${sig(wind.probability.years)} yr`
      : wind.probability.kind === "annual-probability"
        ? `p ${sig(wind.probability.value)}`
        : `c_prob ${sig(wind.probability.value)}`;
  return `v_b ${sig(wind.basicSpeed)} m/s · ${probability} · ${terrain} · z ${sig(wind.deckHeight)} m`;
}

/** "all confirmed", or the phenomena whose basis stood unconfirmed in that version (a default text named as such). */
function basesSummary(bases: ProjectCriteriaVersionDto["bases"]) {
  const open = unconfirmedBases(bases);
  if (open.length === 0) return <span className="text-ink-700">all confirmed</span>;
  return (
    <span className="text-caution-700">
      not confirmed: {open.map((u) => `${PHENOMENON_LABEL[u.phenomenon].toLowerCase()}${u.defaultText ? " (default text)" : ""}`).join(", ")}
    </span>
  );
}

/**
 * Every saved version, newest first, with v_m and the flutter requirement recomputed from what was saved, and
 * whether every basis stood confirmed in it.
 */
export function CriteriaHistory({ projectId }: { projectId: string }) {
  const history = useCriteriaHistory(projectId);
  if (history.isPending) return <LoadingBlock label="Loading the saved versions…" className="min-h-16" />;
  if (history.isError) {
    return (
      <ErrorPanel
        title="The history could not be loaded"
        message={history.error.message}
        code={history.error instanceof ApiError ? history.error.code : undefined}
        onRetry={() => void history.refetch()}
        isRetrying={history.isFetching}
      />
    );
  }
  if (history.data.length === 0) return <p className="text-sm text-ink-600">No version saved yet.</p>;
  return (
    <div className="relative overflow-x-auto">
      <table className="w-full text-sm">
        <caption className="sr-only">Saved versions of the design wind and criteria, newest first</caption>
        <thead>
          <tr className="border-b border-ink-200 text-left text-xs tracking-wide text-ink-600 uppercase">
            <th scope="col" className="py-1 pr-3 font-semibold">Version</th>
            <th scope="col" className="py-1 pr-3 font-semibold">Saved</th>
            <th scope="col" className="py-1 pr-3 font-semibold">By</th>
            <th scope="col" className="py-1 pr-3 font-semibold">Wind inputs</th>
            <th scope="col" className="py-1 pr-3 text-right font-semibold normal-case">v_m</th>
            <th scope="col" className="py-1 pr-3 text-right font-semibold">Flutter required</th>
            <th scope="col" className="py-1 font-semibold">Bases</th>
          </tr>
        </thead>
        <tbody>
          {history.data.map((entry) => {
            const evaluated = evaluateCriteria(entry.criteria);
            return (
              <tr key={entry.version} className="border-b border-ink-100 last:border-b-0">
                <th scope="row" className="num py-1.5 pr-3 text-left font-semibold">
                  {entry.version}
                </th>
                <td className="num py-1.5 pr-3 whitespace-nowrap">
                  <time dateTime={entry.savedAt}>{formatDateTime(entry.savedAt)}</time>
                </td>
                <td className="py-1.5 pr-3">{entry.savedBy?.name ?? "—"}</td>
                <td className="num py-1.5 pr-3 text-ink-700">{windSummary(entry.criteria)}</td>
                <td className="num py-1.5 pr-3 text-right whitespace-nowrap">{fixed(evaluated.designWind.meanSpeedMps, 2)} m/s</td>
                <td className="num py-1.5 pr-3 text-right whitespace-nowrap">
                  {fixed(evaluated.required.flutter.requiredSpeedMps, 2)} m/s
                </td>
                <td className="py-1.5">{basesSummary(entry.bases)}</td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
