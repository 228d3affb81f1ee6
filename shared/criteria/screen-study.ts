import type { ProjectCriteriaInput, ScreeningOptions, ScreeningStudy } from "../schemas/criteria";
import { evaluateCriteria, type EvaluatedCriteria } from "./evaluate-criteria";
import { computeMargins, type Margins } from "./margins";
import { screenGalloping, type GallopingScreening } from "./screen-galloping";
import { screenVortexShedding, type VortexSheddingScreening } from "./screen-vortex-shedding";
import { screeningCriticals } from "./screening-criticals";
import { CAUTIONS } from "./sources";

export type { LockIn } from "./screen-vortex-shedding";

export interface ScreeningResult {
  designWind: EvaluatedCriteria["designWind"] | null;
  required: EvaluatedCriteria["required"] | null;
  vortexShedding: VortexSheddingScreening;
  galloping: GallopingScreening;
  /**
   * Margins of the onsets against the project's required speeds. Flutter and divergence come from the sweep: the
   * revision's assessment (shared/assessment) states them, so they are not evaluated here.
   */
  margins: Margins | null;
  cautions: readonly string[];
}

/**
 * Screening of one deck study for vortex shedding and galloping.
 *
 * **Method**: {@link screenVortexShedding} (v_crit = D n / St, Scruton numbers, lock-in) and {@link screenGalloping}
 * (E.18 and Den Hartog); each onset against the project's required speed: vortex shedding "investigate" / "clear",
 * galloping pass / fail, or not evaluated with the reason. Torsional divergence is the sweep's (the engine reports
 * the closed form of E.24 and the static instability; shared/assessment names both).
 *
 * **Notes**: EN 1991-1-4:2005 Annex E and Den Hartog; each check lists its assumptions and sources and the
 * result carries the cautions. Results are indicative. Needs ρ > 0.
 *
 * @param study - deck (B, D in m), structure (m kg/m, I kg·m²/m, modes in Hz), air (kg/m³), aerodynamics
 * @param criteria - the project's criteria (optional: without them no required speeds or margins)
 * @param options - measured St, a_G or static lift and drag coefficients
 * @returns the screening result
 */
export function screenStudy(
  study: ScreeningStudy,
  criteria?: ProjectCriteriaInput,
  options: ScreeningOptions = {},
): ScreeningResult {
  if (!(study.air.density > 0)) {
    throw new RangeError(`air density must be greater than 0 kg/m³ for screening (got ${study.air.density})`);
  }
  const evaluated = criteria ? evaluateCriteria(criteria) : null;
  const required = evaluated?.required ?? null;

  const vortexShedding = screenVortexShedding(study, required?.vortexOnset ?? null, options);
  const galloping = screenGalloping(study, options);

  const criticals = screeningCriticals({ vortexShedding, galloping });
  const margins = required
    ? computeMargins(
        { vortexOnset: criticals.vortexOnset, gallopingOnset: criticals.gallopingOnset },
        required,
        criticals.notes,
      )
    : null;

  return {
    designWind: evaluated?.designWind ?? null,
    required,
    vortexShedding,
    galloping,
    margins,
    cautions: CAUTIONS,
  };
}
