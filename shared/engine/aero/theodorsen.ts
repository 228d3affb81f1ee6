import { besselJY01 } from "./bessel-jy01";

/**
 * Theodorsen's circulation function C(k) = F(k) + iG(k) of the oscillating thin aerofoil.
 *
 * Method: C(k) = H1⁽²⁾(k) / (H1⁽²⁾(k) + i H0⁽²⁾(k)) with H_n⁽²⁾ = J_n − iY_n, written in real form
 *   F = [J1(J1 + Y0) + Y1(Y1 − J0)] / D,  G = −(Y1Y0 + J1J0) / D,  D = (J1 + Y0)² + (J0 − Y1)²,
 * with J0, J1, Y0, Y1 from `besselJY01`.
 * Source: T. Theodorsen, General theory of aerodynamic instability and the mechanism of flutter, NACA
 * Report 496, 1935; the real form as in Bisplinghoff, Ashley & Halfman, Aeroelasticity, 1955.
 *
 * Notes: valid for every k ≥ 0. C(0) = 1 (steady flow) and C → ½ as k → ∞; for 0 < k < 1e-100 the value
 * at 1e-100 is returned (it differs from the limit by less than 1e-97). Accuracy better than 1e-10 in F and G
 * (Bessel functions to 1e-12, no cancellation in D), checked against mpmath. k here is the half-chord
 * reduced frequency k = bω/U = K/2 of the aeronautical literature, not our K = Bω/U.
 *
 * @param k - reduced frequency on the half chord, k = bω/U ≥ 0 (dimensionless)
 * @param out - receives [F, G]
 * @param work - scratch of length ≥ 4 (pass one to avoid allocation in loops)
 * @returns out
 */
export function theodorsen(
  k: number,
  out: Float64Array = new Float64Array(2),
  work: Float64Array = new Float64Array(4),
): Float64Array {
  if (!(k >= 0) || k === Infinity) throw new RangeError(`Theodorsen's function needs a finite k ≥ 0 (got ${k})`);
  if (k === 0) {
    out[0] = 1;
    out[1] = 0;
    return out;
  }
  besselJY01(Math.max(k, 1e-100), work);
  const j0 = work[0];
  const j1 = work[1];
  const y0 = work[2];
  const y1 = work[3];
  const re = j1 + y0;
  const im = j0 - y1;
  const d = re * re + im * im;
  out[0] = (j1 * re + y1 * (y1 - j0)) / d;
  out[1] = -(y1 * y0 + j1 * j0) / d;
  return out;
}
