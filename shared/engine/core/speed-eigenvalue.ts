import { factorComplexLu, solveComplexLu } from "./complex-lu";
import type { ModalSystem } from "./modal-system";
import { aeroPerUnitSpeed } from "./unit-speed-aero";

/** Buffers of the harmonic-determinant solver for n degrees of freedom. */
export interface HarmonicWorkspace {
  readonly n: number;
  /** Z(U; K) = Z0 + U·Z1 + U²·Z2 at the current K (n×n each, real and imaginary parts). */
  readonly z0: Float64Array;
  readonly z1Im: Float64Array;
  readonly z2Re: Float64Array;
  readonly z2Im: Float64Array;
  readonly kae: Float64Array;
  readonly cae: Float64Array;
  readonly luRe: Float64Array;
  readonly luIm: Float64Array;
  readonly pivots: Int32Array;
  readonly rRe: Float64Array;
  readonly rIm: Float64Array;
}

export function createHarmonicWorkspace(n: number): HarmonicWorkspace {
  const m = n + 1;
  return {
    n,
    z0: new Float64Array(n * n),
    z1Im: new Float64Array(n * n),
    z2Re: new Float64Array(n * n),
    z2Im: new Float64Array(n * n),
    kae: new Float64Array(n * n),
    cae: new Float64Array(n * n),
    luRe: new Float64Array(m * m),
    luIm: new Float64Array(m * m),
    pivots: new Int32Array(m),
    rRe: new Float64Array(m),
    rIm: new Float64Array(m),
  };
}

/** A complex speed U with its harmonic mode x (complex, n entries), at one reduced frequency. */
export interface SpeedRoot {
  re: number;
  im: number;
  readonly vecRe: Float64Array;
  readonly vecIm: Float64Array;
}

/**
 * At a fixed reduced frequency K, one root U of the harmonic flutter determinant det Z(U; K) = 0, where for motion
 * x e^{iωt} with ω = K U / L_ref
 *   Z(U; K) = K_s + U·i(K/L)C_s − U²·[(K/L)²M + i(K/L)Ĉ(K) + K̂(K)],
 * K̂ = K_ae/U² and Ĉ = C_ae/U (`aeroPerUnitSpeed`) — a quadratic eigenvalue problem in U. A real positive root is a
 * neutral (undamped harmonic) point of the aeroelastic system.
 *
 * Method: Newton's method on the bordered system [Z(U)x = 0, vᴴx = 1] (Ruhe 1973, SIAM J. Numer. Anal. 10(4);
 * Güttel & Tisseur 2017, Acta Numerica 26, §4.3) with the Jacobian [[Z(U), Z′(U)x], [vᴴ, 0]], Z′ = Z1 + 2U Z2,
 * factored afresh at every iterate (`factorComplexLu`), from the warm start `guess`; v is the start's vector.
 * Notes: converged when the relative correction of U and x is ≤ 1e-13 (or stops shrinking below 1e-9: rounding);
 * false after 40 iterations, on a singular Jacobian or when U drifts further than 2|U₀|. Any n.
 * @param system the n-mode system (Scanlan-form aerodynamics: check with `assertScanlanScaling` first)
 * @param k reduced frequency K (> 0)
 * @param guess starting U (complex, m/s) and vector; overwritten by the root when converged
 * @param work buffers (`createHarmonicWorkspace(n)`)
 * @returns true when converged
 */
export function speedRootAt(system: ModalSystem, k: number, guess: SpeedRoot, work: HarmonicWorkspace): boolean {
  const n = system.size;
  const m = n + 1;
  const { z0, z1Im, z2Re, z2Im, kae, cae, luRe, luIm, pivots, rRe, rIm } = work;
  const kl = k / system.referenceLengthM;
  aeroPerUnitSpeed(system, k, kae, cae);
  for (let i = 0; i < n * n; i++) {
    z0[i] = system.stiffness[i];
    z1Im[i] = kl * system.damping[i];
    z2Re[i] = -(kl * kl * system.mass[i] + kae[i]);
    z2Im[i] = -kl * cae[i];
  }
  // v = x0/‖x0‖, x = v
  let vv = 0;
  for (let i = 0; i < n; i++) vv += guess.vecRe[i] ** 2 + guess.vecIm[i] ** 2;
  if (!(vv > 0)) return false;
  const vRe = Float64Array.from(guess.vecRe, (x) => x / Math.sqrt(vv));
  const vIm = Float64Array.from(guess.vecIm, (x) => x / Math.sqrt(vv));
  const xRe = Float64Array.from(vRe);
  const xIm = Float64Array.from(vIm);
  let ur = guess.re;
  let ui = guess.im;
  const scale = Math.max(Math.hypot(ur, ui), 1e-12);
  let lastStep = Number.POSITIVE_INFINITY;
  for (let it = 0; it < 40; it++) {
    const u2r = ur * ur - ui * ui;
    const u2i = 2 * ur * ui;
    for (let i = 0; i < n; i++) {
      let zxr = 0, zxi = 0, dxr = 0, dxi = 0;
      for (let j = 0; j < n; j++) {
        const p = i * n + j;
        // Z = z0 + U·(i z1Im) + U²·z2
        const zr = z0[p] - ui * z1Im[p] + u2r * z2Re[p] - u2i * z2Im[p];
        const zi = ur * z1Im[p] + u2r * z2Im[p] + u2i * z2Re[p];
        // Z′ = i z1Im + 2U z2
        const dr = 2 * (ur * z2Re[p] - ui * z2Im[p]);
        const di = z1Im[p] + 2 * (ur * z2Im[p] + ui * z2Re[p]);
        luRe[i * m + j] = zr;
        luIm[i * m + j] = zi;
        zxr += zr * xRe[j] - zi * xIm[j];
        zxi += zr * xIm[j] + zi * xRe[j];
        dxr += dr * xRe[j] - di * xIm[j];
        dxi += dr * xIm[j] + di * xRe[j];
      }
      luRe[i * m + n] = dxr;
      luIm[i * m + n] = dxi;
      rRe[i] = -zxr;
      rIm[i] = -zxi;
    }
    let vxr = 0, vxi = 0;
    for (let j = 0; j < n; j++) {
      luRe[n * m + j] = vRe[j];
      luIm[n * m + j] = -vIm[j];
      vxr += vRe[j] * xRe[j] + vIm[j] * xIm[j];
      vxi += vRe[j] * xIm[j] - vIm[j] * xRe[j];
    }
    luRe[n * m + n] = 0;
    luIm[n * m + n] = 0;
    rRe[n] = 1 - vxr;
    rIm[n] = -vxi;
    if (!factorComplexLu(m, luRe, luIm, pivots)) return false;
    solveComplexLu(m, luRe, luIm, pivots, rRe, rIm);
    let dx = 0;
    let xx = 0;
    for (let i = 0; i < n; i++) {
      xRe[i] += rRe[i];
      xIm[i] += rIm[i];
      dx += rRe[i] ** 2 + rIm[i] ** 2;
      xx += xRe[i] ** 2 + xIm[i] ** 2;
    }
    ur += rRe[n];
    ui += rIm[n];
    if (!Number.isFinite(ur + ui) || Math.hypot(ur - guess.re, ui - guess.im) > 2 * scale) return false;
    const step = Math.max(Math.hypot(rRe[n], rIm[n]) / Math.max(Math.hypot(ur, ui), 1e-300), Math.sqrt(dx / xx));
    // converged, or at the rounding floor (a step that no longer shrinks below 1e-9)
    if (step <= 1e-13 || (step <= 1e-9 && step >= lastStep)) {
      guess.re = ur;
      guess.im = ui;
      guess.vecRe.set(xRe);
      guess.vecIm.set(xIm);
      return true;
    }
    lastStep = step;
  }
  return false;
}
