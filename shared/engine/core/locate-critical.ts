import { brentRoot } from "./brent-root";
import type { ModalSystem } from "./modal-system";
import { createPkOutcome, solveBranchPk, type PkOutcome } from "./pk-branch";
import { createPoleWorkspace } from "./quadratic-operator";
import type { TrackResult, TrackedStep } from "./track-poles";

/** A damping ratio above −1e-9 counts as not yet unstable (rounding on undamped, still-air systems). */
export const DAMPING_TOLERANCE = 1e-9;
/** Absolute tolerance of the critical-speed search, m/s (ten times finer than the 0.001 m/s reported). */
export const CRITICAL_SPEED_TOLERANCE = 1e-4;

/** A critical point found on a tracked branch. */
export interface CriticalPoint {
  /** Index of the branch (structural coordinate it started from). */
  readonly branch: number;
  readonly speedMps: number;
  /** Pole and eigenvector at the critical speed (rad/s; unit kinetic norm). */
  readonly step: TrackedStep;
  /** True when the branch is already critical at the first speed. */
  readonly atStart: boolean;
}

/**
 * Lowest flutter speed over every tracked oscillatory branch: the speed where a branch's damping ratio
 * ζ = −Re λ/|λ| first reaches zero from positive.
 *
 * Method: every branch is scanned for its first step pair with ζ ≥ 0 then ζ < 0, both poles oscillatory
 * (Im λ > 0; static branches are never flutter); the bracket is narrowed by Brent's method on ζ(U), each
 * evaluation a warm-started p-k solve of that branch from the pole interpolated linearly between the bracket
 * ends. The minimum over branches is returned (stopping at the first branch found could be unconservative).
 * A branch with ζ < 0 at the first speed gives that speed with `atStart`.
 * Notes: tolerance 1e-4 m/s on the speed; ζ within ±1e-9 of zero counts as zero.
 * @param system the n-mode system that was tracked
 * @param track the tracker's branches
 * @returns the critical point, or null when every oscillatory branch stays damped
 */
export function locateFlutter(system: ModalSystem, track: TrackResult): CriticalPoint | null {
  const damping = (s: TrackedStep) => -s.re / Math.hypot(s.re, s.im);
  return lowest(system, track, (s) => s.im > 0, damping, (s) => damping(s) < -DAMPING_TOLERANCE);
}

/** Crossings closer than this (m/s) are one physical crossing seen on two branches. */
const SAME_CROSSING_MPS = 1e-3;

/**
 * Every physical zero crossing of a static (real) pole in the sweep, lowest first: static instability
 * (divergence as the sweep sees it, with every aerodynamic coupling term included).
 *
 * Method: each branch's first step pair with real poles at both ends and λ ≤ 0 then λ > 0 is narrowed by
 * Brent's method on the real root λ(U) itself (tolerance 1e-4 m/s), as in `locateFlutter`. A branch only
 * counts its first crossing (beyond it the system is already statically unstable); crossings of two branches
 * within 1e-3 m/s are one physical crossing and are listed once (the branch first in order).
 * @returns the crossings sorted by speed (empty when no real pole crosses zero)
 */
export function locateStaticCrossings(system: ModalSystem, track: TrackResult): CriticalPoint[] {
  const found = firstCrossings(system, track, (s) => s.im === 0, (s) => -s.re, (s) => s.re > 0, false);
  found.sort((a, b) => a.speedMps - b.speedMps || a.branch - b.branch);
  const distinct: CriticalPoint[] = [];
  for (const c of found) {
    if (distinct.length === 0 || c.speedMps - distinct[distinct.length - 1].speedMps > SAME_CROSSING_MPS) distinct.push(c);
  }
  return distinct;
}

/** The lowest of `locateStaticCrossings`, or null. */
export function locateStaticCrossing(system: ModalSystem, track: TrackResult): CriticalPoint | null {
  return locateStaticCrossings(system, track)[0] ?? null;
}

function lowest(
  system: ModalSystem,
  track: TrackResult,
  eligible: (s: TrackedStep) => boolean,
  margin: (s: TrackedStep) => number,
  unstable: (s: TrackedStep) => boolean,
): CriticalPoint | null {
  const found = firstCrossings(system, track, eligible, margin, unstable, true);
  return found.length === 0 ? null : found.reduce((a, b) => (b.speedMps < a.speedMps ? b : a));
}

/**
 * Each branch's first crossing (margin > 0 → unstable). With `pruneAbove`, a branch's scan stops at the lowest
 * speed found so far on earlier branches (enough for the minimum; the result then holds a candidate list whose
 * minimum is the lowest crossing).
 */
function firstCrossings(
  system: ModalSystem,
  track: TrackResult,
  eligible: (s: TrackedStep) => boolean,
  margin: (s: TrackedStep) => number,
  unstable: (s: TrackedStep) => boolean,
  pruneAbove: boolean,
): CriticalPoint[] {
  const found: CriticalPoint[] = [];
  let best: CriticalPoint | null = null;
  const work = createPoleWorkspace(system.size);
  const outcome = createPkOutcome(system.size);
  const keep = (c: CriticalPoint) => {
    found.push(c);
    if (!best || c.speedMps < best.speedMps) best = c;
  };
  track.branches.forEach((steps, branch) => {
    if (steps.length === 0 || (pruneAbove && best && steps[0].speedMps >= best.speedMps)) return;
    if (eligible(steps[0]) && unstable(steps[0])) {
      keep({ branch, speedMps: steps[0].speedMps, step: steps[0], atStart: true });
      return;
    }
    for (let k = 0; k + 1 < steps.length; k++) {
      const a = steps[k];
      const b = steps[k + 1];
      if (pruneAbove && best && a.speedMps >= best.speedMps) return;
      if (!eligible(a) || !eligible(b) || unstable(a) || !unstable(b)) continue;
      let last: TrackedStep = b;
      const f = (speed: number) => {
        last = solveAt(system, work, outcome, a, b, speed);
        return eligible(last) ? margin(last) : margin(b);
      };
      const speed = brentRoot(f, a.speedMps, b.speedMps, margin(a), margin(b), CRITICAL_SPEED_TOLERANCE);
      if (last.speedMps !== speed) last = solveAt(system, work, outcome, a, b, speed);
      keep({ branch, speedMps: speed, step: last, atStart: false });
      return;
    }
  });
  return found;
}

function solveAt(
  system: ModalSystem,
  work: ReturnType<typeof createPoleWorkspace>,
  outcome: PkOutcome,
  a: TrackedStep,
  b: TrackedStep,
  speed: number,
): TrackedStep {
  const t = (speed - a.speedMps) / (b.speedMps - a.speedMps);
  const guess = {
    re: a.re + t * (b.re - a.re),
    im: a.im + t * (b.im - a.im),
    vecRe: t < 0.5 ? a.vecRe : b.vecRe,
    vecIm: t < 0.5 ? a.vecIm : b.vecIm,
  };
  const o = solveBranchPk(system, work, speed, guess, outcome);
  return {
    speedMps: speed,
    re: o.pole.re,
    im: o.pole.im,
    vecRe: Float64Array.from(o.pole.vecRe),
    vecIm: Float64Array.from(o.pole.vecIm),
    reducedFrequency: o.reducedFrequency,
    mac: Number.NaN,
    confidence: Number.NaN,
    converged: o.converged,
    extrapolated: system.hasAero && (system.isExtrapolated?.(o.reducedFrequency) ?? false),
  };
}
