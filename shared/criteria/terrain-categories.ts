/**
 * Terrain categories of EN 1991-1-4:2005 Table 4.1 (recommended values): roughness length z0 and minimum
 * height z_min. National Annexes may give other values; a project can always enter z0 and z_min directly.
 */

export type TerrainCategory = "0" | "I" | "II" | "III" | "IV";

export interface TerrainParameters {
  /** Roughness length z0, m. */
  roughnessLengthM: number;
  /** Minimum height z_min below which c_r is held at c_r(z_min), m. */
  minimumHeightM: number;
  /** Short description of the terrain (paraphrase of Table 4.1). */
  description: string;
}

export const TERRAIN_CATEGORIES: Readonly<Record<TerrainCategory, TerrainParameters>> = {
  "0": { roughnessLengthM: 0.003, minimumHeightM: 1, description: "Sea or coastal area exposed to the open sea" },
  I: { roughnessLengthM: 0.01, minimumHeightM: 1, description: "Lakes or flat, horizontal area with negligible vegetation" },
  II: { roughnessLengthM: 0.05, minimumHeightM: 2, description: "Low vegetation, isolated obstacles at least 20 obstacle heights apart" },
  III: { roughnessLengthM: 0.3, minimumHeightM: 5, description: "Regular cover of vegetation or buildings, isolated obstacles up to 20 heights apart" },
  IV: { roughnessLengthM: 1.0, minimumHeightM: 10, description: "At least 15 % of the surface covered with buildings of average height above 15 m" },
};

export const TERRAIN_CATEGORY_IDS = Object.keys(TERRAIN_CATEGORIES) as TerrainCategory[];

/** Reference roughness length of terrain category II, z0,II (EN 1991-1-4 Expr. 4.5), m. */
export const Z0_CATEGORY_II_M = 0.05;

/** Upper bound of the logarithmic profile, z_max (EN 1991-1-4 §4.3.2(1)), m. */
export const Z_MAX_M = 200;
