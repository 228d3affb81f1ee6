/**
 * Framing of a damping-ratio plot shared by the study workspace and the signed summary: the first view keeps
 * the region around zero (where flutter starts) readable, and a branch that has turned into a real pole leaves a gap.
 */

interface PoleStep {
  frequency: number;
  damping: number;
}

/** Most of the plot above / below zero, %: heave damping grows to tens of percent at high speed. */
const TOP_LIMIT = 12;
const BOTTOM_LIMIT = -6;

/**
 * Vertical range of a damping plot in %, around zero: the oscillatory steps' span clipped to −6…12 % and padded.
 * Real poles (f = 0, ζ = ±1 by definition) are left out so they cannot flatten the flutter crossing.
 */
export function dampingAxisRange(steps: Iterable<PoleStep>): [number, number] {
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
 * The damping ratio of a step in %, or null where the branch is a real (non-oscillating) pole: drawn, ζ = ±1 is a
 * vertical wall from +100 % to −100 % that reads as a jump in damping, so the curve breaks there (the frequency
 * plot shows f = 0).
 */
export function oscillatingDampingPercent(step: PoleStep): number | null {
  return step.frequency === 0 ? null : step.damping * 100;
}
