import type { SweepWarning } from "../schemas/result";
import type { CriticalPoint } from "./core/locate-critical";
import type { TrackResult } from "./core/track-poles";

export interface WarningInputs {
  readonly track: TrackResult;
  /** Structural mode ids in branch order. */
  readonly ids: readonly string[];
  readonly flutter: CriticalPoint | null;
  /** Physical static crossings, lowest first (`locateStaticCrossings`). */
  readonly staticCrossings: readonly CriticalPoint[];
  readonly quasiSteady: boolean;
}

const fmt = (speed: number) => `${Number(speed.toFixed(3))} m/s`;
const pct = (ratio: number) => `${ratio >= 0 ? "+" : "−"}${Math.abs(100 * ratio).toFixed(2)} %`;

/**
 * The warnings of a sweep result, in a fixed order: unstable-at-start, pk-fold, quasi-steady-flutter,
 * static-instability (one warning for every physical static crossing, lowest first in `speeds`), extrapolated-derivatives (one per contiguous speed range, `speeds` = [first, last]),
 * tracking-ambiguous, no-convergence.
 *
 * Method: read off the tracked branches and the critical points; a speed range is extrapolated when any
 * tracked branch's reduced frequency at that speed lies outside the data's range.
 * @returns warnings with plain messages (the UI explains each code)
 */
export function collectSweepWarnings(inputs: WarningInputs): SweepWarning[] {
  const { track, ids, flutter, staticCrossings } = inputs;
  const warnings: SweepWarning[] = [];
  if (flutter?.atStart) {
    warnings.push({
      code: "unstable-at-start",
      message: `Branch ${ids[flutter.branch]} is already unstable at the first speed ${fmt(flutter.speedMps)}; the flutter speed is at or below the start of the sweep. Start the sweep lower.`,
      speeds: [flutter.speedMps],
    });
  }
  if (flutter?.fold) {
    const { fold } = flutter;
    const jump = `On the branch that started as mode ${ids[flutter.branch]} the p-k solution folds at ${fmt(fold.speedMps)}: its damping ratio jumps from ${pct(fold.dampingBefore)} to ${pct(fold.dampingAfter)} without passing through zero.`;
    warnings.push({
      code: "pk-fold",
      message: fold.located
        ? `${jump} The flutter point reported is the neutral point of the harmonic flutter determinant det Z(U, ω) = 0 next to the fold, ${fmt(flutter.speedMps)} at ${(flutter.step.im / (2 * Math.PI)).toFixed(4)} Hz.`
        : `${jump} No neutral point of the harmonic flutter determinant was found next to it, so the speed of the jump is reported; treat it as approximate.`,
      speeds: [flutter.speedMps],
    });
  }
  if (flutter && inputs.quasiSteady) {
    warnings.push({
      code: "quasi-steady-flutter",
      message:
        "Flutter was found with quasi-steady derivatives (no aerodynamic torsional damping, A2* = 0): the speed is likely far too low. Use measured flutter derivatives for flutter.",
      speeds: [flutter.speedMps],
    });
  }
  if (staticCrossings.length > 0) {
    const first = staticCrossings[0];
    const where = (c: CriticalPoint) => `${c.atStart ? "at or below " : ""}${fmt(c.speedMps)} on the branch that started as mode ${ids[c.branch]}`;
    const more = staticCrossings.slice(1);
    warnings.push({
      code: "static-instability",
      message:
        `Static (divergence-type) instability from ${where(first)}: a real pole crosses zero there, with every aerodynamic ` +
        "term of the static balance included (H3*, H4*, A4* as well as A3*), so it can differ from the closed-form divergence speed." +
        (more.length > 0 ? ` Further real poles cross zero at ${more.map(where).join(", ")}; the lowest speed governs.` : ""),
      speeds: staticCrossings.map((c) => c.speedMps),
    });
  }
  const steps = track.branches[0];
  let start = -1;
  const flush = (end: number) => {
    const used = ids.filter((_, j) => track.branches[j].slice(start, end + 1).some((s) => s.extrapolated));
    const a = steps[start].speedMps;
    const b = steps[end].speedMps;
    warnings.push({
      code: "extrapolated-derivatives",
      message: `From ${fmt(a)} to ${fmt(b)} branch${used.length > 1 ? "es" : ""} ${used.join(", ")} used flutter derivatives held from the end of the table (outside the tested reduced velocities): results there are unreliable.`,
      speeds: [a, b],
    });
  };
  for (let k = 0; k < steps.length; k++) {
    const any = track.branches.some((b) => b[k].extrapolated);
    if (any && start < 0) start = k;
    if (!any && start >= 0) {
      flush(k - 1);
      start = -1;
    }
  }
  if (start >= 0) flush(steps.length - 1);
  if (track.ambiguousSpeeds.length > 0) {
    warnings.push({
      code: "tracking-ambiguous",
      message: `Pole tracking stayed ambiguous at the smallest step (veering or close poles) at ${track.ambiguousSpeeds.length} speed(s); check the branches there.`,
      speeds: [...track.ambiguousSpeeds],
    });
  }
  if (track.noConvergenceSpeeds.length > 0) {
    warnings.push({
      code: "no-convergence",
      message: `The p-k iteration did not converge to 1e-9 within its iteration cap at ${track.noConvergenceSpeeds.length} speed(s).`,
      speeds: [...track.noConvergenceSpeeds],
    });
  }
  return warnings;
}
