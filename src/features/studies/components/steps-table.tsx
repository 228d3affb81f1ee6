import { useVirtualizer } from "@tanstack/react-virtual";
import { useMemo, useRef } from "react";
import type { SweepResult } from "@shared/schemas/result";
import type { StudyDocument } from "@shared/schemas/study";
import { Button } from "@/components/ui/button";
import { apiPaths } from "@/config/paths";
import { cn } from "@/lib/cn";
import { useDownloadSweepSteps } from "@/features/studies/api/download-sweep-steps";
import { stepRows } from "@/features/studies/utils/step-rows";

const ROW_HEIGHT = 26;
const COLUMNS = "grid-cols-[4rem_5rem_6rem_6rem_7rem_7rem_minmax(5rem,1fr)_4rem]";

/** Where the full step table of the shown result comes from: its stored revision, or a new run of its document. */
export type StepsSource = { revisionId: string } | { document: StudyDocument };

const LINK = "inline-flex h-7 items-center rounded-md border border-ink-300 bg-surface px-2.5 text-sm font-semibold text-ink-800 hover:bg-ink-50";

/**
 * The steps the result carries (all branches, ordered by speed) in a virtualised table, and the full table of
 * every solved step as a CSV or JSON download from the server. Long sweeps arrive thinned (`result.sampling`);
 * the table then says how many of the solved steps it shows.
 */
export function StepsTable({ result, source }: { result: SweepResult; source: StepsSource }) {
  const rows = useMemo(() => stepRows(result), [result]);
  const scrollRef = useRef<HTMLDivElement>(null);
  const virtualizer = useVirtualizer({
    count: rows.length,
    getScrollElement: () => scrollRef.current,
    estimateSize: () => ROW_HEIGHT,
    overscan: 12,
  });

  return (
    <div className="space-y-2">
      <div className="flex flex-wrap items-center justify-between gap-2 px-4 pt-2">
        <p className="text-sm text-ink-600" data-testid="steps-count">{countText(result, rows.length)}</p>
        <FullTableDownloads source={source} />
      </div>
      {/* On a narrow screen the columns scroll sideways together instead of widening the page. */}
      <div className="relative overflow-x-auto">
        <div role="table" aria-label="Sweep steps" aria-rowcount={rows.length + 1} className="min-w-[46rem] text-sm">
          <div role="rowgroup">
            <div role="row" className={cn("grid border-y border-ink-200 bg-ink-50 px-4 text-xs font-semibold text-ink-700", COLUMNS)}>
              {["Branch", "U (m/s)", "f (Hz)", "ζ (%)", "Re λ (rad/s)", "Im λ (rad/s)", "Participation", "MAC"].map((h) => (
                <span key={h} role="columnheader" className="py-1 pr-2 text-right first:text-left">{h}</span>
              ))}
            </div>
          </div>
          <div ref={scrollRef} className="h-72 overflow-auto" tabIndex={0} aria-label="Scroll the sweep steps">
            <div role="rowgroup" style={{ height: virtualizer.getTotalSize(), position: "relative" }}>
              {virtualizer.getVirtualItems().map((item) => {
                const row = rows[item.index];
                const unstable = row.damping < 0;
                return (
                  <div
                    key={item.key}
                    role="row"
                    aria-rowindex={item.index + 2}
                    className={cn("num absolute inset-x-0 grid border-b border-ink-100 px-4", COLUMNS, unstable && "bg-signal-50 text-signal-700")}
                    style={{ height: ROW_HEIGHT, transform: `translateY(${item.start}px)` }}
                  >
                    <span role="cell" className="py-0.5 font-mono text-xs leading-5">{row.mode}</span>
                    <span role="cell" className="py-0.5 pr-2 text-right">{row.speed.toFixed(2)}</span>
                    <span role="cell" className="py-0.5 pr-2 text-right">{row.frequency.toFixed(4)}</span>
                    <span role="cell" className="py-0.5 pr-2 text-right">{(row.damping * 100).toFixed(3)}</span>
                    <span role="cell" className="py-0.5 pr-2 text-right">{row.re.toFixed(4)}</span>
                    <span role="cell" className="py-0.5 pr-2 text-right">{row.im.toFixed(4)}</span>
                    <span role="cell" className="truncate py-0.5 pr-2 text-right text-ink-700">
                      {Object.entries(row.participation).map(([id, share]) => `${id} ${(share * 100).toFixed(0)}%`).join(" · ")}
                    </span>
                    <span role="cell" className="py-0.5 pr-2 text-right">{row.mac.toFixed(3)}</span>
                  </div>
                );
              })}
            </div>
          </div>
        </div>
      </div>
    </div>
  );
}

function countText(result: SweepResult, shownRows: number): string {
  const n = (v: number) => v.toLocaleString("en-GB");
  const sampling = result.sampling;
  const branches = result.modes.length;
  if (!sampling || sampling.shownSteps >= sampling.solvedSteps) return `${n(shownRows)} steps over ${branches} branches`;
  return (
    `${n(shownRows)} of ${n(sampling.solvedSteps * branches)} solved steps shown: each branch thinned to ${n(sampling.shownSteps)} ` +
    "speeds, keeping those around critical speeds. The full table has them all."
  );
}

/** The full table: links for a stored revision; for an unsaved run, buttons that ask the server to run it again. */
function FullTableDownloads({ source }: { source: StepsSource }) {
  const download = useDownloadSweepSteps();
  if ("revisionId" in source) {
    return (
      <div className="flex items-center gap-2 text-sm text-ink-700">
        Full table:
        <a className={LINK} href={apiPaths.revisions.steps(source.revisionId, "csv")} download>CSV</a>
        <a className={LINK} href={apiPaths.revisions.steps(source.revisionId, "json")} download>JSON</a>
      </div>
    );
  }
  return (
    <div className="flex flex-wrap items-center gap-2 text-sm text-ink-700">
      Full table:
      {(["csv", "json"] as const).map((format) => (
        <Button key={format} size="sm" variant="secondary" isLoading={download.isPending && download.variables?.format === format}
          disabled={download.isPending} onClick={() => download.mutate({ study: source.document, format })}>
          {format.toUpperCase()}
        </Button>
      ))}
      {download.isError ? <span role="alert" className="text-signal-700">{download.error.message}</span> : null}
    </div>
  );
}
