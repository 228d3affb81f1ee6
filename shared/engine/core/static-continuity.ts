import { determinantSign } from "./determinant-sign";
import type { ModalSystem } from "./modal-system";
import { normalizeModeVector } from "./mode-vector";
import { frequencyScale } from "./newton-settings";
import { STATIC_IM_TOLERANCE } from "./pk-branch";
import { assembleQuadratic, type PoleWorkspace } from "./quadratic-operator";
import type { Pole } from "./refine-pole";
import { settleStaticTransition } from "./static-transition";
import type { TrackedStep } from "./track-poles";

/** Offset (relative to max(|λ|, the frequency scale)) at which det Q is sampled on either side of a real root. */
const SIDE_OFFSET = 1e-7;

/**
 * Keeps every static branch on its own real root: the continuity test of real roots.
 *
 * Method: a pole pair that reaches the real axis splits into two real roots whose eigenvectors are nearly parallel,
 * so MAC cannot tell them apart and Newton from an extrapolated start may land on the wrong one. The invariant used
 * instead is the side of the root: s = sign(d/dλ det Q(λ)) at a simple real root (det Q = det(λ²M + λC + K) at the
 * reduced-frequency floor) cannot change along a continuous real root without passing a double root, where the
 * roots would leave the real axis. At a transition the side comes from the full decomposition
 * (`settleStaticTransition`: the larger root of the pair); afterwards it is sampled at λ ± 1e-7·max(|λ|, ω_scale)
 * by the sign of the determinant (`determinantSign`), and when it differs from the branch's side the real roots of a
 * full decomposition with the branch's side, not held by another branch, are searched and the one nearest to the
 * branch's previous root is taken (docs/method-and-validation.md §3).
 * Notes: where the side cannot be sampled (another root within the offset) the branch keeps its previous side.
 * @param system the n-mode system
 * @param work workspace (re-assembled here)
 * @param fullPoles full decomposition of the currently assembled pencil
 * @param steps the newly solved steps, modified in place
 * @param prev each branch's previous pole
 * @param sides each branch's side at its previous step (0 when unknown or oscillatory)
 * @param next receives each branch's side at the new step (0 for oscillatory branches)
 */
export function keepStaticContinuity(
  system: ModalSystem,
  work: PoleWorkspace,
  fullPoles: () => Pole[],
  steps: TrackedStep[],
  prev: readonly Pole[],
  sides: Int8Array,
  next: Int8Array,
): void {
  next.fill(0);
  let anyStatic = false;
  for (const s of steps) if (s.im === 0) anyStatic = true;
  if (!anyStatic) return;
  settleStaticTransition(system, work, fullPoles, steps, prev, next);
  for (let j = 0; j < steps.length; j++) {
    const s = steps[j];
    if (s.im !== 0 || prev[j].im !== 0) continue;
    assembleQuadratic(system, s.speedMps, 0, work);
    const side = rootSide(system.mass, work, s.re);
    next[j] = side !== 0 && sides[j] !== 0 && side !== sides[j] ? correctRoot(system, fullPoles, steps, j, prev[j], sides[j]) : side || sides[j];
  }
}

/** Moves branch j onto the real root with its own side nearest to its previous root; returns the side kept. */
function correctRoot(system: ModalSystem, fullPoles: () => Pole[], steps: TrackedStep[], j: number, prev: Pole, side: number): number {
  const n = system.size;
  const reals = fullPoles().filter((p) => Math.abs(p.im) <= STATIC_IM_TOLERANCE * Math.hypot(p.re, p.im));
  const held = (p: Pole) => steps.some((o, i) => i !== j && o.im === 0 && Math.abs(o.re - p.re) <= 1e-6 * Math.abs(p.re) + 1e-300);
  let chosen: Pole | null = null;
  for (const p of reals) {
    const above = reals.filter((q) => q.re > p.re).length;
    if ((above % 2 === 0 ? 1 : -1) !== side || held(p)) continue;
    if (chosen === null || Math.abs(p.re - prev.re) < Math.abs(chosen.re - prev.re)) chosen = p;
  }
  if (chosen === null) return -side;
  const s = steps[j];
  s.re = chosen.re;
  s.vecRe = Float64Array.from(chosen.vecRe);
  s.vecIm = new Float64Array(n);
  normalizeModeVector(n, system.mass, s.vecRe, s.vecIm);
  return side;
}

/**
 * sign(d/dλ det Q(λ)) at a real root λ of the assembled pencil Q(λ) = λ²M + λC + K (C = `work.dampTot`,
 * K = `work.stiffTot`), sampled as the sign of det Q(λ + ε) with the opposite sign required at λ − ε; 0 when the two
 * agree (another root within ε) or a sample is singular.
 */
export function rootSide(mass: Float64Array, work: PoleWorkspace, lambda: number): number {
  const eps = SIDE_OFFSET * Math.max(Math.abs(lambda), frequencyScale(mass, work));
  const above = signAt(mass, work, lambda + eps);
  const below = signAt(mass, work, lambda - eps);
  return above !== 0 && above === -below ? above : 0;
}

/** sign det Q(λ) for real λ, factored in the workspace's spare buffer `jRe`. */
function signAt(mass: Float64Array, work: PoleWorkspace, lambda: number): number {
  const n = work.n;
  const a = work.jRe;
  for (let i = 0; i < n * n; i++) a[i] = lambda * lambda * mass[i] + lambda * work.dampTot[i] + work.stiffTot[i];
  return determinantSign(n, a);
}
