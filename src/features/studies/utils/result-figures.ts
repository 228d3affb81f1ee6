import type { Assessment } from "@shared/schemas/assessment";
import type { SweepResult } from "@shared/schemas/result";
import { dampingFigureData, frequencyFigureData, polePathFigureData, type FigureRun, type PoleStep } from "@shared/figures/figure-data";
import type { PlotFigure } from "@/components/ui/plot";
import { linePlot, polePathPlot } from "@/lib/plot-figure";

/** One result to draw, with its assessment (for the speed markers); several are overlaid in comparisons. */
export interface PlotRun {
  name: string;
  result: SweepResult;
  assessment: Assessment | null;
}

const figureRuns = (runs: readonly PlotRun[]): FigureRun<PoleStep>[] =>
  runs.map((r) => ({ name: r.name, branches: r.result.modes, assessment: r.assessment }));
const assessments = (runs: readonly PlotRun[]) => runs.map((r) => r.assessment);

/** The pole paths of every run (shared/figures builds the data; the PDF and the summary page draw the same). */
export const polePathFigure = (runs: readonly PlotRun[]): PlotFigure => polePathPlot(polePathFigureData(figureRuns(runs)));

export const frequencyFigure = (runs: readonly PlotRun[]): PlotFigure =>
  linePlot(frequencyFigureData(figureRuns(runs)), assessments(runs), "f %{y:.4f} Hz");

/** Damping ratio in % of critical against wind speed; the zero line — where flutter starts — drawn heavy. */
export const dampingFigure = (runs: readonly PlotRun[]): PlotFigure =>
  linePlot(dampingFigureData(figureRuns(runs)), assessments(runs), "ζ %{y:.2f} %");
