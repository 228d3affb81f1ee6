import type { SummaryBranchDto } from "@shared/schemas/review";
import type { SummaryPayload } from "@shared/schemas/summary";
import type { PlotFigure } from "@/components/ui/plot";
import { axis, baseLayout, seriesColour, token } from "@/components/ui/plot-theme";
import { dampingAxisRange, oscillatingDampingPercent } from "@/lib/damping-frame";

const marker = (x: number, colour: string, dash: string, label: string, side: "left" | "right") => ({
  shape: { type: "line", x0: x, x1: x, yref: "paper", y0: 0, y1: 1, line: { color: colour, width: 1.5, dash } },
  // Labels sit on the outer side of their line so that close speeds do not print over each other.
  annotation: {
    x,
    yref: "paper",
    y: 0.99,
    yanchor: "top",
    xanchor: side === "left" ? "right" : "left",
    xshift: side === "left" ? -3 : 3,
    text: label,
    showarrow: false,
    bgcolor: "rgba(255,255,255,0.85)",
    font: { size: 11, color: colour },
  },
});

/** Speed markers shared by the damping and frequency plots: flutter speed (signal colour) and required speed. */
function speedMarkers(summary: SummaryPayload) {
  const list = [];
  const required = summary.criteria.find((c) => c.phenomenon === "flutter")?.requiredSpeedMps;
  const flutter = summary.flutter?.speedMps;
  const requiredFirst = required !== undefined && (flutter === undefined || required <= flutter);
  if (required !== undefined) {
    list.push(marker(required, token("--color-ink-600"), "dot", `required ${required.toFixed(1)} m/s`, requiredFirst ? "left" : "right"));
  }
  if (flutter !== undefined) {
    list.push(marker(flutter, token("--color-signal-600"), "dash", `flutter ${flutter.toFixed(1)} m/s`, requiredFirst ? "right" : "left"));
  }
  return { shapes: list.map((m) => m.shape), annotations: list.map((m) => m.annotation) };
}

/** Damping ratio of every branch against the mean wind speed; the zero line is the stability boundary. */
export function dampingFigure(summary: SummaryPayload, branches: readonly SummaryBranchDto[]): PlotFigure {
  const { shapes, annotations } = speedMarkers(summary);
  // Framed around zero like the workspace's plot; the curve breaks where a branch becomes a real pole.
  const range = dampingAxisRange(branches.flatMap((b) => b.steps));
  return {
    data: branches.map((b, i) => ({
      type: "scatter",
      mode: "lines",
      name: `Branch ${b.id}`,
      x: b.steps.map((s) => s.speed),
      y: b.steps.map(oscillatingDampingPercent),
      line: { color: seriesColour(i), width: 2 },
      hovertemplate: "U = %{x:.2f} m/s<br>ζ = %{y:.3f} %<extra>%{fullData.name}</extra>",
    })),
    layout: baseLayout({
      xaxis: axis("Mean wind speed U, m/s"),
      yaxis: axis("Damping ratio ζ, %", { zerolinecolor: token("--color-ink-900"), zerolinewidth: 1.5, range }),
      shapes,
      annotations,
      margin: { l: 56, r: 12, t: 28, b: 40 },
    }),
  };
}

/** Frequency of every branch against the mean wind speed (coalescence shows where the branches meet). */
export function frequencyFigure(summary: SummaryPayload, branches: readonly SummaryBranchDto[]): PlotFigure {
  const { shapes, annotations } = speedMarkers(summary);
  return {
    data: branches.map((b, i) => ({
      type: "scatter",
      mode: "lines",
      name: `Branch ${b.id}`,
      x: b.steps.map((s) => s.speed),
      y: b.steps.map((s) => s.frequency),
      line: { color: seriesColour(i), width: 2 },
      hovertemplate: "U = %{x:.2f} m/s<br>f = %{y:.4f} Hz<extra>%{fullData.name}</extra>",
    })),
    layout: baseLayout({
      xaxis: axis("Mean wind speed U, m/s"),
      yaxis: axis("Frequency f, Hz", { rangemode: "tozero" }),
      shapes,
      annotations,
      margin: { l: 56, r: 12, t: 28, b: 40 },
    }),
  };
}

/** Pole paths λ = Re + i Im through the sweep; the imaginary axis is the stability boundary, its right side unstable. */
export function polePathFigure(branches: readonly SummaryBranchDto[]): PlotFigure {
  let minRe = 0;
  let maxRe = 0;
  for (const b of branches) for (const s of b.steps) {
    minRe = Math.min(minRe, s.re);
    maxRe = Math.max(maxRe, s.re);
  }
  const edge = Math.max(maxRe, 0.08 * Math.abs(minRe)) * 1.1 || 1;
  return {
    data: branches.map((b, i) => ({
      type: "scatter",
      mode: "lines+markers",
      name: `Branch ${b.id}`,
      x: b.steps.map((s) => s.re),
      y: b.steps.map((s) => s.im),
      customdata: b.steps.map((s) => s.speed),
      marker: { size: 3, color: seriesColour(i) },
      line: { color: seriesColour(i), width: 1.5 },
      hovertemplate: "Re λ = %{x:.4f} rad/s<br>Im λ = %{y:.4f} rad/s<br>U = %{customdata:.2f} m/s<extra>%{fullData.name}</extra>",
    })),
    layout: baseLayout({
      xaxis: axis("Re λ, rad/s", { zerolinecolor: token("--color-ink-900"), zerolinewidth: 2 }),
      yaxis: axis("Im λ, rad/s", { rangemode: "tozero" }),
      shapes: [
        { type: "rect", xref: "x", yref: "paper", x0: 0, x1: edge, y0: 0, y1: 1, fillcolor: token("--color-signal-50"), line: { width: 0 }, layer: "below" },
      ],
      margin: { l: 56, r: 12, t: 28, b: 40 },
    }),
  };
}
