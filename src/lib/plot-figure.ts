/**
 * The plotly rendering of the shared figure data (shared/figures/figure-data.ts): the same series, markers and
 * framing the PDF draws, in the product's plot theme. Several runs overlaid: a colour per run and a dash per branch;
 * one run: a colour per branch. The flutter marker takes the failure colour only when its margin fails.
 */
import { extent } from "@shared/extent";
import type { Assessment } from "@shared/schemas/assessment";
import type { FigureMarker, FigureSeries, LineFigureData, polePathFigureData } from "@shared/figures/figure-data";
import { axis, baseLayout, seriesColour, token } from "@/components/ui/plot-theme";
import type { PlotFigure } from "@/components/ui/plot";

const DASHES = ["solid", "dash", "dot", "dashdot"] as const;

function style(series: FigureSeries, overlaid: boolean) {
  return {
    colour: seriesColour(overlaid ? series.run : series.branch),
    dash: overlaid ? DASHES[series.branch % DASHES.length] : "solid",
  };
}

/** Colour by verdict, never by quantity: a flutter speed is drawn in the failure colour only when its margin fails. */
function markerColour(marker: FigureMarker, assessments: readonly (Assessment | null)[]): string {
  if (marker.kind === "flutter") {
    return assessments[marker.run]?.margins?.flutter.status === "fail" ? token("--color-signal-600") : token("--color-ink-900");
  }
  return marker.kind === "required-flutter" ? token("--color-ink-400") : token("--color-ink-600");
}

const MARKER_DASH: Record<FigureMarker["kind"], string> = {
  flutter: "dash",
  "divergence-closed-form": "dot",
  "static-instability": "dashdot",
  "required-flutter": "longdash",
};

/** A figure of a quantity against wind speed (damping, frequency) as a plotly figure. */
export function linePlot(figure: LineFigureData, assessments: readonly (Assessment | null)[], hover: string): PlotFigure {
  const overlaid = new Set(figure.series.map((s) => s.run)).size > 1;
  const data = figure.series.map((s) => {
    const { colour, dash } = style(s, overlaid);
    return {
      type: "scatter",
      mode: "lines",
      name: s.name,
      x: s.points.map((p) => p[0]),
      y: s.points.map((p) => p[1]),
      line: { color: colour, width: 1.6, dash },
      hovertemplate: `U %{x:.2f} m/s<br>${hover}<extra>%{fullData.name}</extra>`,
    };
  });
  const shapes: Record<string, unknown>[] = figure.markers.map((m) => ({
    type: "line", xref: "x", yref: "paper", x0: m.x, x1: m.x, y0: 0, y1: 1,
    line: { color: markerColour(m, assessments), width: 1.2, dash: MARKER_DASH[m.kind] },
  }));
  if (figure.zeroLine) {
    shapes.unshift({ type: "line", xref: "paper", yref: "y", x0: 0, x1: 1, y0: 0, y1: 0, line: { color: token("--color-ink-900"), width: 1.6 } });
  }
  const annotations = figure.markers.map((m, i) => ({
    x: m.x, y: 1 - i * 0.08, xref: "x", yref: "paper", yanchor: "top", xanchor: "left", xshift: 3,
    text: m.label, showarrow: false, font: { size: 11, color: markerColour(m, assessments) }, bgcolor: "rgba(252,252,250,0.85)",
  }));
  return {
    data,
    layout: baseLayout({
      xaxis: axis(figure.xLabel),
      yaxis: axis(figure.yLabel, figure.yRange ? { range: figure.yRange } : {}),
      shapes,
      annotations,
      hovermode: "x unified",
    }),
  };
}

/**
 * The pole paths: Re λ against Im λ of every branch, markers growing with wind speed (hover gives the speed), the
 * imaginary axis — the stability boundary — heavy with the unstable half-plane tinted, each flutter point marked.
 */
export function polePathPlot(figure: ReturnType<typeof polePathFigureData>): PlotFigure {
  const overlaid = new Set(figure.series.map((s) => s.run)).size > 1;
  const { min: lo, max: hi } = extent(figure.series.flatMap((s) => s.speeds));
  const size = (u: number) => 3 + (7 * (u - lo)) / Math.max(hi - lo, 1e-9);
  let minRe = 0;
  let maxRe = 0;
  for (const s of figure.series) for (const [re] of s.points) {
    minRe = Math.min(minRe, re);
    maxRe = Math.max(maxRe, re);
  }
  const unstableEdge = Math.max(maxRe, 0.08 * Math.abs(minRe)) * 1.1 || 1;
  const data: Record<string, unknown>[] = figure.series.map((s) => {
    const { colour, dash } = style(s, overlaid);
    return {
      type: "scatter",
      mode: "lines+markers",
      name: s.name,
      x: s.points.map((p) => p[0]),
      y: s.points.map((p) => p[1]),
      customdata: s.speeds,
      hovertemplate: "U %{customdata:.2f} m/s<br>λ %{x:.4f} + %{y:.4f}i<extra>%{fullData.name}</extra>",
      line: { color: colour, width: 1.3, dash },
      // Refined sweeps hold hundreds of steps: draw about 70 markers per branch (every step stays hoverable).
      marker: { color: colour, size: s.speeds.map(size), opacity: 0.85, maxdisplayed: 70 },
    };
  });
  for (const p of figure.flutterPoints) {
    data.push({
      type: "scatter",
      mode: "markers",
      name: overlaid ? `${p.label} (${p.run + 1})` : "Flutter point",
      x: [p.re],
      y: [p.im],
      marker: { symbol: "x-thin-open", size: 14, color: token("--color-ink-900"), line: { width: 2.5, color: token("--color-ink-900") } },
      hovertemplate: `${p.label}<extra></extra>`,
    });
  }
  return {
    data,
    layout: baseLayout({
      xaxis: axis(figure.xLabel, { zeroline: false }),
      yaxis: axis(figure.yLabel, { rangemode: "tozero" }),
      shapes: [
        { type: "rect", xref: "x", yref: "paper", x0: 0, x1: unstableEdge, y0: 0, y1: 1, fillcolor: token("--color-signal-50"), opacity: 0.6, line: { width: 0 }, layer: "below" },
        { type: "line", xref: "x", yref: "paper", x0: 0, x1: 0, y0: 0, y1: 1, line: { color: token("--color-ink-900"), width: 2 } },
      ],
    }),
  };
}
