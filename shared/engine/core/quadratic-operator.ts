import { MAX_REDUCED_FREQUENCY, type ModalSystem } from "./modal-system";

/** Reusable buffers of one n-mode p-k solve (no allocation in the hot loop). */
export interface PoleWorkspace {
  readonly n: number;
  readonly kae: Float64Array;
  readonly cae: Float64Array;
  /** K_s − K_ae at the last assembled (U, K). */
  readonly stiffTot: Float64Array;
  /** C_s − C_ae at the last assembled (U, K). */
  readonly dampTot: Float64Array;
  /** Spare real buffers of (n+1)² entries (scratch for determinant signs). */
  readonly jRe: Float64Array;
  readonly jIm: Float64Array;
  readonly rRe: Float64Array;
  readonly rIm: Float64Array;
  readonly xRe: Float64Array;
  readonly xIm: Float64Array;
  /** Normalisation vector v of the bordered Newton (unit length). */
  readonly vRe: Float64Array;
  readonly vIm: Float64Array;
  /** LU factors of the bordered Jacobian, (n+1)×(n+1), reused by chord iterations. */
  readonly luRe: Float64Array;
  readonly luIm: Float64Array;
  readonly pivots: Int32Array;
  /** True while `luRe/luIm` hold factors usable for the pole being refined; reset per branch solve. */
  factored: boolean;
}

/** Allocates the buffers of one n-mode p-k solve (reuse it for every branch and speed of a sweep). */
export function createPoleWorkspace(n: number): PoleWorkspace {
  const m = n + 1;
  return {
    n,
    kae: new Float64Array(n * n),
    cae: new Float64Array(n * n),
    stiffTot: new Float64Array(n * n),
    dampTot: new Float64Array(n * n),
    jRe: new Float64Array(m * m),
    jIm: new Float64Array(m * m),
    rRe: new Float64Array(m),
    rIm: new Float64Array(m),
    xRe: new Float64Array(n),
    xIm: new Float64Array(n),
    vRe: new Float64Array(n),
    vIm: new Float64Array(n),
    luRe: new Float64Array(m * m),
    luIm: new Float64Array(m * m),
    pivots: new Int32Array(m),
    factored: false,
  };
}

/**
 * Assembles the coefficients of the quadratic eigenproblem Q(λ) = λ²M + λ(C_s − C_ae) + (K_s − K_ae) at wind
 * speed U and the reduced frequency of a branch whose circular frequency is ω.
 *
 * Method: K = L_ref ω / U clipped to [K_floor, K_MAX]; when the ceiling applies (U → 0) the forces are evaluated
 * at the effective speed L_ref ω / K_MAX (see `MAX_REDUCED_FREQUENCY`).
 * @param system the n-mode system
 * @param speedMps wind speed U, m/s (≥ 0)
 * @param omegaRadS circular frequency of the branch, rad/s (≥ 0; 0 on static branches)
 * @param work buffers; `stiffTot` and `dampTot` receive the result
 * @returns the reduced frequency K actually used (dimensionless)
 */
export function assembleQuadratic(
  system: ModalSystem,
  speedMps: number,
  omegaRadS: number,
  work: PoleWorkspace,
): number {
  const nn = system.size * system.size;
  const { stiffTot, dampTot, kae, cae } = work;
  const b = system.referenceLengthM;
  let speed = speedMps;
  let k = speed > 0 ? (b * omegaRadS) / speed : Number.POSITIVE_INFINITY;
  if (k > MAX_REDUCED_FREQUENCY) {
    k = MAX_REDUCED_FREQUENCY;
    speed = (b * omegaRadS) / MAX_REDUCED_FREQUENCY;
  }
  if (k < system.minReducedFrequency) k = system.minReducedFrequency;
  if (!system.hasAero || !(speed > 0)) {
    stiffTot.set(system.stiffness);
    dampTot.set(system.damping);
    return k;
  }
  system.aero(speed, k, kae, cae);
  const ks = system.stiffness;
  const cs = system.damping;
  for (let i = 0; i < nn; i++) {
    stiffTot[i] = ks[i] - kae[i];
    dampTot[i] = cs[i] - cae[i];
  }
  return k;
}
