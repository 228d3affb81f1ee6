/**
 * The data of every result figure — damping and frequency against wind speed, pole paths — built once here and
 * drawn by two renderers: plotly in the browser (src/lib/plot-figure.ts) and the PDF line chart
 * (server/pdf/line-chart.ts). The speed markers come from the revision's assessment, each labelled by what it is, so
 * the workspace, the comparison, the summary page and the PDF mark the same speeds with the same words.
 */
import type { Assessment } from "../schemas/assessment";
import type { SummaryPayloadV1 } from "../schemas/summary-v1";
import { speedText } from "../assessment/format";

export interface FigureStep {
  speed: number;
  frequency: number;
  damping: number;
}

/** A step of a pole path: the pole λ = re + i·im, rad/s, besides its speed, frequency and damping. */
export interface PoleStep extends FigureStep {
  re: number;
  im: number;
}

/** One result to draw: its branches and, when it has one, its assessment (for the markers). */
export interface FigureRun<S extends FigureStep = FigureStep> {
  name: string;
  branches: readonly { id: string; steps: readonly S[] }[];
  assessment: Assessment | null;
}

export interface FigureSeries {
  /** "Branch TS1", or "B r3 · TS1" when several runs are overlaid. */
  name: string;
  run: number;
  branch: number;
  /** [x, y]; y null where the curve breaks (a branch that became a static pole has no damping ratio to draw). */
  points: [number, number | null][];
  /** The wind speed at each point (pole paths: the x axis is Re λ). */
  speeds: number[];
}

export type MarkerKind = "flutter" | "divergence-closed-form" | "static-instability" | "required-flutter";

export interface FigureMarker {
  kind: MarkerKind;
  x: number;
  run: number;
  label: string;
}

export interface LineFigureData {
  xLabel: string;
  yLabel: string;
  series: FigureSeries[];
  markers: FigureMarker[];
  /** Initial y range (the damping plot frames zero); null: the data's range. */
  yRange: [number, number] | null;
  /** Draw y = 0 heavy (the stability boundary). */
  zeroLine: boolean;
  note: string | null;
}

const seriesName = (runs: readonly FigureRun[], run: FigureRun, id: string) => (runs.length > 1 ? `${run.name} · ${id}` : `Branch ${id}`);

/** Most of the damping plot above / below zero, %: heave damping grows to tens of percent at high speed. */
const TOP_LIMIT = 12;
const BOTTOM_LIMIT = -6;

/**
 * Vertical range of a damping plot in %, around zero: the oscillating steps' span clipped to −6…12 % and padded.
 * Real poles (f = 0, ζ = ±1 by definition) are left out so they cannot flatten the flutter crossing.
 */
export function dampingAxisRange(steps: Iterable<Pick<FigureStep, "frequency" | "damping">>): [number, number] {
  let lo = 0;
  let hi = 0;
  for (const s of steps) {
    if (s.frequency === 0) continue;
    lo = Math.min(lo, s.damping * 100);
    hi = Math.max(hi, s.damping * 100);
  }
  const top = Math.min(hi, TOP_LIMIT);
  const bottom = Math.max(lo, BOTTOM_LIMIT);
  const pad = (top - bottom) * 0.06 || 1;
  return [bottom - pad, top + pad];
}

/**
 * The speeds a figure marks for each run, from its assessment: the flutter speed, the divergence figures that lie
 * within the sweep (each named by its basis) and, for a single run, the required flutter speed.
 */
export function speedMarkers(runs: readonly FigureRun[]): FigureMarker[] {
  const markers: FigureMarker[] = [];
  runs.forEach((run, r) => {
    const a = run.assessment;
    if (!a) return;
    const suffix = runs.length > 1 ? ` (${run.name})` : "";
    if (a.flutter.found) markers.push({ kind: "flutter", x: a.flutter.speedMps, run: r, label: `flutter ${speedText(a.flutter.speedMps)}${suffix}` });
    const closed = a.divergence.closedForm;
    if (closed.speedMps !== null && closed.withinSweep) {
      markers.push({ kind: "divergence-closed-form", x: closed.speedMps, run: r, label: `closed-form divergence ${speedText(closed.speedMps)}${suffix}` });
    }
    const statics = a.divergence.staticInstability;
    if (statics.speedMps !== null) {
      const branch = statics.branch ? `, ${statics.branch}` : "";
      markers.push({ kind: "static-instability", x: statics.speedMps, run: r, label: `static instability ${speedText(statics.speedMps)}${branch}${suffix}` });
    }
    const required = a.margins?.flutter.requiredSpeedMps;
    if (runs.length === 1 && required !== undefined) {
      markers.push({ kind: "required-flutter", x: required, run: r, label: `required ${speedText(required)}` });
    }
  });
  return markers;
}

/** The speeds a summary signed in format 1 marked on its plots, as it states them: its flutter speed and its divergence inside the sweep. */
export function markersOfSummaryV1(s: SummaryPayloadV1): FigureMarker[] {
  return [
    ...(s.flutter ? [{ kind: "flutter" as const, x: s.flutter.speedMps, run: 0, label: `flutter ${speedText(s.flutter.speedMps)}` }] : []),
    ...(s.divergence && s.divergence.speedMps <= s.sweep.toMps
      ? [{ kind: "divergence-closed-form" as const, x: s.divergence.speedMps, run: 0, label: `divergence ${speedText(s.divergence.speedMps)}` }]
      : []),
  ];
}

function versusSpeed(runs: readonly FigureRun[], pick: (s: FigureStep) => number | null): FigureSeries[] {
  return runs.flatMap((run, r) =>
    run.branches.map((b, j) => ({
      name: seriesName(runs, run, b.id),
      run: r,
      branch: j,
      points: b.steps.map((s): [number, number | null] => [s.speed, pick(s)]),
      speeds: b.steps.map((s) => s.speed),
    })),
  );
}

/**
 * Damping ratio of every branch in % of critical against wind speed; the zero line — where flutter starts — drawn
 * heavy; a branch that has turned into a real pole leaves a gap (ζ = ±1 would read as a jump in damping).
 */
export function dampingFigureData(runs: readonly FigureRun[], markers: FigureMarker[] = speedMarkers(runs)): LineFigureData {
  return {
    xLabel: "Mean wind speed at deck level U (m/s)",
    yLabel: "Damping ratio ζ (%)",
    series: versusSpeed(runs, (s) => (s.frequency === 0 ? null : s.damping * 100)),
    markers,
    yRange: dampingAxisRange(runs.flatMap((run) => run.branches.flatMap((b) => b.steps))),
    zeroLine: true,
    note: "Damping axis framed around zero (−6 … 12 %); the stored result holds every value. Flutter where a branch crosses zero.",
  };
}

/** Frequency of every branch against wind speed (coalescence shows where the branches meet; 0 on a static pole). */
export function frequencyFigureData(runs: readonly FigureRun[], markers: FigureMarker[] = speedMarkers(runs)): LineFigureData {
  return {
    xLabel: "Mean wind speed at deck level U (m/s)",
    yLabel: "Frequency f (Hz)",
    series: versusSpeed(runs, (s) => s.frequency),
    markers,
    yRange: null,
    zeroLine: false,
    note: null,
  };
}

/** Pole paths: Re λ against Im λ of every branch through the sweep, and each run's flutter point on the axis. */
export function polePathFigureData(runs: readonly FigureRun<PoleStep>[]): LineFigureData & { flutterPoints: { run: number; re: number; im: number; label: string }[] } {
  return {
    xLabel: "Re λ (rad/s) — decay ← · → growth",
    yLabel: "Im λ (rad/s)",
    series: runs.flatMap((run, r) =>
      run.branches.map((b, j) => ({
        name: seriesName(runs, run, b.id),
        run: r,
        branch: j,
        points: b.steps.map((s): [number, number | null] => [s.re, s.im]),
        speeds: b.steps.map((s) => s.speed),
      })),
    ),
    markers: [],
    yRange: null,
    zeroLine: false,
    note: null,
    flutterPoints: runs.flatMap((run, r) =>
      run.assessment?.flutter.found
        ? [{ run: r, re: 0, im: 2 * Math.PI * run.assessment.flutter.frequencyHz, label: `flutter ${speedText(run.assessment.flutter.speedMps)}` }]
        : [],
    ),
  };
}
