import { useMemo } from "react";
import type { RevisionSummaryDto } from "@shared/schemas/revisions";
import { Plot } from "@/components/ui/plot";
import { axis, baseLayout, seriesColour, token } from "@/components/ui/plot-theme";

/** Critical speeds by revision number, from each revision's assessment: flutter (or the sweep's end when none was found) and divergence. */
export function RevisionTrend({ revisions }: { revisions: readonly RevisionSummaryDto[] }) {
  const figure = useMemo(() => {
    const ordered = [...revisions].sort((a, b) => a.number - b.number);
    const x = ordered.map((r) => r.number);
    const notes = ordered.map((r) => r.changeNote || "first revision");
    return {
      data: [
        {
          type: "scatter", mode: "lines+markers", name: "Flutter", x,
          y: ordered.map((r) => { const f = r.assessment.assessment.flutter; return f.found ? f.speedMps : null; }),
          customdata: notes, line: { color: token("--color-ink-900"), width: 2 }, marker: { size: 8 },
          hovertemplate: "r%{x}: %{y:.2f} m/s<br>%{customdata}<extra>flutter</extra>",
        },
        {
          type: "scatter", mode: "markers", name: "No flutter up to", x,
          y: ordered.map((r) => { const f = r.assessment.assessment.flutter; return f.found ? null : f.upToMps; }),
          marker: { symbol: "triangle-up-open", size: 10, color: token("--color-ink-600") },
          hovertemplate: "r%{x}: none up to %{y:.0f} m/s<extra></extra>",
        },
        {
          type: "scatter", mode: "lines+markers", name: "Divergence (the figure the margin uses)", x,
          y: ordered.map((r) => r.assessment.assessment.divergence.governingSpeedMps), customdata: notes,
          line: { color: seriesColour(1), width: 1.5, dash: "dash" }, marker: { size: 6 },
          hovertemplate: "r%{x}: %{y:.1f} m/s<br>%{customdata}<extra>divergence</extra>",
        },
      ],
      layout: baseLayout({
        xaxis: axis("Revision", { dtick: 1, tickprefix: "r" }),
        yaxis: axis("Critical speed (m/s)"),
      }),
    };
  }, [revisions]);
  return <Plot {...figure} height={240} label="Critical speeds by revision" downloadName="critical-speeds-by-revision" />;
}
