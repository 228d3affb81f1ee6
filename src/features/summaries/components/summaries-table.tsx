import { Link } from "react-router-dom";
import { Card } from "@/components/ui/card";
import { ErrorPanel } from "@/components/ui/error-panel";
import { LoadingBlock } from "@/components/ui/spinner";
import { paths } from "@/config/paths";
import { ApiError } from "@/lib/api-client";
import { cn } from "@/lib/cn";
import { formatDate } from "@/lib/format";
import { useSummaries } from "@/features/summaries/api/get-summaries";

const OUTCOME = {
  pass: { label: "Stability checks pass", tone: "bg-steady-100 text-steady-700" },
  fail: { label: "Fails", tone: "bg-signal-50 text-signal-700" },
  undetermined: { label: "Undetermined", tone: "bg-caution-100 text-caution-700" },
  investigate: { label: "Pass; to investigate", tone: "bg-caution-100 text-caution-700" },
} as const;
const ATTENTION_STATUS = { fail: "fails", undetermined: "undetermined", investigate: "investigate", "not-evaluated": "not evaluated" } as const;
const PHENOMENON: Record<string, string> = {
  flutter: "flutter",
  divergence: "divergence",
  vortexOnset: "vortex shedding",
  gallopingOnset: "galloping",
};

/** Every signed summary of the caller's projects, newest first, with whether each is still current. */
export function SummariesTable() {
  const summaries = useSummaries();
  if (summaries.isPending) return <LoadingBlock label="Loading the signed summaries…" />;
  if (summaries.isError) {
    return (
      <ErrorPanel
        title="The signed summaries could not be loaded"
        message={summaries.error.message}
        code={summaries.error instanceof ApiError ? summaries.error.code : undefined}
        onRetry={() => void summaries.refetch()}
        isRetrying={summaries.isFetching}
      />
    );
  }
  const rows = summaries.data;
  return (
    <Card title="Summaries" subtitle={`${rows.length} signed ${rows.length === 1 ? "summary" : "summaries"}`} flush>
      {rows.length === 0 ? (
        <p className="px-4 py-6 text-ink-700">
          No summary has been signed yet. When a reviewer signs the stability summary of a study, it appears here.
        </p>
      ) : (
        <div className="overflow-x-auto">
          <table className="w-full border-collapse text-left text-[0.95rem]">
            <thead>
              <tr className="border-b border-ink-200 bg-ink-50 text-xs tracking-wide text-ink-600 uppercase">
                <th scope="col" className="px-4 py-2 font-semibold">Study</th>
                <th scope="col" className="px-4 py-2 font-semibold">Project · alternative</th>
                <th scope="col" className="px-4 py-2 text-right font-semibold">Flutter</th>
                <th scope="col" className="px-4 py-2 font-semibold">Outcome</th>
                <th scope="col" className="px-4 py-2 font-semibold">Signed</th>
                <th scope="col" className="px-4 py-2 font-semibold">Status</th>
              </tr>
            </thead>
            <tbody>
              {rows.map((s) => (
                <tr key={s.id} className="border-b border-ink-100 last:border-b-0 hover:bg-tide-50/60">
                  <th scope="row" className="px-4 py-2 align-top font-semibold">
                    <Link to={paths.app.summary.getHref(s.id)} className="text-tide-700 underline-offset-2 hover:underline">
                      {s.studyName}, revision {s.revisionNumber}
                    </Link>
                  </th>
                  <td className="px-4 py-2 align-top text-ink-700">
                    {s.projectName}
                    <span className="block text-sm text-ink-600">{s.alternativeName}</span>
                  </td>
                  <td className="num px-4 py-2 text-right align-top whitespace-nowrap">
                    {s.flutterSpeedMps === null ? "none found" : `${s.flutterSpeedMps.toFixed(1)} m/s`}
                  </td>
                  <td className="px-4 py-2 align-top">
                    <span className={cn("rounded-sm px-1.5 py-0.5 text-sm font-semibold whitespace-nowrap", OUTCOME[s.outcome].tone)}>
                      {OUTCOME[s.outcome].label}
                    </span>
                    {s.attention.length > 0 ? (
                      <span className="mt-0.5 block text-sm text-ink-700">
                        {s.attention.map((a) => `${PHENOMENON[a.phenomenon] ?? a.phenomenon} (${ATTENTION_STATUS[a.status]})`).join(", ")}
                      </span>
                    ) : null}
                  </td>
                  <td className="px-4 py-2 align-top whitespace-nowrap text-ink-700">
                    {s.signer.name}
                    <span className="block text-sm">
                      <time dateTime={s.signedAt}>{formatDate(s.signedAt)}</time>
                    </span>
                  </td>
                  <td className="px-4 py-2 align-top text-sm">
                    {s.current ? <span className="font-semibold text-steady-700">Current</span> : <span className="font-semibold text-signal-700">Superseded</span>}
                    {s.newerUnsigned ? <span className="block text-caution-700">newer revisions in work</span> : null}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </Card>
  );
}
