import { factorComplexLu, solveComplexLu } from "./complex-lu";
import { frequencyScale, NEWTON_MAX_ITERATIONS, NEWTON_STAGNATION, NEWTON_TOLERANCE } from "./newton-settings";
import type { PoleWorkspace } from "./quadratic-operator";
import type { Pole } from "./refine-pole";

/** Accept when the estimated remaining error step·q/(1 − q) (q = observed contraction) is below this (relative). */
const CHORD_ERROR_TOLERANCE = 1e-13;
/** A correction from reused factors larger than this (relative) is discarded and the Jacobian refactored. */
const CHORD_MAX_STEP = 1e-3;
/** A refinement that moves λ further than this (relative to the start) has left the branch: reported as failed. */
const NEWTON_MAX_DRIFT = 2;

/**
 * Refines one eigenpair of an n-mode quadratic pencil Q(λ) = λ²M + λC + K (C = `work.dampTot`, K = `work.stiffTot`)
 * from a warm start.
 *
 * Method: Newton's method on the bordered system [Q(λ)x = 0, vᴴx = 1], v the starting vector (Ruhe 1973,
 * "Algorithms for the nonlinear eigenvalue problem", SIAM J. Numer. Anal. 10(4); Güttel & Tisseur 2017, Acta
 * Numerica 26, §4.3), run as chord iterations: the LU factors of the (n+1)×(n+1) complex Jacobian
 * [[Q(λ), Q′(λ)x], [vᴴ, 0]] stay in the workspace and are reused (within one branch's p-k solve λ and K move very
 * little) while corrections stay below 1e-3·|λ| and contract at least 4:1; otherwise the Jacobian is refactored
 * at the current point. Most iterations then cost one O(n²) substitution instead of an O(n³) factorisation.
 * Notes: the size of a correction is max(|Δλ|/|λ₀|, ‖Δx‖/‖x‖), |λ₀| the start's modulus floored at 1e-3 of the
 * system's frequency scale (so a diverging iterate cannot loosen the test); stops when it is ≤ 1e-13, or when
 * size·q/(1 − q) ≤ 1e-13 with q the observed contraction, or at the rounding floor; fails (false) after 40
 * iterations, on a singular Jacobian, or when λ drifts more than 2|λ₀| from its start.
 * @param mass M (n×n row-major)
 * @param work workspace with the assembled pencil and (maybe) reusable factors (`work.factored`)
 * @param guessRe real part of the starting λ, rad/s
 * @param guessIm imaginary part of the starting λ, rad/s
 * @param startRe real part of the starting eigenvector v
 * @param startIm imaginary part of v
 * @param out receives λ and the (unnormalised) eigenvector
 * @returns true when converged
 */
export function refinePoleBordered(
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
  // v = start / ‖start‖ and x0 = v (so vᴴx0 = 1): unit scale in every call, so that factors kept from an earlier
  // call (whose border row holds that call's v) still fit
  const { vRe, vIm } = work;
  let vv = 0;
  for (let i = 0; i < n; i++) vv += startRe[i] * startRe[i] + startIm[i] * startIm[i];
  if (!(vv > 0)) return false;
  const inv = 1 / Math.sqrt(vv);
  for (let i = 0; i < n; i++) {
    vRe[i] = startRe[i] * inv;
    vIm[i] = startIm[i] * inv;
    xRe[i] = vRe[i];
    xIm[i] = vIm[i];
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
      let qxr = 0, qxi = 0;
      const row = i * n;
      if (refactor) {
        // residual Q(λ)x and the Jacobian's rows [Q(λ), Q′(λ)x]
        let dxr = 0, dxi = 0;
        const jrow = i * m;
        for (let j = 0; j < n; j++) {
          const mm = mass[row + j];
          const cc = c[row + j];
          const qr = l2r * mm + lr * cc + k[row + j];
          const qi = l2i * mm + li * cc;
          luRe[jrow + j] = qr;
          luIm[jrow + j] = qi;
          const ar = xRe[j];
          const ai = xIm[j];
          qxr += qr * ar - qi * ai;
          qxi += qr * ai + qi * ar;
          const pr = 2 * lr * mm + cc;
          const pi = 2 * li * mm;
          dxr += pr * ar - pi * ai;
          dxi += pr * ai + pi * ar;
        }
        luRe[jrow + n] = dxr;
        luIm[jrow + n] = dxi;
      } else {
        // residual only (chord step), skipping the structural zeros of sparse modal matrices
        for (let j = 0; j < n; j++) {
          const mm = mass[row + j];
          const cc = c[row + j];
          const kk = k[row + j];
          if (mm === 0 && cc === 0 && kk === 0) continue;
          const qr = l2r * mm + lr * cc + kk;
          const qi = l2i * mm + li * cc;
          const ar = xRe[j];
          const ai = xIm[j];
          qxr += qr * ar - qi * ai;
          qxi += qr * ai + qi * ar;
        }
      }
      rRe[i] = -qxr;
      rIm[i] = -qxi;
      // vᴴx for the last residual
      lastRe += vRe[i] * xRe[i] + vIm[i] * xIm[i];
      lastIm += vRe[i] * xIm[i] - vIm[i] * xRe[i];
    }
    if (refactor) {
      const lrow = n * m;
      for (let j = 0; j < n; j++) {
        luRe[lrow + j] = vRe[j];
        luIm[lrow + j] = -vIm[j];
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
    // size of the correction, relative: the eigenvalue against the start's scale and the eigenvector against
    // itself (a tiny Δλ from stale factors with a large Δx is not convergence)
    let dxx = 0;
    let xx = 0;
    for (let i = 0; i < n; i++) {
      dxx += rRe[i] * rRe[i] + rIm[i] * rIm[i];
      xx += xRe[i] * xRe[i] + xIm[i] * xIm[i];
    }
    const step = Math.max(Math.hypot(dr, di) / scale, xx > 0 ? Math.sqrt(dxx / xx) : Number.POSITIVE_INFINITY);
    const rate = step / lastStep; // 0 on the first applied iteration
    // reused factors are trusted only for small, contracting corrections: otherwise refactor here and retry
    if (reused && (!(step <= CHORD_MAX_STEP) || rate >= 1)) {
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
      step <= NEWTON_TOLERANCE ||
      (applied > 1 && rate < 0.5 && (step * rate) / (1 - rate) <= CHORD_ERROR_TOLERANCE) ||
      (step >= lastStep && step <= NEWTON_STAGNATION)
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

