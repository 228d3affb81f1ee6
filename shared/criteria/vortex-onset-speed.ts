import { requirePositive } from "./check-input";

/**
 * Critical (onset) wind speed of vortex shedding for one mode: the speed at which the shedding frequency
 * St·U/b equals the mode's natural frequency.
 *
 * **Method**: v_crit,i = b n_i / St.
 *
 * **Notes**: EN 1991-1-4:2005 Annex E.1.3.1 (formula recalled; it is the Strouhal relation solved for U).
 * For a deck, b is the cross-wind dimension, the deck depth D, for vertical and torsional modes alike: the
 * shedding frequency is set by the flow around the section, whichever mode it locks onto. St must be the one
 * defined on the same b. Computed check: b = 3 m, n = 0.35 Hz, St = 0.09 → 11.67 m/s.
 *
 * @param referenceLengthM - cross-wind dimension b (deck depth D), m
 * @param frequencyHz - natural frequency of the mode n_i, Hz
 * @param strouhalNumber - Strouhal number St on b, dimensionless
 * @returns v_crit,i, m/s
 */
export function vortexOnsetSpeed(referenceLengthM: number, frequencyHz: number, strouhalNumber: number): number {
  requirePositive("cross-wind dimension b (m)", referenceLengthM);
  requirePositive("natural frequency n (Hz)", frequencyHz);
  requirePositive("Strouhal number St", strouhalNumber);
  return (referenceLengthM * frequencyHz) / strouhalNumber;
}
