import { Z_MAX_M } from "./terrain-categories";
import { terrainFactor } from "./terrain-factor";

export interface RoughnessFactorResult {
  /** Terrain factor k_r (Expr. 4.5), dimensionless. */
  terrainFactor: number;
  /** Roughness factor c_r(z) (Expr. 4.4), dimensionless. */
  roughnessFactor: number;
  /** Height actually used in the logarithm: max(z, z_min), m. */
  heightUsedM: number;
  /** True when z < z_min and c_r was held at c_r(z_min). */
  heldAtMinimum: boolean;
}

/**
 * Roughness factor c_r(z) of the logarithmic mean-wind profile.
 *
 * **Method**: c_r(z) = k_r ln(z / z0) for z_min ≤ z ≤ z_max, c_r(z) = c_r(z_min) for z ≤ z_min, with
 * k_r from {@link terrainFactor}.
 *
 * **Notes**: EN 1991-1-4:2005 §4.3.2(1), Expr. (4.4); z_max = 200 m. Heights above 200 m are outside the
 * standard's profile and are rejected rather than extrapolated.
 *
 * @param heightM - height z above ground or water, m (> 0, ≤ 200)
 * @param roughnessLengthM - roughness length z0, m (> 0)
 * @param minimumHeightM - minimum height z_min, m (> z0)
 * @returns k_r, c_r and the height used
 */
export function roughnessFactor(heightM: number, roughnessLengthM: number, minimumHeightM: number): RoughnessFactorResult {
  if (!(Number.isFinite(heightM) && heightM > 0)) {
    throw new RangeError(`height z must be a number greater than 0 m (got ${heightM})`);
  }
  if (heightM > Z_MAX_M) {
    throw new RangeError(`height z must be at most z_max = ${Z_MAX_M} m of EN 1991-1-4 §4.3.2 (got ${heightM} m)`);
  }
  if (!(Number.isFinite(minimumHeightM) && minimumHeightM > roughnessLengthM)) {
    throw new RangeError(
      `minimum height z_min must be greater than the roughness length z0 = ${roughnessLengthM} m (got ${minimumHeightM} m)`,
    );
  }
  const kr = terrainFactor(roughnessLengthM);
  const heldAtMinimum = heightM < minimumHeightM;
  const heightUsedM = heldAtMinimum ? minimumHeightM : heightM;
  return {
    terrainFactor: kr,
    roughnessFactor: kr * Math.log(heightUsedM / roughnessLengthM),
    heightUsedM,
    heldAtMinimum,
  };
}
