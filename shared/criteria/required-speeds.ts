import { PHENOMENA, type Phenomenon, type ProjectCriteria } from "../schemas/criteria";

export interface RequiredSpeed {
  /** Speed the critical speed must reach: factor × gust × angle × v_m, m/s. */
  requiredSpeedMps: number;
  /** Product of the factor and the optional multipliers, dimensionless. */
  totalFactor: number;
  factor: number;
  gustFactor: number | null;
  angleFactor: number | null;
  /** Basis of each factor, in the order they multiply. */
  basis: string[];
}

export type RequiredSpeeds = Record<Phenomenon, RequiredSpeed>;

/**
 * Required speed of each phenomenon from the project's factors and the design mean wind at deck level.
 *
 * **Method**: U_req = γ · γ_gust · γ_angle · v_m(deck), the optional multipliers defaulting to 1.
 *
 * **Notes**: the factors and their bases are the project's (defaults in `DEFAULT_REQUIREMENTS`); this
 * routine only multiplies. Flutter, divergence, vortex-shedding onset and galloping onset.
 *
 * @param requirements - factor and basis per phenomenon
 * @param meanSpeedMps - design mean wind speed at deck level v_m, m/s (> 0)
 * @returns the required speed per phenomenon, m/s, with the factors and their bases
 */
export function requiredSpeeds(requirements: ProjectCriteria["requirements"], meanSpeedMps: number): RequiredSpeeds {
  if (!(Number.isFinite(meanSpeedMps) && meanSpeedMps > 0)) {
    throw new RangeError(`design mean wind speed must be a number greater than 0 m/s (got ${meanSpeedMps})`);
  }
  const out = {} as RequiredSpeeds;
  for (const phenomenon of PHENOMENA) {
    const requirement = requirements[phenomenon];
    const gust = requirement.gustFactor?.value ?? null;
    const angle = requirement.angleFactor?.value ?? null;
    const totalFactor = requirement.factor * (gust ?? 1) * (angle ?? 1);
    const basis = [requirement.basis];
    if (requirement.gustFactor) basis.push(`Gust / span factor ${gust}: ${requirement.gustFactor.basis}`);
    if (requirement.angleFactor) basis.push(`Angle-of-attack factor ${angle}: ${requirement.angleFactor.basis}`);
    out[phenomenon] = {
      requiredSpeedMps: totalFactor * meanSpeedMps,
      totalFactor,
      factor: requirement.factor,
      gustFactor: gust,
      angleFactor: angle,
      basis,
    };
  }
  return out;
}
