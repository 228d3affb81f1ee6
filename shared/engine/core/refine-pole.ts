import { factorComplexLu, solveComplexLu } from "./complex-lu";
import type { PoleWorkspace } from "./quadratic-operator";

/** A pole λ = re + i·im (rad/s) with its displacement eigenvector x (complex, n entries). */
export interface Pole {
  re: number;
  im: number;
  readonly vecRe: Float64Array;
  readonly vecIm: Float64Array;
}

const NEWTON_MAX_ITERATIONS = 40;
const NEWTON_TOLERANCE = 1e-13;
/**
 * A step this small (relative), after a step that shrank at least 1000-fold (quadratic convergence observed),
 * leaves an error of the order of its square: accept without a confirming iteration.
 */
const NEWTON_QUADRATIC_ACCEPT = 1e-7;
/** Below this relative step a non-decreasing step means the rounding floor is reached: accept. */
const NEWTON_STAGNATION = 1e-9;
/** Bordered path: accept when the estimated remaining error step·q/(1 − q) (q = observed contraction) is below this. */
const CHORD_ERROR_TOLERANCE = 1e-13;
/** Bordered path: a correction from reused factors larger than this (relative) is discarded and the Jacobian refactored. */
const CHORD_MAX_STEP = 1e-3;
/** A refinement that moves λ further than this (relative to the start) has left the branch: reported as failed. */
const NEWTON_MAX_DRIFT = 2;

/**
 * Refines one eigenpair of the quadratic eigenproblem Q(λ) x = (λ²M + λC + K) x = 0 from a nearby guess,
 * with C = `work.dampTot`, K = `work.stiffTot` (assembled beforehand at fixed reduced frequency).
 *
 * Method: for n = 2, Newton's method on the scalar det Q(λ) (a real-coefficient quartic written through the
 * 2×2 entries and their derivatives), the eigenvector then taken from the better-conditioned row of Q(λ). For
 * n > 2, Newton's method on the bordered system [Q(λ) x = 0, vᴴx = 1] (Ruhe 1973, "Algorithms for the
 * nonlinear eigenvalue problem", SIAM J. Numer. Anal. 10(4); Güttel & Tisseur 2017, Acta Numerica 26, §4.3),
 * as a chord iteration: the LU factors of the bordered Jacobian are kept in the workspace and reused (within a
 * branch's p-k solve, where λ and K move very little) until the contraction slows below 4:1, so most
 * iterations cost one O(n²) substitution instead of an O(n³) factorisation. Both converge to a simple eigenvalue from a warm start (previous
 * speed or p-k iterate): quadratically (determinant) or fast-linearly (chord).
 * Notes: stops when |Δλ| ≤ 1e-13·|λ|; or, determinant path, when |Δλ| ≤ 1e-7·|λ| after a 1000-fold shrink
 * (quadratic convergence: the remaining error is of the order of the step squared); or, bordered path, when the
 * remaining error estimated from the observed contraction q, |Δλ|·q/(1 − q), is below 1e-13·|λ|; or at the
 * rounding floor below 1e-9·|λ|. After 40 iterations it returns false. The eigenvector is left unnormalised.
 * @param mass M (n×n row-major)
 * @param work workspace with the assembled C and K
 * @param guessRe real part of the starting λ, rad/s
 * @param guessIm imaginary part of the starting λ, rad/s
 * @param startRe real part of the starting eigenvector (n > 2 only; the normalisation vector v)
 * @param startIm imaginary part of the starting eigenvector
 * @param out receives λ and x
 * @returns true when converged
 */
export function refinePole(
  mass: Float64Array,
  work: PoleWorkspace,
  guessRe: number,
  guessIm: number,
  startRe: Float64Array,
  startIm: Float64Array,
  out: Pole,
): boolean {
  if (work.n === 2) return refinePole2(mass, work, guessRe, guessIm, out);
  return refinePoleBordered(mass, work, guessRe, guessIm, startRe, startIm, out);
}

function refinePole2(mass: Float64Array, work: PoleWorkspace, guessRe: number, guessIm: number, out: Pole): boolean {
  const c = work.dampTot;
  const k = work.stiffTot;
  const m11 = mass[0], m12 = mass[1], m21 = mass[2], m22 = mass[3];
  const c11 = c[0], c12 = c[1], c21 = c[2], c22 = c[3];
  const k11 = k[0], k12 = k[1], k21 = k[2], k22 = k[3];
  let lr = guessRe;
  let li = guessIm;
  let converged = false;
  let lastStep = Number.POSITIVE_INFINITY;
  const floor = 1e-3 * frequencyScale(mass, work);
  // entries of Q(λ) = λ²m + λc + k and Q'(λ) = 2λm + c for a 2×2 block, complex
  let q11r = 0, q11i = 0, q12r = 0, q12i = 0, q21r = 0, q21i = 0, q22r = 0, q22i = 0;
  for (let it = 0; it < NEWTON_MAX_ITERATIONS; it++) {
    const l2r = lr * lr - li * li;
    const l2i = 2 * lr * li;
    q11r = l2r * m11 + lr * c11 + k11; q11i = l2i * m11 + li * c11;
    q12r = l2r * m12 + lr * c12 + k12; q12i = l2i * m12 + li * c12;
    q21r = l2r * m21 + lr * c21 + k21; q21i = l2i * m21 + li * c21;
    q22r = l2r * m22 + lr * c22 + k22; q22i = l2i * m22 + li * c22;
    const d11r = 2 * lr * m11 + c11, d11i = 2 * li * m11;
    const d12r = 2 * lr * m12 + c12, d12i = 2 * li * m12;
    const d21r = 2 * lr * m21 + c21, d21i = 2 * li * m21;
    const d22r = 2 * lr * m22 + c22, d22i = 2 * li * m22;
    // f = q11 q22 − q12 q21
    const fr = q11r * q22r - q11i * q22i - (q12r * q21r - q12i * q21i);
    const fi = q11r * q22i + q11i * q22r - (q12r * q21i + q12i * q21r);
    // f' = d11 q22 + q11 d22 − d12 q21 − q12 d21
    const gr =
      d11r * q22r - d11i * q22i + (q11r * d22r - q11i * d22i) - (d12r * q21r - d12i * q21i) - (q12r * d21r - q12i * d21i);
    const gi =
      d11r * q22i + d11i * q22r + (q11r * d22i + q11i * d22r) - (d12r * q21i + d12i * q21r) - (q12r * d21i + q12i * d21r);
    const gg = gr * gr + gi * gi;
    if (gg === 0) break;
    const dr = (fr * gr + fi * gi) / gg;
    const di = (fi * gr - fr * gi) / gg;
    lr -= dr;
    li -= di;
    const step = Math.hypot(dr, di);
    if (!Number.isFinite(step)) break;
    const scale = Math.max(Math.hypot(lr, li), floor);
    if (
      step <= NEWTON_TOLERANCE * scale ||
      (step <= NEWTON_QUADRATIC_ACCEPT * scale && step <= 1e-3 * lastStep) ||
      (step >= lastStep && step <= NEWTON_STAGNATION * scale)
    ) {
      converged = true;
      break;
    }
    lastStep = step;
  }
  // Q at the final λ for the eigenvector
  const l2r = lr * lr - li * li;
  const l2i = 2 * lr * li;
  q11r = l2r * m11 + lr * c11 + k11; q11i = l2i * m11 + li * c11;
  q12r = l2r * m12 + lr * c12 + k12; q12i = l2i * m12 + li * c12;
  q21r = l2r * m21 + lr * c21 + k21; q21i = l2i * m21 + li * c21;
  q22r = l2r * m22 + lr * c22 + k22; q22i = l2i * m22 + li * c22;
  const row1 = q11r * q11r + q11i * q11i + q12r * q12r + q12i * q12i;
  const row2 = q21r * q21r + q21i * q21i + q22r * q22r + q22i * q22i;
  if (row1 >= row2) {
    out.vecRe[0] = -q12r; out.vecIm[0] = -q12i;
    out.vecRe[1] = q11r; out.vecIm[1] = q11i;
  } else {
    out.vecRe[0] = q22r; out.vecIm[0] = q22i;
    out.vecRe[1] = -q21r; out.vecIm[1] = -q21i;
  }
  if (row1 === 0 && row2 === 0) {
    // Q(λ) = 0: every vector is an eigenvector; keep the first coordinate
    out.vecRe[0] = 1; out.vecIm[0] = 0; out.vecRe[1] = 0; out.vecIm[1] = 0;
  }
  out.re = lr;
  out.im = li;
  return converged;
}

function refinePoleBordered(
  mass: Float64Array,
  work: PoleWorkspace,
  guessRe: number,
  guessIm: number,
  startRe: Float64Array,
  startIm: Float64Array,
  out: Pole,
): boolean {
  const n = work.n;
  const m = n + 1;
  const { luRe, luIm, pivots, rRe, rIm, xRe, xIm } = work;
  const c = work.dampTot;
  const k = work.stiffTot;
  // v = start; x0 = v / (vᴴv) so that vᴴx0 = 1
  let vv = 0;
  for (let i = 0; i < n; i++) vv += startRe[i] * startRe[i] + startIm[i] * startIm[i];
  if (!(vv > 0)) return false;
  for (let i = 0; i < n; i++) {
    xRe[i] = startRe[i] / vv;
    xIm[i] = startIm[i] / vv;
  }
  let lr = guessRe;
  let li = guessIm;
  let converged = false;
  let lastStep = Number.POSITIVE_INFINITY;
  let refactor = !work.factored;
  // tolerances relative to the warm start (floored by the system's own frequency scale, for real roots passing
  // through zero), so that a diverging iterate cannot loosen them
  const scale = Math.max(Math.hypot(guessRe, guessIm), 1e-3 * frequencyScale(mass, work), 1e-300);
  let applied = 0;
  for (let it = 0; it < NEWTON_MAX_ITERATIONS; it++) {
    const reused = !refactor;
    const l2r = lr * lr - li * li;
    const l2i = 2 * lr * li;
    let lastRe = 0;
    let lastIm = 0;
    for (let i = 0; i < n; i++) {
      let qxr = 0, qxi = 0, dxr = 0, dxi = 0;
      const row = i * n;
      const jrow = i * m;
      for (let j = 0; j < n; j++) {
        const mm = mass[row + j];
        const cc = c[row + j];
        const qr = l2r * mm + lr * cc + k[row + j];
        const qi = l2i * mm + li * cc;
        if (refactor) {
          luRe[jrow + j] = qr;
          luIm[jrow + j] = qi;
        }
        const ar = xRe[j];
        const ai = xIm[j];
        qxr += qr * ar - qi * ai;
        qxi += qr * ai + qi * ar;
        if (refactor) {
          const pr = 2 * lr * mm + cc;
          const pi = 2 * li * mm;
          dxr += pr * ar - pi * ai;
          dxi += pr * ai + pi * ar;
        }
      }
      if (refactor) {
        luRe[jrow + n] = dxr;
        luIm[jrow + n] = dxi;
      }
      rRe[i] = -qxr;
      rIm[i] = -qxi;
      // vᴴx for the last residual
      lastRe += startRe[i] * xRe[i] + startIm[i] * xIm[i];
      lastIm += startRe[i] * xIm[i] - startIm[i] * xRe[i];
    }
    if (refactor) {
      const lrow = n * m;
      for (let j = 0; j < n; j++) {
        luRe[lrow + j] = startRe[j];
        luIm[lrow + j] = -startIm[j];
      }
      luRe[lrow + n] = 0;
      luIm[lrow + n] = 0;
      work.factored = factorComplexLu(m, luRe, luIm, pivots);
      if (!work.factored) break;
      refactor = false;
    }
    rRe[n] = -(lastRe - 1);
    rIm[n] = -lastIm;
    solveComplexLu(m, luRe, luIm, pivots, rRe, rIm);
    const dr = rRe[n];
    const di = rIm[n];
    const step = Math.hypot(dr, di);
    const rate = step / lastStep; // 0 on the first applied iteration
    // reused factors are trusted only for small, contracting corrections: otherwise refactor here and retry
    if (reused && (!(step <= CHORD_MAX_STEP * scale) || rate >= 1)) {
      refactor = true;
      continue;
    }
    if (!Number.isFinite(step)) {
      work.factored = false;
      break;
    }
    for (let i = 0; i < n; i++) {
      xRe[i] += rRe[i];
      xIm[i] += rIm[i];
    }
    lr += dr;
    li += di;
    applied++;
    if (!(Math.hypot(lr - guessRe, li - guessIm) <= NEWTON_MAX_DRIFT * scale)) {
      work.factored = false;
      break; // wandered off: not this branch's pole
    }
    if (
      step <= NEWTON_TOLERANCE * scale ||
      (applied > 1 && rate < 0.5 && (step * rate) / (1 - rate) <= CHORD_ERROR_TOLERANCE * scale) ||
      (step >= lastStep && step <= NEWTON_STAGNATION * scale)
    ) {
      converged = true;
      break;
    }
    // slow contraction: refresh the Jacobian
    if (applied > 1 && rate > 0.25) refactor = true;
    lastStep = step;
  }
  out.re = lr;
  out.im = li;
  out.vecRe.set(xRe);
  out.vecIm.set(xIm);
  return converged;
}

/** max_i √(|K_ii| / M_ii), rad/s: the system's own frequency scale, a floor for relative tolerances near λ = 0. */
function frequencyScale(mass: Float64Array, work: PoleWorkspace): number {
  const n = work.n;
  let best = 0;
  for (let i = 0; i < n; i++) best = Math.max(best, Math.abs(work.stiffTot[i * n + i]) / mass[i * n + i]);
  return Math.sqrt(best);
}
