import type { SweepWarning } from "../schemas/result";
import type { CriticalPoint } from "./core/locate-critical";
import type { TrackResult } from "./core/track-poles";

export interface WarningInputs {
  readonly track: TrackResult;
  /** Structural mode ids in branch order. */
  readonly ids: readonly string[];
  readonly flutter: CriticalPoint | null;
  readonly staticCrossing: CriticalPoint | null;
  readonly quasiSteady: boolean;
}

const fmt = (speed: number) => `${Number(speed.toFixed(3))} m/s`;

/**
 * The warnings of a sweep result, in a fixed order: unstable-at-start, quasi-steady-flutter,
 * static-instability, extrapolated-derivatives (one per contiguous speed range, `speeds` = [first, last]),
 * tracking-ambiguous, no-convergence.
 *
 * Method: read off the tracked branches and the critical points; a speed range is extrapolated when any
 * tracked branch's reduced frequency at that speed lies outside the data's range.
 * @returns warnings with plain messages (the UI explains each code)
 */
export function collectSweepWarnings(inputs: WarningInputs): SweepWarning[] {
  const { track, ids, flutter, staticCrossing } = inputs;
  const warnings: SweepWarning[] = [];
  if (flutter?.atStart) {
    warnings.push({
      code: "unstable-at-start",
      message: `Branch ${ids[flutter.branch]} is already unstable at the first speed ${fmt(flutter.speedMps)}; the flutter speed is at or below the start of the sweep. Start the sweep lower.`,
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
  if (staticCrossing) {
    warnings.push({
      code: "static-instability",
      message: `A real pole of branch ${ids[staticCrossing.branch]} crosses zero at ${fmt(staticCrossing.speedMps)}: static (divergence-type) instability in the sweep, with every aerodynamic term included.`,
      speeds: [staticCrossing.speedMps],
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
