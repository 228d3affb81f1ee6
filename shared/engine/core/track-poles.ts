import { inverse, Matrix } from "ml-matrix";
import { allPoles } from "./all-poles";
import { assignPoles } from "./assign-poles";
import { assertModalSystem, type ModalSystem } from "./modal-system";
import { normalizeModeVector } from "./mode-vector";
import { createPkOutcome, solveBranchPk, type PkOutcome } from "./pk-branch";
import { createPoleWorkspace } from "./quadratic-operator";
import type { Pole } from "./refine-pole";
import { SweepStepLimitError } from "./step-limit-error";
import { judgeStep, type JudgeContext, type StepJudgement } from "./judge-step";
import { mustVisit } from "./must-visit";
import { predict } from "./predict-pole";

/** One solved speed of one tracked branch. */
export interface TrackedStep {
  speedMps: number;
  /** Pole λ, rad/s. */
  re: number;
  im: number;
  /** Displacement eigenvector, unit kinetic norm. */
  vecRe: Float64Array;
  vecIm: Float64Array;
  /** Reduced frequency K used (after floor/ceiling). */
  reducedFrequency: number;
  /** MAC with the same branch's previous step (1 at the first speed). */
  mac: number;
  /** Tracker confidence 0–1 (see `assessStep`). */
  confidence: number;
  converged: boolean;
  extrapolated: boolean;
}

export interface TrackResult {
  /** branches[j] = steps of the branch that starts from structural coordinate j, sorted by speed. */
  readonly branches: TrackedStep[][];
  /** Speeds where the step floor was reached and the assignment stayed uncertain. */
  readonly ambiguousSpeeds: number[];
  /** Speeds where some branch's p-k iteration hit its cap. */
  readonly noConvergenceSpeeds: number[];
}

export interface TrackOptions {
  /** Smallest local step as a fraction of the grid step (default 1/64: six halvings). */
  readonly minStepFraction?: number;
  /**
   * Most steps the tracker may take in all (grid, lead-in and local refinement), default 4 × the grid plus 2,000.
   * When a deck refines at every interval (extreme inputs), the refinement budget runs out and the remaining
   * speeds are solved at the grid only and reported ambiguous where the verdict is poor — instead of halving
   * every interval six times (64 × the grid: a 20,000-step sweep then ran for a minute and held the server).
   */
  readonly maxSteps?: number;
  /**
   * Hard limit on the speeds solved in all (grid, lead-in and local refinement): a sweep that would need more
   * stops with a `SweepStepLimitError` instead of finishing (a server bounds one request's work with it; the
   * default is no limit). Unlike `maxSteps`, reaching it is an error, not a quieter refinement.
   */
  readonly stepLimit?: number;
}

/**
 * Tracks every pole of an n-mode aeroelastic system through a sweep of wind speeds by the p-k method.
 *
 * Method: branch j starts at the still-air pole whose eigenvector correlates best with coordinate j (optimal
 * assignment) and is followed from U = 0 through a hidden lead-in up to the first speed (so a branch keeps the
 * identity of its structural mode even when the sweep starts at a high speed). At each new speed every branch is predicted by quadratic extrapolation of its last three poles
 * in U and solved by a warm-started p-k iteration (`solveBranchPk`). The step is judged by `assessStep`
 * (optimal MAC assignment, confidence); when any branch swaps, loses shape correlation (MAC < 0.9), falls below
 * confidence 0.5 or fails to converge, the step is halved locally, down to `minStepFraction` of the grid step.
 * At the floor the p-k iteration is redone with a full decomposition at every iterate, each branch taking the
 * pole that an optimal assignment (cost 1 − MAC + normalised predictor distance) gives it; the speed is then
 * reported as ambiguous if the verdict stays poor. Branches are never sorted by frequency. A branch whose pole
 * pair reaches the real axis (static branch) continues on the larger of the two real roots it splits into —
 * the root that can cross zero — and is then kept on its own real root by the side of that root
 * (`keepStaticContinuity`); close pairs with similar shapes are assigned by their discriminant (`resolveClosePairs`);
 * both in `judgeStep`. So that no grid can hide what the data contain, a good step is not accepted while some branch
 * passes a table row inside it (the row's speed is solved first, `nextKnotPassage`/`knotSpeed`) or the quadratic
 * model of a branch's damping through its last two steps and the new one dips below zero inside it (the model's
 * minimum is solved first, `dampingDip`) — docs/method-and-validation.md §3.
 * Notes: references for the strategy — Desforges, Cooper & Wright 1996 (Proc. IMechE G 210), Eldred, Venkayya
 * & Anderson 1995 (AIAA J. 33(7)), from memory. Refinement speeds are solved for every branch, so all
 * branches share the same list of speeds.
 * @param system the n-mode system
 * @param speedsMps increasing wind speeds, m/s (≥ 0)
 * @returns tracked branches in coordinate order
 */
export function trackPoles(system: ModalSystem, speedsMps: readonly number[], options: TrackOptions = {}): TrackResult {
  assertModalSystem(system);
  if (speedsMps.length === 0) throw new Error("trackPoles: no speeds to solve");
  for (let i = 1; i < speedsMps.length; i++) {
    if (!(speedsMps[i] > speedsMps[i - 1])) throw new Error("trackPoles: speeds must increase strictly");
  }
  const n = system.size;
  const mass = system.mass;
  const massInverse = Float64Array.from(inverse(new Matrix(toRows(mass, n))).to1DArray());
  const work = createPoleWorkspace(n);
  const outcomes: PkOutcome[] = Array.from({ length: n }, () => createPkOutcome(n));
  const branches: TrackedStep[][] = Array.from({ length: n }, () => []);
  const ambiguousSpeeds: number[] = [];
  const noConvergenceSpeeds: number[] = [];
  const fullPoles = () => allPoles(mass, massInverse, work);

  // still-air poles, assigned to coordinates
  work.stiffTot.set(system.stiffness);
  work.dampTot.set(system.damping);
  const still = allPoles(mass, massInverse, work);
  const unit: Pole[] = Array.from({ length: n }, (_, j) => {
    const p: Pole = { re: 0, im: 0, vecRe: new Float64Array(n), vecIm: new Float64Array(n) };
    p.vecRe[j] = 1;
    return p;
  });
  const stillChoice = assignPoles(n, mass, unit, unit, still, null);
  const references: Pole[] = Array.from(stillChoice, (c) => copyPole(still[c], n));
  for (const r of references) normalizeModeVector(n, mass, r.vecRe, r.vecIm);

  const solveRobust = (speed: number, prev: Pole[], pred: Pole[]): TrackedStep[] =>
    prev.map((guess, j) => {
      const select = (poles: Pole[]) => poles[assignPoles(n, mass, prev, pred, poles, prev)[j]];
      const start = { ...pred[j], vecRe: guess.vecRe, vecIm: guess.vecIm };
      return toStep(solveBranchPk(system, work, speed, start, outcomes[j], select, fullPoles), speed);
    });
  const solveFast = (speed: number, prev: Pole[], pred: Pole[]): TrackedStep[] =>
    prev.map((guess, j) => {
      const start = { re: pred[j].re, im: pred[j].im, vecRe: guess.vecRe, vecIm: guess.vecIm };
      return toStep(solveBranchPk(system, work, speed, start, outcomes[j]), speed);
    });
  const toStep = (o: PkOutcome, speed: number): TrackedStep => ({
    speedMps: speed,
    re: o.pole.re,
    im: o.pole.im,
    vecRe: Float64Array.from(o.pole.vecRe),
    vecIm: Float64Array.from(o.pole.vecIm),
    reducedFrequency: o.reducedFrequency,
    mac: 1,
    confidence: 1,
    converged: o.converged,
    extrapolated: system.hasAero && speed > 0 && (system.isExtrapolated?.(o.reducedFrequency) ?? false),
  });
  const context: JudgeContext = { system, work, fullPoles, branches, sides: new Int8Array(n), nextSides: new Int8Array(n) };
  const commit = (steps: TrackedStep[], judged: StepJudgement, forced: boolean) => {
    for (let j = 0; j < n; j++) branches[j].push(steps[j]);
    context.sides.set(context.nextSides);
    if (forced && !judged.good) {
      if (judged.ambiguous) ambiguousSpeeds.push(steps[0].speedMps);
      if (judged.notConverged) noConvergenceSpeeds.push(steps[0].speedMps);
    }
  };
  // one branch solved alone between two of its steps (locating a table row's speed, `mustVisit`)
  const spare = createPkOutcome(n);
  const solveBetween = (a: TrackedStep, b: TrackedStep, speed: number): TrackedStep => {
    const t = (speed - a.speedMps) / (b.speedMps - a.speedMps);
    const start = { re: a.re + t * (b.re - a.re), im: a.im + t * (b.im - a.im), vecRe: a.vecRe, vecIm: a.vecIm };
    return toStep(solveBranchPk(system, work, speed, start, spare), speed);
  };

  // The sweep is entered from still air: a hidden lead-in from U = 0 up to the first speed, so that each branch
  // is identified with its structural mode by continuity rather than by shape at a possibly high first speed.
  const from = speedsMps[0];
  const grid = [...leadIn(speedsMps), ...speedsMps];
  const stepLimit = options.stepLimit ?? Infinity;
  if (grid.length > stepLimit) throw new SweepStepLimitError(stepLimit, grid[0]);
  const first = solveRobust(grid[0], references, references);
  commit(first, judgeStep(context, first, references, references, true), true);

  const maxSteps = options.maxSteps ?? 4 * grid.length + 2000;
  for (let g = 1; g < grid.length; g++) {
    const floor = (grid[g] - grid[g - 1]) * (options.minStepFraction ?? 1 / 64);
    const targets = [grid[g]];
    while (targets.length > 0) {
      const target = targets[targets.length - 1];
      const last = branches[0][branches[0].length - 1].speedMps;
      if (branches[0].length >= stepLimit) throw new SweepStepLimitError(stepLimit, last);
      const prev = branches.map((b) => b[b.length - 1]);
      const pred = branches.map((b) => predict(b, target));
      const steps = solveFast(target, prev, pred);
      const judged = judgeStep(context, steps, prev, pred, false);
      // Refine only while the budget keeps room for the pending targets and the rest of the grid.
      const room = maxSteps - branches[0].length - targets.length - (grid.length - 1 - g);
      const refinable = target - last > floor * 1.0000001 && room > 0;
      if (judged.good) {
        const visit = refinable ? mustVisit(system, branches, steps, solveBetween) : null;
        // a visit right next to either end adds nothing (and would crowd the predictor's nodes)
        const margin = 1e-4 * (target - last) + 1e-9 * Math.max(1, target);
        if (visit !== null && visit - last > margin && target - visit > margin) {
          targets.push(visit);
          continue;
        }
        commit(steps, judged, false);
        targets.pop();
        continue;
      }
      if (refinable) {
        targets.push(last + (target - last) / 2);
        continue;
      }
      const robust = solveRobust(target, prev, pred);
      commit(robust, judgeStep(context, robust, prev, pred, true), true);
      targets.pop();
    }
  }
  // drop the lead-in; trouble met there is reported at the first speed (the identification depends on it)
  const visible = branches.map((b) => b.filter((s) => s.speedMps >= from));
  const atStart = (list: number[]) => [...new Set(list.map((u) => Math.max(u, from)))];
  return { branches: visible, ambiguousSpeeds: atStart(ambiguousSpeeds), noConvergenceSpeeds: atStart(noConvergenceSpeeds) };
}

/**
 * Hidden speeds from 0 up to (not including) the first speed: steps of the grid's first step, at most 200 of them
 * (never coarser than needed: the tracker still refines locally).
 */
function leadIn(speeds: readonly number[]): number[] {
  const from = speeds[0];
  if (!(from > 0)) return [];
  const gridStep = speeds.length > 1 ? speeds[1] - speeds[0] : from;
  const count = Math.min(200, Math.max(1, Math.ceil(from / gridStep)));
  return Array.from({ length: count }, (_, i) => (i * from) / count);
}

function copyPole(p: Pole, n: number): Pole {
  return { re: p.re, im: p.im, vecRe: Float64Array.from(p.vecRe.subarray(0, n)), vecIm: Float64Array.from(p.vecIm.subarray(0, n)) };
}

function toRows(a: Float64Array, n: number): number[][] {
  return Array.from({ length: n }, (_, i) => Array.from(a.subarray(i * n, i * n + n)));
}
