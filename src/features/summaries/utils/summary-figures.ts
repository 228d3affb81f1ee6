import { dampingFigureData, frequencyFigureData, markersOfSummaryV1, polePathFigureData, type FigureRun, type PoleStep } from "@shared/figures/figure-data";
import type { SummaryBranchDto } from "@shared/schemas/review";
import type { SignedSummaryPayload } from "@shared/schemas/summary";
import type { PlotFigure } from "@/components/ui/plot";
import { linePlot, polePathPlot } from "@/lib/plot-figure";

/**
 * The signed summary's plots, from the shared figure builders the workspace and the PDF use: the markers come from
 * the signed assessment (format 2) or, for a summary signed in format 1, from the speeds it states.
 */
function summaryRun(payload: SignedSummaryPayload, branches: readonly SummaryBranchDto[]): FigureRun<PoleStep> {
  return { name: "Signed result", branches, assessment: payload.format === "stillspan.summary/1" ? null : payload.assessment };
}

const legacyMarkers = (payload: SignedSummaryPayload) => (payload.format === "stillspan.summary/1" ? markersOfSummaryV1(payload) : undefined);

export function dampingFigure(payload: SignedSummaryPayload, branches: readonly SummaryBranchDto[]): PlotFigure {
  const run = summaryRun(payload, branches);
  return linePlot(dampingFigureData([run], legacyMarkers(payload)), [run.assessment], "ζ %{y:.3f} %");
}

export function frequencyFigure(payload: SignedSummaryPayload, branches: readonly SummaryBranchDto[]): PlotFigure {
  const run = summaryRun(payload, branches);
  return linePlot(frequencyFigureData([run], legacyMarkers(payload)), [run.assessment], "f %{y:.4f} Hz");
}

export function polePathFigure(payload: SignedSummaryPayload, branches: readonly SummaryBranchDto[]): PlotFigure {
  return polePathPlot(polePathFigureData([summaryRun(payload, branches)]));
}
