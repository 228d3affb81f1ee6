import { requirePositive } from "./check-input";

/**
 * Torsional divergence speed of a deck from its static moment slope.
 *
 * **Method**: v_div = [2 k_Θ / (ρ b² dc_M/dΘ)]^0.5 with k_Θ = I ω_α² (torsional stiffness per unit length)
 * and b = B.
 *
 * **Notes**: EN 1991-1-4:2005 Annex E.4.3, Expr. (E.24); the same closed form as docs/conventions.md §Divergence
 * (U_div = √(2 I ω_α² / (ρ B² S))). dc_M/dΘ per radian with the moment on ½ρU²B². No divergence when the
 * slope is ≤ 0 (returns null). Flat plate: S = π/2.
 *
 * @param inertiaKgM2PerM - mass moment of inertia per unit length I, kg·m²/m
 * @param torsionalFrequencyHz - torsional natural frequency f_α, Hz
 * @param airDensityKgM3 - air density ρ, kg/m³
 * @param deckWidthM - deck width B, m
 * @param momentSlope - dc_M/dΘ, per radian
 * @returns v_div in m/s, or null when the slope is not positive
 */
export function divergenceSpeed(
  inertiaKgM2PerM: number,
  torsionalFrequencyHz: number,
  airDensityKgM3: number,
  deckWidthM: number,
  momentSlope: number,
): number | null {
  requirePositive("mass moment of inertia per unit length (kg·m²/m)", inertiaKgM2PerM);
  requirePositive("torsional frequency (Hz)", torsionalFrequencyHz);
  requirePositive("air density (kg/m³)", airDensityKgM3);
  requirePositive("deck width B (m)", deckWidthM);
  if (!Number.isFinite(momentSlope)) throw new RangeError(`moment slope must be a number (got ${momentSlope})`);
  if (momentSlope <= 0) return null;
  const omega = 2 * Math.PI * torsionalFrequencyHz;
  const stiffness = inertiaKgM2PerM * omega * omega;
  return Math.sqrt((2 * stiffness) / (airDensityKgM3 * deckWidthM * deckWidthM * momentSlope));
}
