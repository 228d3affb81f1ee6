import { resolveClosePairs } from "./close-pairs";
import type { ModalSystem } from "./modal-system";
import type { PoleWorkspace } from "./quadratic-operator";
import type { Pole } from "./refine-pole";
import { keepStaticContinuity } from "./static-continuity";
import type { TrackedStep } from "./track-poles";
import { assessStep } from "./tracking-confidence";

/** A step is accepted without refinement when every branch has at least this MAC and confidence. */
export const MIN_STEP_MAC = 0.9;
export const MIN_STEP_CONFIDENCE = 0.5;

/** The tracker's state that judging a step needs. */
export interface JudgeContext {
  readonly system: ModalSystem;
  readonly work: PoleWorkspace;
  readonly fullPoles: () => Pole[];
  /** Each branch's accepted steps. */
  readonly branches: readonly TrackedStep[][];
  /** Each branch's side of its real root at its last accepted step (0: oscillatory or unknown). */
  readonly sides: Int8Array;
  /** Receives each branch's side at the step last judged (copied into `sides` when that step is accepted). */
  readonly nextSides: Int8Array;
}

export interface StepJudgement {
  /** Accept without refinement. */
  readonly good: boolean;
  /** Poor verdict that refinement could not cure (reported `tracking-ambiguous` when forced). */
  readonly ambiguous: boolean;
  /** Some branch's p-k iteration hit its cap. */
  readonly notConverged: boolean;
}

/**
 * Judges one newly solved speed of every branch (the steps are corrected in place first).
 *
 * Method: (1) static branches are kept on their own real root (`keepStaticContinuity`); (2) pairs of poles that came
 * close within the step and whose shapes are not clearly distinct (MAC separation below 1) are assigned by continuity
 * of their discriminant (`resolveClosePairs`); (3) the optimal MAC assignment and each branch's confidence are
 * computed (`assessStep`). The step is good when every branch converged,
 * has MAC ≥ 0.9 and confidence ≥ 0.5, and the MAC assignment is the identity — where a close pair was resolved,
 * its own confidence replaces the MAC-based one and a swap inside it does not count. At the smallest step (`forced`)
 * a resolved pair's low MAC (eigenvectors turn sharply near an exceptional point) is not a reason to call the speed
 * ambiguous.
 * @param ctx tracker state
 * @param steps the new steps, one per branch
 * @param prev each branch's previous pole
 * @param pred each branch's predicted pole
 * @param forced true at the smallest step (the step will be accepted whatever the verdict)
 */
export function judgeStep(ctx: JudgeContext, steps: TrackedStep[], prev: Pole[], pred: Pole[], forced: boolean): StepJudgement {
  const n = ctx.system.size;
  keepStaticContinuity(ctx.system, ctx.work, ctx.fullPoles, steps, prev, ctx.sides, ctx.nextSides);
  let verdict = assessStep(n, ctx.system.mass, prev, pred, steps);
  // where both shapes are clearly distinct MAC decides; otherwise (similar shapes: veering, exceptional point) the
  // discriminant's continuity does
  let pairs = resolveClosePairs(ctx.branches, steps);
  if (pairs.length > 0) pairs = pairs.filter((p) => Math.min(verdict.separation[p.i], verdict.separation[p.j]) < 1);
  let partner: Int32Array | null = null;
  let pairConfidence: Float64Array | null = null;
  if (pairs.length > 0) {
    let swapped = false;
    partner = new Int32Array(steps.length).fill(-1);
    pairConfidence = new Float64Array(steps.length).fill(Number.NaN);
    for (const p of pairs) {
      if (p.swap) {
        [steps[p.i], steps[p.j]] = [steps[p.j], steps[p.i]];
        swapped = true;
      }
      for (const [a, b] of [[p.i, p.j], [p.j, p.i]]) {
        pairConfidence[a] = Number.isNaN(pairConfidence[a]) ? p.confidence : Math.min(pairConfidence[a], p.confidence);
        if (p.confidence >= MIN_STEP_CONFIDENCE) partner[a] = b;
      }
    }
    if (swapped) verdict = assessStep(n, ctx.system.mass, prev, pred, steps);
  }
  let identity = true;
  const assignment = verdict.assignment;
  for (let from = 0; from < assignment.length; from++) {
    const to = assignment[from];
    if (to !== from && (partner === null || partner[from] !== to)) identity = false;
  }
  let good = identity;
  let ambiguous = !identity;
  let notConverged = false;
  for (let j = 0; j < steps.length; j++) {
    const s = steps[j];
    s.mac = verdict.mac[j];
    s.confidence = pairConfidence === null || Number.isNaN(pairConfidence[j]) ? verdict.confidence[j] : pairConfidence[j];
    const shapeJump = s.mac < MIN_STEP_MAC;
    if (shapeJump || s.confidence < MIN_STEP_CONFIDENCE || !s.converged) good = false;
    if (s.confidence < MIN_STEP_CONFIDENCE || (shapeJump && !(forced && partner !== null && partner[j] >= 0))) ambiguous = true;
    if (!s.converged) notConverged = true;
  }
  return { good, ambiguous, notConverged };
}
