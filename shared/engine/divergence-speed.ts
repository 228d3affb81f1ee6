/**
 * Torsional divergence speed of a deck section from its static moment slope.
 *
 * Method: U_div = √(2 I ω_α² / (ρ B² S)), the speed at which the aerodynamic moment ½ρU²B²·S·α cancels the
 * torsional stiffness I ω_α² (docs/conventions.md §Divergence; the same expression as EN 1991-1-4:2005 Annex E.4.3,
 * Expr. (E.24) with k_Θ = I ω_α²).
 * Notes: no divergence (null) when S ≤ 0, S unknown, or ρ = 0.
 * @param inertiaKgM2PerM mass moment of inertia I, kg·m²/m
 * @param torsionFrequencyHz still-air torsional frequency f_α, Hz
 * @param densityKgM3 air density ρ, kg/m³
 * @param widthM deck width B, m
 * @param momentSlope static moment slope S = dC_M/dα per radian (moment on ½ρU²B²)
 * @returns U_div in m/s, or null
 */
export function divergenceSpeed(
  inertiaKgM2PerM: number,
  torsionFrequencyHz: number,
  densityKgM3: number,
  widthM: number,
  momentSlope: number | null,
): number | null {
  if (momentSlope === null || !(momentSlope > 0) || !(densityKgM3 > 0)) return null;
  const omega = 2 * Math.PI * torsionFrequencyHz;
  return Math.sqrt((2 * inertiaKgM2PerM * omega * omega) / (densityKgM3 * widthM * widthM * momentSlope));
}
