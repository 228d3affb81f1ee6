import { requirePositive } from "./check-input";

/**
 * Scruton number of a translational (heave) mode: the mass-damping parameter that governs vortex-induced
 * and galloping response.
 *
 * **Method**: Sc = 2 δ_s m / (ρ b²).
 *
 * **Notes**: EN 1991-1-4:2005 Annex E.1.3.3, Expr. (E.4) (expression number from memory); the same definition
 * is quoted from S.O. Hansen, "Vortex-induced vibrations of structures", Structural Engineers World Congress
 * 2007 (seen as quoted, not in the paper itself). δ_s = 2πζ is the
 * logarithmic decrement of structural damping, m the equivalent mass per unit length of the mode (for a
 * section model, the deck's mass per unit length), b the cross-wind dimension (deck depth D). Computed
 * check: δ_s = 0.02, m = 12 000 kg/m, ρ = 1.25 kg/m³, b = 3 m → Sc = 42.67.
 *
 * @param logDecrement - structural logarithmic decrement δ_s, dimensionless (≥ 0)
 * @param massPerLengthKgM - equivalent mass per unit length m, kg/m
 * @param airDensityKgM3 - air density ρ, kg/m³
 * @param referenceLengthM - cross-wind dimension b, m
 * @returns Sc, dimensionless
 */
export function scrutonNumber(
  logDecrement: number,
  massPerLengthKgM: number,
  airDensityKgM3: number,
  referenceLengthM: number,
): number {
  if (!(Number.isFinite(logDecrement) && logDecrement >= 0)) {
    throw new RangeError(`logarithmic decrement must be a number of at least 0 (got ${logDecrement})`);
  }
  requirePositive("mass per unit length (kg/m)", massPerLengthKgM);
  requirePositive("air density (kg/m³)", airDensityKgM3);
  requirePositive("cross-wind dimension b (m)", referenceLengthM);
  return (2 * logDecrement * massPerLengthKgM) / (airDensityKgM3 * referenceLengthM * referenceLengthM);
}
