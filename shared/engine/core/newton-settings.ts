import type { PoleWorkspace } from "./quadratic-operator";

/** Newton tolerances shared by the two refinement paths (relative to the pole's modulus). */
export const NEWTON_MAX_ITERATIONS = 40;
export const NEWTON_TOLERANCE = 1e-13;
/** Below this relative step a non-decreasing step means the rounding floor is reached: accept. */
export const NEWTON_STAGNATION = 1e-9;

/**
 * max_i √(|K_ii| / M_ii) of the assembled pencil, rad/s: the system's own frequency scale, used as a floor for
 * relative tolerances near λ = 0 (a real root passing through zero).
 */
export function frequencyScale(mass: Float64Array, work: PoleWorkspace): number {
  const n = work.n;
  let best = 0;
  for (let i = 0; i < n; i++) best = Math.max(best, Math.abs(work.stiffTot[i * n + i]) / mass[i * n + i]);
  return Math.sqrt(best);
}
