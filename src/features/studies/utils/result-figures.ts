import type { SweepResult } from "@shared/schemas/result";
import { axis, baseLayout, seriesColour, token } from "@/components/ui/plot-theme";
import type { PlotFigure } from "@/components/ui/plot";
import { dampingAxisRange, oscillatingDampingPercent } from "@/lib/damping-frame";

/** One result to draw; several are overlaid in comparisons (colour per run, dash per mode). */
export interface PlotRun {
  name: string;
  result: SweepResult;
}

const DASHES = ["solid", "dash", "dot", "dashdot"] as const;

function styleFor(runs: readonly PlotRun[], runIndex: number, modeIndex: number) {
  const overlay = runs.length > 1;
  return {
    colour: seriesColour(overlay ? runIndex : modeIndex),
    dash: overlay ? DASHES[modeIndex % DASHES.length] : "solid",
  };
}

const traceName = (runs: readonly PlotRun[], run: PlotRun, modeId: string) =>
  runs.length > 1 ? `${run.name} · ${modeId}` : `Branch ${modeId}`;

function speedRange(runs: readonly PlotRun[]): [number, number] {
  let lo = Infinity;
  let hi = -Infinity;
  for (const { result } of runs) for (const m of result.modes) for (const s of m.steps) {
    lo = Math.min(lo, s.speed);
    hi = Math.max(hi, s.speed);
  }
  return Number.isFinite(lo) ? [lo, hi] : [0, 1];
}

/**
 * The pole paths: real against imaginary part of every tracked pole through the sweep, one colour per branch,
 * markers growing with wind speed (hover gives the speed, frequency and damping). The imaginary axis — the
 * stability boundary — is drawn heavy with the unstable half-plane tinted; each flutter point is marked.
 */
export function polePathFigure(runs: readonly PlotRun[]): PlotFigure {
  const [lo, hi] = speedRange(runs);
  const size = (u: number) => 3 + (7 * (u - lo)) / Math.max(hi - lo, 1e-9);
  let minRe = 0;
  let maxRe = 0;
  for (const { result } of runs) for (const m of result.modes) for (const s of m.steps) {
    minRe = Math.min(minRe, s.re);
    maxRe = Math.max(maxRe, s.re);
  }
  const unstableEdge = Math.max(maxRe, 0.08 * Math.abs(minRe)) * 1.1 || 1;
  const data: Record<string, unknown>[] = [];
  runs.forEach((run, r) => {
    run.result.modes.forEach((mode, m) => {
      const { colour, dash } = styleFor(runs, r, m);
      data.push({
        type: "scatter",
        mode: "lines+markers",
        name: traceName(runs, run, mode.id),
        x: mode.steps.map((s) => s.re),
        y: mode.steps.map((s) => s.im),
        customdata: mode.steps.map((s) => [s.speed, s.frequency, s.damping * 100]),
        hovertemplate:
          "U %{customdata[0]:.1f} m/s<br>f %{customdata[1]:.4f} Hz<br>ζ %{customdata[2]:.2f} %<br>λ %{x:.4f} + %{y:.4f}i<extra>%{fullData.name}</extra>",
        line: { color: colour, width: 1.3, dash },
        // Refined sweeps hold hundreds of steps: draw about 70 markers per branch (every step stays hoverable).
        marker: { color: colour, size: mode.steps.map((s) => size(s.speed)), opacity: 0.85, maxdisplayed: 70 },
      });
    });
    const flutter = run.result.flutter;
    if (flutter) {
      data.push({
        type: "scatter",
        mode: "markers",
        name: runs.length > 1 ? `${run.name} · flutter` : "Flutter point",
        x: [0],
        y: [2 * Math.PI * flutter.frequency],
        marker: { symbol: "x-thin-open", size: 14, color: token("--color-signal-600"), line: { width: 2.5, color: token("--color-signal-600") } },
        hovertemplate: `Flutter ${flutter.speed.toFixed(2)} m/s<br>f ${flutter.frequency.toFixed(4)} Hz<extra></extra>`,
      });
    }
  });
  return {
    data,
    layout: baseLayout({
      xaxis: axis("Re λ (rad/s) — decay ← · → growth", { zeroline: false }),
      yaxis: axis("Im λ (rad/s)", { rangemode: "tozero" }),
      shapes: [
        { type: "rect", xref: "x", yref: "paper", x0: 0, x1: unstableEdge, y0: 0, y1: 1, fillcolor: token("--color-signal-50"), opacity: 0.6, line: { width: 0 }, layer: "below" },
        { type: "line", xref: "x", yref: "paper", x0: 0, x1: 0, y0: 0, y1: 1, line: { color: token("--color-ink-900"), width: 2 } },
      ],
    }),
  };
}

/** Flutter speed (dashed, signal colour) and divergence speed within the sweep (dotted, ink) of every run. */
function speedMarkers(runs: readonly PlotRun[]): Record<string, unknown>[] {
  return runs.flatMap((run) => [
    ...(run.result.flutter
      ? [{
          type: "line", xref: "x", yref: "paper", x0: run.result.flutter.speed, x1: run.result.flutter.speed, y0: 0, y1: 1,
          line: { color: token("--color-signal-600"), width: 1.2, dash: "dash" },
        }]
      : []),
    ...(run.result.divergence
      ? [{
          type: "line", xref: "x", yref: "paper", x0: run.result.divergence.speed, x1: run.result.divergence.speed, y0: 0, y1: 1,
          line: { color: token("--color-ink-600"), width: 1.2, dash: "dot" },
        }]
      : []),
  ]);
}

function flutterAnnotations(runs: readonly PlotRun[]): Record<string, unknown>[] {
  const divergence = runs.flatMap((run, r) =>
    run.result.divergence
      ? [{
          x: run.result.divergence.speed, y: 0.02 + r * 0.09, xref: "x", yref: "paper", yanchor: "bottom", xanchor: "right",
          text: `U<sub>D</sub> ${run.result.divergence.speed.toFixed(1)}${runs.length > 1 ? ` (${run.name})` : ""}`,
          showarrow: false, font: { size: 11, color: token("--color-ink-700") }, bgcolor: "rgba(252,252,250,0.85)",
        }]
      : [],
  );
  return divergence.concat(runs.flatMap((run, r) =>
    run.result.flutter
      ? [{
          x: run.result.flutter.speed, y: 1 - r * 0.09, xref: "x", yref: "paper", yanchor: "top", xanchor: "left",
          text: `U<sub>F</sub> ${run.result.flutter.speed.toFixed(1)}${runs.length > 1 ? ` (${run.name})` : ""}`,
          showarrow: false, font: { size: 11, color: token("--color-signal-700") }, bgcolor: "rgba(252,252,250,0.85)",
        }]
      : [],
  ));
}

/** A quantity of every branch against wind speed, with each flutter speed marked. */
function versusSpeed(
  runs: readonly PlotRun[],
  pick: (s: SweepResult["modes"][number]["steps"][number]) => number | null,
  yTitle: string,
  hover: string,
  extraShapes: Record<string, unknown>[] = [],
): PlotFigure {
  const data: Record<string, unknown>[] = [];
  runs.forEach((run, r) => {
    run.result.modes.forEach((mode, m) => {
      const { colour, dash } = styleFor(runs, r, m);
      data.push({
        type: "scatter",
        mode: "lines",
        name: traceName(runs, run, mode.id),
        x: mode.steps.map((s) => s.speed),
        y: mode.steps.map(pick),
        line: { color: colour, width: 1.6, dash },
        hovertemplate: `U %{x:.1f} m/s<br>${hover}<extra>%{fullData.name}</extra>`,
      });
    });
  });
  return {
    data,
    layout: baseLayout({
      xaxis: axis("Wind speed U (m/s)"),
      yaxis: axis(yTitle),
      shapes: [...extraShapes, ...speedMarkers(runs)],
      annotations: flutterAnnotations(runs),
      hovermode: "x unified",
    }),
  };
}

export function frequencyFigure(runs: readonly PlotRun[]): PlotFigure {
  return versusSpeed(runs, (s) => s.frequency, "Frequency f (Hz)", "f %{y:.4f} Hz");
}

/** Damping ratio in % of critical against wind speed; the zero line — where flutter starts — drawn heavy. */
export function dampingFigure(runs: readonly PlotRun[]): PlotFigure {
  const figure = versusSpeed(runs, oscillatingDampingPercent, "Damping ratio ζ (%)", "ζ %{y:.2f} %", [
    { type: "line", xref: "paper", yref: "y", x0: 0, x1: 1, y0: 0, y1: 0, line: { color: token("--color-ink-900"), width: 1.6 } },
  ]);
  // Heave damping grows to tens of percent at high speed; the first view keeps the region around zero readable
  // (the full curves are one "autoscale" click away).
  (figure.layout.yaxis as Record<string, unknown>).range = dampingAxisRange(
    runs.flatMap(({ result }) => result.modes.flatMap((m) => m.steps)),
  );
  return figure;
}
