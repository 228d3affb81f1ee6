import { dampingDip, dampingRatio } from "./damping";
import { knotSpeed, nextKnotPassage } from "./knot-visit";
import type { ModalSystem } from "./modal-system";
import type { TrackedStep } from "./track-poles";

/**
 * A speed inside the step from the branches' last accepted speed to a newly solved one that the tracker must solve
 * before accepting the step, or null: where some branch passes a row of the aerodynamic table (located by
 * `knotSpeed`), else where the quadratic model of some branch's damping through its last two accepted steps and the
 * new one dips below zero (the model's minimum, `dampingDip`) — docs/method-and-validation.md §3, rules 1 and 2.
 * @param system the tracked system
 * @param branches each branch's accepted steps
 * @param next each branch's newly solved step
 * @param solveBetween solves one branch at a speed, warm-started between two of its steps
 */
export function mustVisit(
  system: ModalSystem,
  branches: readonly TrackedStep[][],
  next: readonly TrackedStep[],
  solveBetween: (a: TrackedStep, b: TrackedStep, speed: number) => TrackedStep,
): number | null {
  const knot = nextKnotPassage(system, branches, next);
  if (knot !== null) {
    const a = branches[knot.branch][branches[knot.branch].length - 1];
    const b = next[knot.branch];
    return knotSpeed(a, b, knot.inverseK, (speed) => solveBetween(a, b, speed));
  }
  let dip: number | null = null;
  for (let j = 0; j < next.length; j++) {
    const steps = branches[j];
    if (steps.length < 2) continue;
    const o = steps[steps.length - 2];
    const p = steps[steps.length - 1];
    const q = next[j];
    if (!(o.im > 0 && p.im > 0 && q.im > 0)) continue;
    const at = dampingDip(o.speedMps, dampingRatio(o.re, o.im), p.speedMps, dampingRatio(p.re, p.im), q.speedMps, dampingRatio(q.re, q.im));
    if (at !== null && (dip === null || at < dip)) dip = at;
  }
  return dip;
}
