import { inverse, Matrix } from "ml-matrix";
import { allPoles } from "./all-poles";
import { assignPoles } from "./assign-poles";
import { assertModalSystem, type ModalSystem } from "./modal-system";
import { normalizeModeVector } from "./mode-vector";
import { createPkOutcome, solveBranchPk, type PkOutcome } from "./pk-branch";
import { createPoleWorkspace } from "./quadratic-operator";
import type { Pole } from "./refine-pole";
import { settleStaticTransition } from "./static-transition";
import { SweepStepLimitError } from "./step-limit-error";
import { assessStep } from "./tracking-confidence";

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

/** A step is accepted without refinement when every branch has at least this MAC and confidence. */
const MIN_STEP_MAC = 0.9;
const MIN_STEP_CONFIDENCE = 0.5;

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
 * the root that can cross zero — and is then followed by continuity.
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
  const accept = (steps: TrackedStep[], prev: Pole[], pred: Pole[], forced: boolean): boolean => {
    settleStaticTransition(system, work, fullPoles, steps, prev);
    const verdict = assessStep(n, mass, prev, pred, steps);
    let good = verdict.identity;
    for (let j = 0; j < n; j++) {
      steps[j].mac = verdict.mac[j];
      steps[j].confidence = verdict.confidence[j];
      if (verdict.mac[j] < MIN_STEP_MAC || verdict.confidence[j] < MIN_STEP_CONFIDENCE || !steps[j].converged) {
        good = false;
      }
    }
    if (!good && !forced) return false;
    for (let j = 0; j < n; j++) branches[j].push(steps[j]);
    if (forced && !good) {
      const speed = steps[0].speedMps;
      if (!verdict.identity || steps.some((s) => s.mac < MIN_STEP_MAC || s.confidence < MIN_STEP_CONFIDENCE)) {
        ambiguousSpeeds.push(speed);
      }
      if (steps.some((s) => !s.converged)) noConvergenceSpeeds.push(speed);
    }
    return true;
  };

  // The sweep is entered from still air: a hidden lead-in from U = 0 up to the first speed, so that each branch
  // is identified with its structural mode by continuity rather than by shape at a possibly high first speed.
  const from = speedsMps[0];
  const grid = [...leadIn(speedsMps), ...speedsMps];
  const stepLimit = options.stepLimit ?? Infinity;
  if (grid.length > stepLimit) throw new SweepStepLimitError(stepLimit, grid[0]);
  const first = solveRobust(grid[0], references, references);
  accept(first, references, references, true);

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
      if (accept(solveFast(target, prev, pred), prev, pred, false)) {
        targets.pop();
        continue;
      }
      // Halve only while the budget keeps room for the pending targets and the rest of the grid.
      const room = maxSteps - branches[0].length - targets.length - (grid.length - 1 - g);
      if (target - last > floor * 1.0000001 && room > 0) {
        targets.push(last + (target - last) / 2);
        continue;
      }
      accept(solveRobust(target, prev, pred), prev, pred, true);
      targets.pop();
    }
  }
  // drop the lead-in; trouble met there is reported at the first speed (the identification depends on it)
  const visible = branches.map((b) => b.filter((s) => s.speedMps >= from));
  const atStart = (list: number[]) => [...new Set(list.map((u) => Math.max(u, from)))];
  return { branches: visible, ambiguousSpeeds: atStart(ambiguousSpeeds), noConvergenceSpeeds: atStart(noConvergenceSpeeds) };
  return { branches, ambiguousSpeeds, noConvergenceSpeeds };
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

/** Quadratic (Lagrange) extrapolation of a branch's pole in U from its last three steps. */
function predict(steps: TrackedStep[], speed: number): Pole {
  const count = Math.min(3, steps.length);
  const pts = steps.slice(steps.length - count);
  let re = 0;
  let im = 0;
  for (let a = 0; a < count; a++) {
    let w = 1;
    for (let c = 0; c < count; c++) {
      if (c !== a) w *= (speed - pts[c].speedMps) / (pts[a].speedMps - pts[c].speedMps);
    }
    re += w * pts[a].re;
    im += w * pts[a].im;
  }
  const last = steps[steps.length - 1];
  if (last.im === 0) im = 0;
  return { re, im, vecRe: last.vecRe, vecIm: last.vecIm };
}

function copyPole(p: Pole, n: number): Pole {
  return { re: p.re, im: p.im, vecRe: Float64Array.from(p.vecRe.subarray(0, n)), vecIm: Float64Array.from(p.vecIm.subarray(0, n)) };
}

function toRows(a: Float64Array, n: number): number[][] {
  return Array.from({ length: n }, (_, i) => Array.from(a.subarray(i * n, i * n + n)));
}
