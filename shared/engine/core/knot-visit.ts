import type { ModalSystem } from "./modal-system";
import type { TrackedStep } from "./track-poles";

/** A branch is at a knot when its 1/K is within this fraction of the knot's. */
export const KNOT_TOLERANCE = 1e-7;
/** The speed of a knot is located to this fraction in 1/K (tighter than `KNOT_TOLERANCE`, so one visit is enough). */
const KNOT_TARGET = 1e-10;
/** Regula falsi steps spent on locating the speed of one knot. */
const KNOT_ITERATIONS = 12;

/** One branch's passage through a knot between two solved speeds. */
export interface KnotPassage {
  readonly branch: number;
  /** 1/K of the knot. */
  readonly inverseK: number;
}

/**
 * The first knot of the aerodynamic data (`system.reducedFrequencyKnots`) that some oscillatory branch passes
 * strictly between its last accepted step and its newly solved one, or null — the one nearest to the last step.
 *
 * Method: interpolated tables (linear or Fritsch–Carlson monotone cubic in Ur) change character only at their rows,
 * and each derivative's extrema lie there, so a narrow instability window between two grid speeds shows at a knot
 * (docs/method-and-validation.md §3). Ur = 2π/K is nearly linear in U along a branch, so the passage nearest to the
 * last step is the one whose linearly interpolated speed is lowest.
 * Notes: static branches (K at the floor) are skipped; at U = 0 (K at its ceiling 1e6) 1/K ≈ 0 stands for Ur ≈ 0; a
 * branch within 1e-7 of a knot in 1/K is at it.
 * @param system the system (knots as reduced frequencies K)
 * @param history each branch's accepted steps (the last one is the start of the interval)
 * @param next each branch's newly solved step
 */
export function nextKnotPassage(system: ModalSystem, history: readonly TrackedStep[][], next: readonly TrackedStep[]): KnotPassage | null {
  const knots = system.reducedFrequencyKnots;
  if (!knots || knots.length === 0) return null;
  const floor = system.minReducedFrequency * (1 + 1e-12);
  let best: KnotPassage | null = null;
  let bestSpeed = Number.POSITIVE_INFINITY;
  for (let j = 0; j < next.length; j++) {
    const a = history[j][history[j].length - 1];
    const b = next[j];
    if (!(a.im > 0) || !(b.im > 0)) continue;
    if (a.reducedFrequency <= floor || b.reducedFrequency <= floor) continue;
    const ra = 1 / a.reducedFrequency;
    const rb = 1 / b.reducedFrequency;
    for (const k of knots) {
      const r = 1 / k;
      if ((r - ra) * (r - rb) >= 0) continue;
      if (Math.abs(r - ra) <= KNOT_TOLERANCE * r || Math.abs(r - rb) <= KNOT_TOLERANCE * r) continue;
      const speed = a.speedMps + ((b.speedMps - a.speedMps) * (r - ra)) / (rb - ra);
      if (speed < bestSpeed) {
        bestSpeed = speed;
        best = { branch: j, inverseK: r };
      }
    }
  }
  return best;
}

/**
 * The speed in (a, b) at which a branch's 1/K equals `inverseK`: regula falsi (Illinois variant) on 1/K(U) − 1/K_knot,
 * each evaluation a p-k solve of that branch (`solve`), to 1e-10 in 1/K or 12 evaluations.
 * @param a the branch's last accepted step
 * @param b the branch's newly solved step
 * @param inverseK 1/K of the knot (between those of a and b)
 * @param solve solves the branch at a speed, warm-started between a and b
 * @returns the speed, m/s
 */
export function knotSpeed(a: TrackedStep, b: TrackedStep, inverseK: number, solve: (speed: number) => TrackedStep): number {
  let ua = a.speedMps;
  let ub = b.speedMps;
  let ga = 1 / a.reducedFrequency - inverseK;
  let gb = 1 / b.reducedFrequency - inverseK;
  let side = 0;
  let u = ua + ((ub - ua) * -ga) / (gb - ga);
  for (let it = 0; it < KNOT_ITERATIONS; it++) {
    const s = solve(u);
    if (!(s.im > 0)) return u;
    const g = 1 / s.reducedFrequency - inverseK;
    if (Math.abs(g) <= KNOT_TARGET * inverseK) return u;
    if (g * ga > 0) {
      ua = u;
      ga = g;
      if (side === -1) gb /= 2;
      side = -1;
    } else {
      ub = u;
      gb = g;
      if (side === 1) ga /= 2;
      side = 1;
    }
    u = ua + ((ub - ua) * -ga) / (gb - ga);
  }
  return u;
}
