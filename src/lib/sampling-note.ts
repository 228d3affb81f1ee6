import type { SweepSampling } from "@shared/schemas/result";

/**
 * The sentence under a result's plots when the server thinned its branches (shared by the study workspace and the
 * signed summary); null when every solved step is drawn.
 */
export function samplingNote(sampling: SweepSampling | null | undefined): string | null {
  if (!sampling || sampling.shownSteps >= sampling.solvedSteps) return null;
  const n = (v: number) => v.toLocaleString("en-GB");
  return (
    `Curves drawn through ${n(sampling.shownSteps)} of the ${n(sampling.solvedSteps)} solved speeds per branch ` +
    "(the steps around critical speeds and sign changes of damping are all kept)."
  );
}
