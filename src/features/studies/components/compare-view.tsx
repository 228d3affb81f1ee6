import { useMemo } from "react";
import { Link, useSearchParams } from "react-router-dom";
import type { ComparisonDto } from "@shared/schemas/comparison";
import type { RevisionDto } from "@shared/schemas/revisions";
import type { StabilityMargin } from "@shared/schemas/assessment";
import type { StudyAerodynamics } from "@shared/schemas/study";
import { Card } from "@/components/ui/card";
import { PageHeader } from "@/components/ui/page-header";
import { LoadingBlock } from "@/components/ui/spinner";
import { paths } from "@/config/paths";
import { cn } from "@/lib/cn";
import { divergenceFigure, flutterTone, VERDICT_TEXT_TONE, VERDICT_WORD } from "@/lib/verdict";
import { useComparison } from "@/features/studies/api/get-comparison";
import { useRevisionList } from "@/features/studies/api/get-revision";
import { ResultPlots } from "@/features/studies/components/result-plots";
import { queryErrorPanel } from "@/features/studies/components/study-workspace";
import { seriesColour } from "@/components/ui/plot-theme";

const MAX = 4;

/** Full name of a revision for column heads: "Twin box · Baseline r3". */
function labelOf(revision: RevisionDto, comparison: ComparisonDto | undefined): string {
  const row = comparison?.rows.find((r) => r.studyId === revision.studyId);
  return `${row ? `${row.alternativeName} · ` : ""}${revision.studyName} r${revision.number}`;
}

/** The leading words of a name, up to a dash or bracket ("B — single box (invented)" → "B"), at most 24 characters. */
function shortName(name: string): string {
  const head = name.split(/\s[—–(·]|\s-\s/)[0].trim();
  return head.length <= 24 ? head : `${head.slice(0, 23)}…`;
}

/**
 * Legend names for plots: "r3" when every picked revision belongs to one study, else the alternative's (or the
 * study's) short name and the revision ("B r3"); the table heads carry the full names.
 */
function legendNames(revisions: readonly RevisionDto[], comparison: ComparisonDto | undefined): string[] {
  const oneStudy = new Set(revisions.map((r) => r.studyId)).size === 1;
  if (oneStudy) return revisions.map((r) => `r${r.number}`);
  const alternativesDiffer = new Set(revisions.map((r) => r.alternativeId)).size === revisions.length;
  return revisions.map((r) => {
    const row = comparison?.rows.find((x) => x.studyId === r.studyId);
    const base = alternativesDiffer && row ? shortName(row.alternativeName) : shortName(r.studyName);
    return `${base} r${r.number}`;
  });
}

/**
 * Two to four revisions — of one study or of different deck alternatives — side by side: damping and pole
 * paths overlaid (colour per revision, dash per branch) and a table of critical speeds and margins, every figure
 * read from the revisions' assessments.
 */
export function CompareView({ projectId }: { projectId: string }) {
  const [search, setSearch] = useSearchParams();
  const selected = (search.get("revisions") ?? "").split(",").filter(Boolean).slice(0, MAX);
  const comparison = useComparison(projectId);
  const revisions = useRevisionList(selected);
  const loaded = revisions.every((q) => q.isSuccess);
  const runs = useMemo(
    () => {
      if (!loaded) return [];
      const names = legendNames(revisions.map((q) => q.data!), comparison.data);
      return revisions.map((q, i) => ({ name: names[i], result: q.data!.result, assessment: q.data!.assessment.assessment }));
    },
    // eslint-disable-next-line react-hooks/exhaustive-deps
    [loaded, selected.join(","), comparison.data],
  );

  const toggle = (revisionId: string) => {
    const next = selected.includes(revisionId) ? selected.filter((id) => id !== revisionId) : [...selected, revisionId].slice(-MAX);
    setSearch(next.length ? { revisions: next.join(",") } : {}, { replace: true });
  };

  const pickLatest = () => {
    const ids = (comparison.data?.rows ?? []).flatMap((r) => (r.latest ? [r.latest.revisionId] : [])).slice(0, MAX);
    setSearch(ids.length ? { revisions: ids.join(",") } : {}, { replace: true });
  };

  return (
    <>
      <PageHeader
        eyebrow={<Link to={paths.app.project.getHref(projectId)} className="text-tide-700 hover:underline">← Project</Link>}
        title="Compare"
        description="Pick two to four revisions — of one study or across deck alternatives — to overlay their results."
      />
      <div className="grid items-start gap-4 lg:grid-cols-[18rem_minmax(0,1fr)]">
        <Card title="Revisions" subtitle={`${selected.length} of ${MAX} picked`} actions={
          <button type="button" onClick={pickLatest} className="text-sm font-semibold text-tide-700 hover:underline">Latest of each</button>
        } flush>
          {comparison.isPending ? (
            <LoadingBlock label="Loading the studies…" />
          ) : comparison.isError ? (
            <div className="p-3">{queryErrorPanel("The studies could not be loaded", comparison.error, () => void comparison.refetch(), comparison.isFetching)}</div>
          ) : (
            <div className="max-h-[32rem] divide-y divide-ink-100 overflow-y-auto">
              {comparison.data.trends.map((trend) => (
                <fieldset key={trend.studyId} className="px-4 py-2">
                  <legend className="text-sm font-semibold text-ink-900">{trend.alternativeName} · {trend.studyName}</legend>
                  <ul className="mt-1 space-y-0.5">
                    {[...trend.points].sort((a, b) => b.number - a.number).map((point) => {
                      const index = selected.indexOf(point.revisionId);
                      return (
                        <li key={point.revisionId}>
                          <label className="grid grid-cols-[auto_minmax(0,1fr)] items-baseline gap-x-2 text-sm">
                            <input type="checkbox" checked={index >= 0} onChange={() => toggle(point.revisionId)}
                              aria-label={`${trend.alternativeName} ${trend.studyName} revision ${point.number}`} className="accent-tide-600" />
                            <span className="num whitespace-nowrap">
                              <span className="font-semibold" style={index >= 0 ? { color: seriesColour(index) } : undefined}>r{point.number}</span>{" "}
                              <span className="text-ink-700">{point.flutterSpeedMps !== null ? `${point.flutterSpeedMps.toFixed(2)} m/s` : "no flutter"}</span>
                            </span>
                            {point.changeNote ? (
                              <span className="col-start-2 truncate text-xs text-ink-600" title={point.changeNote}>{point.changeNote}</span>
                            ) : null}
                          </label>
                        </li>
                      );
                    })}
                  </ul>
                </fieldset>
              ))}
            </div>
          )}
        </Card>

        <div className="space-y-4">
          {selected.length < 2 ? (
            <Card title="Nothing to compare yet">
              <p className="text-ink-700">Pick at least two revisions on the left, or take the latest revision of each study.</p>
            </Card>
          ) : revisions.some((q) => q.isError) ? (
            queryErrorPanel("A revision could not be loaded", revisions.find((q) => q.isError)!.error!, () => revisions.forEach((q) => void q.refetch()), false)
          ) : !loaded ? (
            <LoadingBlock label="Loading the revisions…" className="min-h-96" />
          ) : (
            <>
              <ComparisonTable revisions={revisions.map((q) => q.data!)} comparison={comparison.data} />
              <ResultPlots runs={runs} />
            </>
          )}
        </div>
      </div>
    </>
  );
}

function ComparisonTable({ revisions, comparison }: { revisions: RevisionDto[]; comparison: ComparisonDto | undefined }) {
  const legend = legendNames(revisions, comparison);
  const columns = revisions.map((revision) => ({ revision, a: revision.assessment.assessment }));
  const rows: Array<{ label: string; cell: (c: (typeof columns)[number]) => React.ReactNode }> = [
    {
      label: "Flutter speed",
      cell: ({ a }) => (a.flutter.found ? <b className={flutterTone(a)}>{a.flutter.speedMps.toFixed(2)} m/s</b> : `none up to ${a.flutter.upToMps.toFixed(2)} m/s`),
    },
    { label: "Flutter frequency", cell: ({ a }) => (a.flutter.found ? `${a.flutter.frequencyHz.toFixed(4)} Hz` : "—") },
    { label: "Reduced velocity", cell: ({ a }) => (a.flutter.found ? a.flutter.reducedVelocity.toFixed(2) : "—") },
    { label: "Tested range", cell: ({ a }) => (a.flutter.found ? a.flutter.testedRange.statement.split(" (")[0] : "—") },
    { label: "Kind", cell: ({ a }) => (a.flutter.found ? a.flutter.kind : "—") },
    {
      label: "Divergence, closed form",
      cell: ({ a }) => {
        const c = a.divergence.closedForm;
        return c.speedMps !== null ? `${c.speedMps.toFixed(2)} m/s${c.withinSweep ? "" : " (beyond sweep)"}` : "none";
      },
    },
    {
      label: "Divergence, static instability",
      cell: ({ a }) => {
        const st = a.divergence.staticInstability;
        return st.speedMps !== null ? `${st.speedMps.toFixed(2)} m/s${st.branch ? ` (${st.branch})` : ""}` : "none";
      },
    },
    {
      label: "Divergence margin uses",
      cell: ({ a }) => (
        <>
          {divergenceFigure(a)}
          <span className="block max-w-64 text-xs font-normal whitespace-normal text-ink-600">{a.divergence.marginBasis}</span>
        </>
      ),
    },
    { label: "Selberg estimate", cell: ({ a }) => (a.selberg.speedMps !== null ? `${a.selberg.speedMps.toFixed(2)} m/s` : "n/a") },
    { label: "Flutter margin", cell: ({ a }) => <MarginCell margin={a.margins?.flutter ?? null} /> },
    { label: "Divergence margin", cell: ({ a }) => <MarginCell margin={a.margins?.divergence ?? null} /> },
    { label: "f_h / f_α", cell: ({ revision: r }) => r.study.structure.modes.map((m) => `${m.frequency}`).join(" / ") + " Hz" },
    { label: "Aerodynamics", cell: ({ revision: r }) => aerodynamicsText(r.study.aerodynamics) },
    { label: "Warnings", cell: ({ a }) => (a.warningCount ? `${a.warningCount}: ${[...new Set(a.warnings.map((w) => w.title))].join("; ")}` : "none") },
  ];
  return (
    <Card title="Critical speeds and margins" flush>
      <div className="overflow-x-auto">
        <table className="w-full text-left text-sm" aria-label="Critical speeds and margins side by side">
          <thead>
            <tr className="border-b border-ink-200 bg-ink-50">
              <th scope="col" className="px-4 py-1.5 text-xs font-semibold tracking-wide text-ink-600 uppercase">Quantity</th>
              {columns.map(({ revision }, i) => (
                <th key={revision.id} scope="col" className="px-2 py-1.5 font-semibold" style={{ color: seriesColour(i) }}>
                  <span className="block">{legend[i]}</span>
                  <span className="block text-xs font-normal text-ink-700">{labelOf(revision, comparison)}</span>
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {rows.map((row) => (
              <tr key={row.label} className="border-b border-ink-100 last:border-b-0">
                <th scope="row" className="px-4 py-1 font-normal text-ink-700">{row.label}</th>
                {columns.map((c) => <td key={c.revision.id} className="num px-2 py-1">{row.cell(c)}</td>)}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </Card>
  );
}

function MarginCell({ margin }: { margin: StabilityMargin | null }) {
  if (!margin) return <span className="text-ink-600">no criteria</span>;
  return (
    <span className={cn("font-semibold", VERDICT_TEXT_TONE[margin.status])}>
      {VERDICT_WORD[margin.status]}
      {margin.margin !== null ? ` ${margin.marginIsLowerBound ? "≥" : ""}${margin.margin.toFixed(2)}` : ""}
    </span>
  );
}

/** The aerodynamic model in the trade's words, with a table's tested range ("derivative table, Ur 2–16"). */
function aerodynamicsText(aero: StudyAerodynamics): string {
  if (aero.model === "flat-plate") return "thin plate (Theodorsen)";
  if (aero.model === "quasi-steady") return "quasi-steady (static slopes)";
  const ur = aero.reducedVelocity;
  return `derivative table, Ur ${ur[0]}–${ur[ur.length - 1]}`;
}
