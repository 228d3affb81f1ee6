import { brentRoot } from "./brent-root";
import { DAMPING_TOLERANCE, dampingDip, dampingRatio } from "./damping";
import { modalAssurance } from "./mac";
import type { ModalSystem } from "./modal-system";
import { solveNeutralPoint } from "./neutral-point";
import { createPkOutcome, solveBranchPk } from "./pk-branch";
import { createPoleWorkspace } from "./quadratic-operator";
import type { TrackResult, TrackedStep } from "./track-poles";

export { locateStaticCrossing, locateStaticCrossings } from "./static-crossings";

/** Absolute tolerance of the critical-speed search, m/s (ten times finer than the 0.001 m/s reported). */
export const CRITICAL_SPEED_TOLERANCE = 1e-4;
/** Relative tolerance of the same search (governs below 100 m/s, so that low speeds keep 6 digits). */
export const CRITICAL_SPEED_RELATIVE_TOLERANCE = 1e-6;
/** |ζ| on both sides of the final bracket above which the crossing is examined as a possible fold. */
const FOLD_SUSPECT = 1e-5;
/** |ζ| on both sides of a bracket narrowed to 1e-9·U above which the damping jumps: a fold. */
const FOLD_JUMP = 1e-6;
/** Parabolic refinements of a damping dip between two accepted steps. */
const DIP_ITERATIONS = 4;

/** Where the p-k branch's damping jumps from positive to negative without passing through zero. */
export interface FoldInfo {
  /** Speed of the jump (bracket narrowed to 1e-9·U), m/s. */
  readonly speedMps: number;
  /** Damping ratio of the branch just below and just above the jump. */
  readonly dampingBefore: number;
  readonly dampingAfter: number;
  /** True when the neutral point of the harmonic determinant was found (it is then the critical point). */
  readonly located: boolean;
}

/** A critical point found on a tracked branch. */
export interface CriticalPoint {
  /** Index of the branch (structural coordinate it started from). */
  readonly branch: number;
  readonly speedMps: number;
  /** Pole and eigenvector at the critical speed (rad/s; unit kinetic norm). */
  readonly step: TrackedStep;
  /** True when the branch is already critical at the first speed. */
  readonly atStart: boolean;
  /** Set when the flutter point comes from a p-k fold. */
  readonly fold?: FoldInfo;
}

/**
 * Lowest flutter speed over every tracked oscillatory branch: the speed where a branch's damping ratio
 * ζ = −Re λ/|λ| first reaches zero from positive.
 *
 * Method: every branch is scanned for its first step pair with ζ ≥ 0 then ζ < 0, both poles oscillatory
 * (Im λ > 0; static branches are never flutter); the bracket is narrowed by Brent's method on ζ(U), each
 * evaluation a warm-started p-k solve of that branch from the pole interpolated linearly between the bracket
 * ends. Where ζ stays positive at both ends of an interval but the quadratic through them and the next step
 * dips below zero, the branch is solved at the model's minimum (parabolic steps, up to 4) and a negative ζ there
 * brackets a crossing. When the damping does not pass through zero — ζ stays above 1e-6 in magnitude on both sides
 * of a bracket narrowed to 1e-9·U, a fold of the p-k solution — the neutral point next to it is located on the
 * harmonic determinant (`solveNeutralPoint`, from either side's pole) and reported with `fold`; if none is found
 * the jump speed is reported (`fold.located` false). The minimum over branches is returned (stopping at the first
 * branch found could be unconservative). A branch with ζ < 0 at the first speed gives that speed with `atStart`.
 * Notes: tolerance 1e-4 m/s or 1e-6 relative on the speed, whichever is finer; ζ within ±1e-9 of zero counts as
 * zero (docs/method-and-validation.md §4).
 * @param system the n-mode system that was tracked
 * @param track the tracker's branches
 * @returns the critical point, or null when every oscillatory branch stays damped
 */
export function locateFlutter(system: ModalSystem, track: TrackResult): CriticalPoint | null {
  const work = createPoleWorkspace(system.size);
  const outcome = createPkOutcome(system.size);
  const zeta = (s: TrackedStep) => dampingRatio(s.re, s.im);
  const unstable = (s: TrackedStep) => s.im > 0 && zeta(s) < -DAMPING_TOLERANCE;
  const solve = (a: TrackedStep, b: TrackedStep, speed: number) => solveAt(system, work, outcome, a, b, speed);
  let best: CriticalPoint | null = null;
  track.branches.forEach((steps, branch) => {
    if (steps.length === 0 || (best && steps[0].speedMps >= best.speedMps)) return;
    if (unstable(steps[0])) {
      best = { branch, speedMps: steps[0].speedMps, step: steps[0], atStart: true };
      return;
    }
    for (let k = 0; k + 1 < steps.length; k++) {
      const a = steps[k];
      let b = steps[k + 1];
      if (best && a.speedMps >= best.speedMps) return;
      if (!(a.im > 0) || !(b.im > 0) || unstable(a)) continue;
      if (!unstable(b)) {
        const next = steps[k + 2];
        const inside = next && next.im > 0 ? dipInside(next, a, b, solve, zeta) : null;
        if (!inside) continue;
        b = inside;
      }
      const found = crossing(system, branch, a, b, solve, zeta);
      if (!best || found.speedMps < best.speedMps) best = found;
      return;
    }
  });
  return best;
}

/** A solved point with ζ < 0 inside (a, b) where the damping model through a, b and `c` dips below zero, or null. */
function dipInside(
  c: TrackedStep,
  a: TrackedStep,
  b: TrackedStep,
  solve: (a: TrackedStep, b: TrackedStep, speed: number) => TrackedStep,
  zeta: (s: TrackedStep) => number,
): TrackedStep | null {
  let extra = c;
  for (let it = 0; it < DIP_ITERATIONS; it++) {
    const at = dampingDip(extra.speedMps, zeta(extra), a.speedMps, zeta(a), b.speedMps, zeta(b));
    if (at === null) return null;
    const m = solve(a, b, at);
    if (!(m.im > 0)) return null;
    if (zeta(m) < -DAMPING_TOLERANCE) return m;
    extra = m;
  }
  return null;
}

/** Brent's method on ζ(U) in [a, b] (ζ(a) ≥ 0 > ζ(b)), then the fold check. */
function crossing(
  system: ModalSystem,
  branch: number,
  a: TrackedStep,
  b: TrackedStep,
  solve: (a: TrackedStep, b: TrackedStep, speed: number) => TrackedStep,
  zeta: (s: TrackedStep) => number,
): CriticalPoint {
  // the root of ζ + 1e-9 (ζ within the tolerance counts as zero, so both ends keep their signs)
  const margin = (s: TrackedStep) => zeta(s) + DAMPING_TOLERANCE;
  type Point = { step: TrackedStep; value: number; usable: boolean };
  const evaluated: Point[] = [
    { step: a, value: margin(a), usable: true },
    { step: b, value: margin(b), usable: true },
  ];
  const evaluate = (from: TrackedStep, to: TrackedStep, speed: number): Point => {
    const s = solve(from, to, speed);
    // a static pole, or no converged fixed point (beyond a fold the followed solution no longer exists), counts as
    // the unstable side
    const usable = s.im > 0 && s.converged;
    return { step: s, value: usable ? margin(s) : evaluated[1].value, usable };
  };
  const f = (speed: number) => {
    const e = evaluate(a, b, speed);
    evaluated.push(e);
    return e.value;
  };
  // relative to the lower end (the root lies above it); from U = 0, relative to the bracket
  const scale = a.speedMps > 0 ? a.speedMps : 1e-3 * b.speedMps;
  const tolerance = Math.min(CRITICAL_SPEED_TOLERANCE, CRITICAL_SPEED_RELATIVE_TOLERANCE * scale);
  const speed = brentRoot(f, a.speedMps, b.speedMps, evaluated[0].value, evaluated[1].value, tolerance);
  // the final bracket: the nearest evaluated speeds with ζ ≥ 0 below and ζ < 0 above the root; `hi` is the nearest
  // converged pole above it
  let lo = evaluated[0];
  let hi = evaluated[1];
  let high = b.speedMps;
  for (const e of evaluated) {
    const u = e.step.speedMps;
    if (e.value >= 0 && u <= speed && u > lo.step.speedMps) lo = e;
    if (e.value < 0 && u >= speed && u < high) high = u;
    if (e.value < 0 && e.usable && u >= speed && u < hi.step.speedMps) hi = e;
  }
  const exact = evaluated.find((e) => e.step.speedMps === speed && e.usable);
  if (Math.min(Math.abs(lo.value), Math.abs(hi.value)) <= FOLD_SUSPECT) {
    const step = exact?.step ?? solve(a, b, speed);
    return { branch, speedMps: speed, step, atStart: false };
  }
  // narrow the jump between the speeds `low` and `high`
  let low = lo.step.speedMps;
  for (let it = 0; it < 60 && high - low > 1e-9 * high; it++) {
    const mid = 0.5 * (low + high);
    const e = evaluate(lo.step, hi.step, mid);
    if (e.value >= 0) {
      lo = e;
      low = mid;
    } else {
      if (e.usable) hi = e;
      high = mid;
    }
  }
  const jump = 0.5 * (low + high);
  if (Math.min(Math.abs(lo.value), Math.abs(hi.value)) <= FOLD_JUMP) {
    return { branch, speedMps: jump, step: Math.abs(lo.value) <= Math.abs(hi.value) ? lo.step : hi.step, atStart: false };
  }
  const fold = (located: boolean): FoldInfo => ({ speedMps: jump, dampingBefore: zeta(lo.step), dampingAfter: zeta(hi.step), located });
  for (const side of [lo.step, hi.step]) {
    const point = solveNeutralPoint(system, { speedMps: jump, omegaRadS: side.im, vecRe: side.vecRe, vecIm: side.vecIm });
    if (!point) continue;
    const n = system.size;
    const mac = modalAssurance(n, system.mass, point.vecRe, point.vecIm, side.vecRe, side.vecIm);
    if (mac < 0.5 || point.speedMps > hi.step.speedMps) continue;
    const step: TrackedStep = {
      speedMps: point.speedMps,
      re: 0,
      im: point.omegaRadS,
      vecRe: point.vecRe,
      vecIm: point.vecIm,
      reducedFrequency: point.reducedFrequency,
      mac: Number.NaN,
      confidence: Number.NaN,
      converged: true,
      extrapolated: system.hasAero && (system.isExtrapolated?.(point.reducedFrequency) ?? false),
    };
    return { branch, speedMps: point.speedMps, step, atStart: false, fold: fold(true) };
  }
  return { branch, speedMps: jump, step: lo.step, atStart: false, fold: fold(false) };
}

function solveAt(
  system: ModalSystem,
  work: ReturnType<typeof createPoleWorkspace>,
  outcome: ReturnType<typeof createPkOutcome>,
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
