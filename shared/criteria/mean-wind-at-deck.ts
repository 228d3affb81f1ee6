import type { DesignWindInput } from "../schemas/criteria";
import { probabilityFactor, returnPeriodToProbability } from "./probability-factor";
import { roughnessFactor } from "./roughness-factor";
import { SOURCES } from "./sources";
import { TERRAIN_CATEGORIES, type TerrainCategory } from "./terrain-categories";

export interface MeanWindAtDeck {
  /** Design mean wind speed at deck level v_m = c_r c_o c_prob v_b, m/s. */
  meanSpeedMps: number;
  /** Basic wind speed v_b as entered, m/s. */
  basicSpeedMps: number;
  /** Probability factor c_prob (1 for the 50-year wind). */
  probabilityFactor: number;
  /** Annual probability of exceedance behind c_prob, or null when c_prob was given directly. */
  annualProbability: number | null;
  /** Terrain category when one was chosen, else null. */
  terrainCategory: TerrainCategory | null;
  roughnessLengthM: number;
  minimumHeightM: number;
  deckHeightM: number;
  /** Height used in the profile, max(z, z_min), m. */
  heightUsedM: number;
  terrainFactor: number;
  roughnessFactor: number;
  orographyFactor: number;
  /** Statements the UI shows beside the numbers (held at z_min, c_o ≠ 1 …). */
  notes: string[];
  sources: string[];
}

/**
 * Design mean wind speed at deck level from the basic wind speed, the terrain and the return period.
 *
 * **Method**: v_m(z) = c_r(z) c_o(z) c_prob v_b with c_r = k_r ln(max(z, z_min)/z0), k_r = 0.19 (z0/0.05)^0.07
 * and c_prob from Expr. (4.2) (or given).
 *
 * **Notes**: EN 1991-1-4:2005 §4.2 (Expr. 4.1–4.2), §4.3.1 (Expr. 4.3), §4.3.2 (Expr. 4.4–4.5), Table 4.1.
 * c_prob multiplies v_b as in §4.2(2) Note 4. Valid for z ≤ 200 m. Computed check: category II, z = 60 m,
 * v_b = 26 m/s → c_r = 1.3471, v_m = 35.02 m/s.
 *
 * @param wind - basic speed (m/s), probability, terrain, deck height (m) and orography factor
 * @returns v_m in m/s with every intermediate factor and the clauses used
 */
export function meanWindAtDeck(wind: DesignWindInput): MeanWindAtDeck {
  if (!(Number.isFinite(wind.basicSpeed) && wind.basicSpeed > 0)) {
    throw new RangeError(`basic wind speed v_b must be a number greater than 0 m/s (got ${wind.basicSpeed})`);
  }
  const orography = wind.orographyFactor ?? 1;
  if (!(Number.isFinite(orography) && orography > 0)) {
    throw new RangeError(`orography factor c_o must be a number greater than 0 (got ${orography})`);
  }

  const terrainCategory = wind.terrain.kind === "category" ? wind.terrain.category : null;
  const { roughnessLengthM, minimumHeightM } =
    wind.terrain.kind === "category"
      ? TERRAIN_CATEGORIES[wind.terrain.category]
      : { roughnessLengthM: wind.terrain.roughnessLength, minimumHeightM: wind.terrain.minimumHeight };
  const profile = roughnessFactor(wind.deckHeight, roughnessLengthM, minimumHeightM);

  const sources: string[] = [SOURCES.meanWind, SOURCES.roughnessFactor, SOURCES.terrainFactor];
  if (terrainCategory !== null) sources.push(SOURCES.terrainTable);
  const notes: string[] = [];

  let annualProbability: number | null;
  let cProb: number;
  switch (wind.probability.kind) {
    case "return-period":
      annualProbability = returnPeriodToProbability(wind.probability.years);
      cProb = probabilityFactor(annualProbability);
      sources.push(SOURCES.probabilityFactor);
      break;
    case "annual-probability":
      annualProbability = wind.probability.value;
      cProb = probabilityFactor(annualProbability);
      sources.push(SOURCES.probabilityFactor);
      break;
    case "factor":
      annualProbability = null;
      cProb = wind.probability.value;
      notes.push(`Probability factor c_prob = ${cProb} given directly: ${wind.probability.basis}`);
      break;
  }

  if (profile.heldAtMinimum) {
    notes.push(`Deck height ${wind.deckHeight} m is below z_min = ${minimumHeightM} m: c_r is held at c_r(z_min).`);
  }
  if (orography !== 1) {
    notes.push(`Orography factor c_o = ${orography} applied (EN 1991-1-4 §4.3.3, Annex A.3).`);
    sources.push(SOURCES.orography);
  }

  return {
    meanSpeedMps: profile.roughnessFactor * orography * cProb * wind.basicSpeed,
    basicSpeedMps: wind.basicSpeed,
    probabilityFactor: cProb,
    annualProbability,
    terrainCategory,
    roughnessLengthM,
    minimumHeightM,
    deckHeightM: wind.deckHeight,
    heightUsedM: profile.heightUsedM,
    terrainFactor: profile.terrainFactor,
    roughnessFactor: profile.roughnessFactor,
    orographyFactor: orography,
    notes,
    sources,
  };
}
