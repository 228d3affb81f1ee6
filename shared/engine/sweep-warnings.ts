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
  /** The derivative table's tested Ur range [min, max]; null for models without a table. */
  readonly testedRange: readonly [number, number] | null;
}

const fmt = (speed: number) => `${Number(speed.toFixed(3))} m/s`;
const pct = (ratio: number) => `${ratio >= 0 ? "+" : "−"}${Math.abs(100 * ratio).toFixed(2)} %`;

/**
 * The warnings of a sweep result, in a fixed order: unstable-at-start, pk-fold, quasi-steady-flutter,
 * static-instability (one warning for every physical static crossing, lowest first in `speeds`), extrapolated-derivatives
 * (one per branch and contiguous speed range, by first speed then branch: `branch`, `speeds` = [first, last] and that
 * branch's `reducedVelocities` [lowest, highest]), tracking-ambiguous, no-convergence.
 *
 * Method: read off the tracked branches and the critical points; a speed range of a branch is extrapolated when that
 * branch's reduced frequency lies outside the data's range at each of its steps. Per branch, because the branches
 * leave the table at different speeds: the heave branch (low frequency, high Ur) usually long before the torsional one.
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
      branches: staticCrossings.map((c) => ids[c.branch]),
    });
  }
  for (const warning of extrapolatedRanges(track, ids, inputs.testedRange)) warnings.push(warning);
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

const ur = (value: number) => String(Number(value.toPrecision(3)));

/**
 * One extrapolated-derivatives warning per branch and contiguous range of steps whose derivatives were held from an
 * end of the table, sorted by first speed, then branch order.
 */
function extrapolatedRanges(track: TrackResult, ids: readonly string[], tested: readonly [number, number] | null): SweepWarning[] {
  const found: { warning: SweepWarning; first: number; branch: number }[] = [];
  track.branches.forEach((steps, j) => {
    let start = -1;
    const flush = (end: number) => {
      const range = steps.slice(start, end + 1);
      const a = range[0].speedMps;
      const b = range[range.length - 1].speedMps;
      // A static pole (Im λ = 0) has no reduced velocity of its own (the solver floors its K).
      const urs = range.filter((s) => s.im > 0 && s.reducedFrequency > 0).map((s) => (2 * Math.PI) / s.reducedFrequency);
      const lowUr = urs.length > 0 ? Math.min(...urs) : null;
      const highUr = urs.length > 0 ? Math.max(...urs) : null;
      const staticFrom = range.find((s) => !(s.im > 0))?.speedMps;
      const below = tested !== null && highUr !== null && highUr < tested[0];
      const side = tested === null ? "outside the tested range" : below ? `below the lowest tested Ur ${ur(tested[0])}` : `above the highest tested Ur ${ur(tested[1])}`;
      const urText = lowUr !== null && highUr !== null ? `Ur ${ur(lowUr)}–${ur(highUr)}` : "no oscillation";
      const staticText = staticFrom !== undefined && lowUr !== null ? `; a static pole from ${fmt(staticFrom)}` : "";
      found.push({
        first: a,
        branch: j,
        warning: {
          code: "extrapolated-derivatives",
          message:
            `Branch ${ids[j]} from ${fmt(a)} to ${fmt(b)} (${urText}${staticText}, ${side}) used flutter derivatives held ` +
            "from the end of the table: results on this branch there are unreliable.",
          speeds: [a, b],
          branch: ids[j],
          ...(lowUr !== null && highUr !== null ? { reducedVelocities: [lowUr, highUr] as [number, number] } : {}),
        },
      });
    };
    for (let k = 0; k < steps.length; k++) {
      if (steps[k].extrapolated && start < 0) start = k;
      if (!steps[k].extrapolated && start >= 0) {
        flush(k - 1);
        start = -1;
      }
    }
    if (start >= 0) flush(steps.length - 1);
  });
  found.sort((x, y) => x.first - y.first || x.branch - y.branch);
  return found.map((f) => f.warning);
}
