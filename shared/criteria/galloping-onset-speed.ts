import { requirePositive } from "./check-input";

/**
 * Onset wind speed of (translational) galloping by the standard's formula.
 *
 * **Method**: v_CG = 2 Sc n b / a_G.
 *
 * **Notes**: EN 1991-1-4:2005 Annex E.2.2, Expr. (E.18) (formula recalled; clause numbering from memory).
 * Sc from E.1.3.3 on the same b (cross-wind dimension, deck depth D), n the heave frequency, a_G the factor
 * of galloping instability (Table E.7, or −(dC_L/dα + C_D) with both coefficients on b). Computed check:
 * Sc = 42.67, n = 0.35 Hz, b = 3 m, a_G = 2.0 → 44.8 m/s.
 *
 * @param scruton - Scruton number Sc, dimensionless (≥ 0)
 * @param frequencyHz - heave natural frequency n, Hz
 * @param referenceLengthM - cross-wind dimension b, m
 * @param gallopingFactor - factor of galloping instability a_G, dimensionless (> 0)
 * @returns v_CG, m/s
 */
export function gallopingOnsetSpeed(
  scruton: number,
  frequencyHz: number,
  referenceLengthM: number,
  gallopingFactor: number,
): number {
  if (!(Number.isFinite(scruton) && scruton >= 0)) {
    throw new RangeError(`Scruton number must be a number of at least 0 (got ${scruton})`);
  }
  requirePositive("natural frequency n (Hz)", frequencyHz);
  requirePositive("cross-wind dimension b (m)", referenceLengthM);
  requirePositive("galloping factor a_G", gallopingFactor);
  return (2 * scruton * frequencyHz * referenceLengthM) / gallopingFactor;
}
