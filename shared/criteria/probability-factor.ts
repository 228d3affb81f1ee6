/** Recommended shape parameter K of Expr. (4.2) (EN 1991-1-4:2005 §4.2(2) Note 4). */
export const PROBABILITY_SHAPE_K = 0.2;
/** Recommended exponent n of Expr. (4.2). */
export const PROBABILITY_EXPONENT_N = 0.5;

/**
 * Probability factor c_prob that turns the 50-year basic wind speed into the speed with annual probability
 * of exceedance p.
 *
 * **Method**: c_prob = [(1 − K ln(−ln(1 − p))) / (1 − K ln(−ln 0.98))]^n.
 *
 * **Notes**: EN 1991-1-4:2005 §4.2(2) Note 4, Expr. (4.2), recommended K = 0.2, n = 0.5. p = 1/T for a
 * return period T in years; c_prob(50 yr) = 1. Computed values: 1.0385 (100 yr), 1.1565 (1000 yr),
 * 1.2635 (10 000 yr) [computed]. Valid for 0 < p < 1; the base of the power must stay positive, which the
 * routine checks for non-default K.
 *
 * @param annualProbability - annual probability of exceedance p (0 < p < 1)
 * @param shapeK - shape parameter K (default 0.2)
 * @param exponentN - exponent n (default 0.5)
 * @returns c_prob, dimensionless
 */
export function probabilityFactor(
  annualProbability: number,
  shapeK: number = PROBABILITY_SHAPE_K,
  exponentN: number = PROBABILITY_EXPONENT_N,
): number {
  if (!(Number.isFinite(annualProbability) && annualProbability > 0 && annualProbability < 1)) {
    throw new RangeError(`annual probability of exceedance p must lie between 0 and 1 (got ${annualProbability})`);
  }
  if (!Number.isFinite(shapeK) || !Number.isFinite(exponentN)) {
    throw new RangeError("shape parameter K and exponent n must be numbers");
  }
  const numerator = 1 - shapeK * Math.log(-Math.log(1 - annualProbability));
  const denominator = 1 - shapeK * Math.log(-Math.log(0.98));
  if (!(numerator > 0 && denominator > 0)) {
    throw new RangeError(`p = ${annualProbability} with K = ${shapeK} lies outside the range of Expr. (4.2)`);
  }
  return Math.pow(numerator / denominator, exponentN);
}

/** Annual probability of exceedance of a return period T in years: p = 1/T. */
export function returnPeriodToProbability(returnPeriodYears: number): number {
  if (!(Number.isFinite(returnPeriodYears) && returnPeriodYears > 1)) {
    throw new RangeError(`return period must be a number of years greater than 1 (got ${returnPeriodYears})`);
  }
  return 1 / returnPeriodYears;
}
