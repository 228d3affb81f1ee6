import type { ProjectCriteriaInput } from "../schemas/criteria";
import { DEFAULT_REQUIREMENTS } from "./default-requirements";
import { meanWindAtDeck, type MeanWindAtDeck } from "./mean-wind-at-deck";
import { requiredSpeeds, type RequiredSpeeds } from "./required-speeds";

export interface EvaluatedCriteria {
  designWind: MeanWindAtDeck;
  required: RequiredSpeeds;
}

/**
 * Design mean wind at deck level and the required speed of each phenomenon for a project's criteria.
 *
 * **Method**: {@link meanWindAtDeck} then {@link requiredSpeeds}; missing requirements take
 * `DEFAULT_REQUIREMENTS`.
 *
 * **Notes**: EN 1991-1-4:2005 §4.2–4.3 for the wind; the factors are the project's.
 *
 * @param criteria - the project's wind inputs and factors
 * @returns v_m (m/s) with its factors, and the required speeds (m/s)
 */
export function evaluateCriteria(
  criteria: Omit<ProjectCriteriaInput, "requirements"> & { requirements?: ProjectCriteriaInput["requirements"] },
): EvaluatedCriteria {
  const designWind = meanWindAtDeck(criteria.wind);
  return { designWind, required: requiredSpeeds(criteria.requirements ?? DEFAULT_REQUIREMENTS, designWind.meanSpeedMps) };
}
