import { Z0_CATEGORY_II_M } from "./terrain-categories";

/**
 * Terrain factor k_r of the logarithmic mean-wind profile.
 *
 * **Method**: k_r = 0.19 (z0 / z0,II)^0.07 with z0,II = 0.05 m.
 *
 * **Notes**: EN 1991-1-4:2005 §4.3.2(1), Expr. (4.5) (recommended form; a National Annex may change it).
 * k_r = 0.19 for category II, 0.1560 for category 0 (z0 = 0.003 m).
 *
 * @param roughnessLengthM - roughness length z0, m (> 0)
 * @returns k_r, dimensionless
 */
export function terrainFactor(roughnessLengthM: number): number {
  if (!(Number.isFinite(roughnessLengthM) && roughnessLengthM > 0)) {
    throw new RangeError(`roughness length z0 must be a number greater than 0 m (got ${roughnessLengthM})`);
  }
  return 0.19 * Math.pow(roughnessLengthM / Z0_CATEGORY_II_M, 0.07);
}
