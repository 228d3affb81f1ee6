import { useVirtualizer } from "@tanstack/react-virtual";
import { useMemo, useRef } from "react";
import type { SweepResult } from "@shared/schemas/result";
import { Button } from "@/components/ui/button";
import { cn } from "@/lib/cn";
import { downloadText, stepRows, stepsCsv } from "@/features/studies/utils/result-csv";

const ROW_HEIGHT = 26;
const COLUMNS = "grid-cols-[4rem_5rem_6rem_6rem_7rem_7rem_minmax(5rem,1fr)_4rem]";

/**
 * Every tracked step (all branches, ordered by speed) in a virtualised table — a sweep with local refinement
 * can hold thousands — with a CSV download of the same rows.
 */
export function StepsTable({ result, fileName }: { result: SweepResult; fileName: string }) {
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
      <div className="flex items-center justify-between gap-2 px-4 pt-2">
        <p className="text-sm text-ink-600">{rows.length} steps over {result.modes.length} branches</p>
        <Button size="sm" variant="secondary" onClick={() => downloadText(fileName, stepsCsv(result))}>
          Download CSV
        </Button>
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
