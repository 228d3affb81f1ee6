import { requirePositive } from "./check-input";

/**
 * Scruton number of a torsional mode in its inertia form.
 *
 * **Method**: Sc_θ = 2 δ_s I / (ρ B⁴).
 *
 * **Notes**: common practice in bridge aerodynamics, not a formula of EN 1991-1-4 (which gives only the
 * translational Sc = 2δm/(ρb²), E.1.3.3). It follows from the torsional equation of motion in the same way:
 * the self-excited moment scales as ½ρU²B²·(B·α), so the mass-like quantity I is divided by ρB⁴. B is the
 * deck width (the length on which the moment coefficients are defined). Values are not comparable with the
 * translational Sc of the standard's amplitude formulas.
 *
 * @param logDecrement - structural logarithmic decrement δ_s, dimensionless (≥ 0)
 * @param inertiaKgM2PerM - mass moment of inertia per unit length I, kg·m²/m
 * @param airDensityKgM3 - air density ρ, kg/m³
 * @param deckWidthM - deck width B, m
 * @returns Sc_θ, dimensionless
 */
export function torsionalScrutonNumber(
  logDecrement: number,
  inertiaKgM2PerM: number,
  airDensityKgM3: number,
  deckWidthM: number,
): number {
  if (!(Number.isFinite(logDecrement) && logDecrement >= 0)) {
    throw new RangeError(`logarithmic decrement must be a number of at least 0 (got ${logDecrement})`);
  }
  requirePositive("mass moment of inertia per unit length (kg·m²/m)", inertiaKgM2PerM);
  requirePositive("air density (kg/m³)", airDensityKgM3);
  requirePositive("deck width B (m)", deckWidthM);
  return (2 * logDecrement * inertiaKgM2PerM) / (airDensityKgM3 * deckWidthM ** 4);
}
