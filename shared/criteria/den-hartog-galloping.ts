import { requirePositive } from "./check-input";

export interface DenHartogResult {
  /** Den Hartog coefficient dC_L/dα + C_D (per radian; both coefficients on B), galloping possible when < 0. */
  coefficient: number;
  unstable: boolean;
  /** Onset speed when unstable, m/s; null when the criterion says no galloping. */
  onsetSpeedMps: number | null;
}

/**
 * Quasi-steady galloping check of the heave mode from static coefficients (Den Hartog).
 *
 * **Method**: aerodynamic heave damping ratio ζ_a = ρ U B (dC_L/dα + C_D) / (4 m ω); galloping when
 * dC_L/dα + C_D < 0 and ζ + ζ_a ≤ 0, i.e. from U = 4 m ζ ω / (−ρ B (dC_L/dα + C_D)).
 *
 * **Notes**: criterion from J.P. Den Hartog, *Mechanical Vibrations* (galloping of iced cables); the onset
 * speed is derived from the quasi-steady lift (docs/conventions.md §Quasi-steady derivatives, H1* = −(C_L′ + C_D)/K) and is identical to
 * EN 1991-1-4 E.2.2 (E.18) with a_G = −(dC_L/dα + C_D) when Sc uses b = B. Signs: lift positive up, α
 * nose-up, slope per radian. Valid for low-frequency galloping (high reduced velocity) only.
 *
 * @param liftSlope - dC_L/dα at the mean angle, per radian, on ½ρU²B
 * @param dragCoefficient - C_D on ½ρU²B, dimensionless (≥ 0)
 * @param massPerLengthKgM - mass per unit length m, kg/m
 * @param dampingRatio - structural damping ratio of the heave mode ζ, dimensionless
 * @param frequencyHz - heave natural frequency, Hz
 * @param airDensityKgM3 - air density ρ, kg/m³
 * @param deckWidthM - deck width B, m
 * @returns coefficient, verdict and onset speed in m/s
 */
export function denHartogGalloping(
  liftSlope: number,
  dragCoefficient: number,
  massPerLengthKgM: number,
  dampingRatio: number,
  frequencyHz: number,
  airDensityKgM3: number,
  deckWidthM: number,
): DenHartogResult {
  if (!Number.isFinite(liftSlope)) throw new RangeError(`lift slope must be a number (got ${liftSlope})`);
  if (!(Number.isFinite(dragCoefficient) && dragCoefficient >= 0)) {
    throw new RangeError(`drag coefficient must be a number of at least 0 (got ${dragCoefficient})`);
  }
  if (!(Number.isFinite(dampingRatio) && dampingRatio >= 0)) {
    throw new RangeError(`damping ratio must be a number of at least 0 (got ${dampingRatio})`);
  }
  requirePositive("mass per unit length (kg/m)", massPerLengthKgM);
  requirePositive("natural frequency (Hz)", frequencyHz);
  requirePositive("air density (kg/m³)", airDensityKgM3);
  requirePositive("deck width B (m)", deckWidthM);
  const coefficient = liftSlope + dragCoefficient;
  if (!(coefficient < 0)) return { coefficient, unstable: false, onsetSpeedMps: null };
  const omega = 2 * Math.PI * frequencyHz;
  const onsetSpeedMps = (4 * massPerLengthKgM * dampingRatio * omega) / (-airDensityKgM3 * deckWidthM * coefficient);
  return { coefficient, unstable: true, onsetSpeedMps };
}
