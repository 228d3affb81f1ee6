import { frequencyScale, NEWTON_MAX_ITERATIONS, NEWTON_STAGNATION, NEWTON_TOLERANCE } from "./newton-settings";
import type { PoleWorkspace } from "./quadratic-operator";
import type { Pole } from "./refine-pole";

/**
 * A step this small (relative), after a step that shrank at least 1000-fold (quadratic convergence observed),
 * leaves an error of the order of its square: accept without a confirming iteration.
 */
const NEWTON_QUADRATIC_ACCEPT = 1e-7;

/**
 * Refines one eigenpair of a 2-mode quadratic pencil Q(λ) = λ²M + λC + K (C = `work.dampTot`, K = `work.stiffTot`).
 *
 * Method: Newton's method on the scalar det Q(λ) = Q11 Q22 − Q12 Q21 (a real-coefficient quartic), with
 * d/dλ det Q = Q11′Q22 + Q11Q22′ − Q12′Q21 − Q12Q21′, Q′ = 2λM + C, all in inline complex arithmetic; the
 * eigenvector is the null vector of the better-conditioned row of Q(λ). Quadratic convergence to a simple root,
 * linear at a double root (coalescing pair).
 * Notes: stops at |Δλ| ≤ 1e-13·|λ|, or |Δλ| ≤ 1e-7·|λ| after a 1000-fold shrink, or at the rounding floor
 * below 1e-9·|λ| (|λ| floored at 1e-3 of the system's frequency scale); false after 40 iterations.
 * @param mass M (2×2 row-major)
 * @param work workspace with the assembled pencil
 * @param guessRe real part of the starting λ, rad/s
 * @param guessIm imaginary part of the starting λ, rad/s
 * @param out receives λ and the (unnormalised) eigenvector
 * @returns true when converged
 */
export function refinePoleDeterminant(mass: Float64Array, work: PoleWorkspace, guessRe: number, guessIm: number, out: Pole): boolean {
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
  let q11r: number, q11i: number, q12r: number, q12i: number, q21r: number, q21i: number, q22r: number, q22i: number;
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

