/**
 * Selberg's empirical estimate of the coupled flutter speed of a thin-plate-like deck.
 *
 * Method: U_F = 3.71 f_α B √( √(m I) / (ρ B³) · (1 − (f_h / f_α)²) ) (Selberg 1961, "Oscillation and
 * aerodynamic stability of suspension bridges", Acta Polytechnica Scandinavica Ci 13; this grouping as in the
 * docs/conventions.md §Selberg — form from memory, checked numerically against thin-plate flutter).
 * Notes: defined only for f_α > f_h (null otherwise, or when ρ = 0). Within ~1–3 % of thin-plate flutter for
 * f_α/f_h ≥ 2, increasingly low below; an empirical reference whatever the aerodynamic model.
 * @param massKgPerM mass per unit length m, kg/m
 * @param inertiaKgM2PerM mass moment of inertia I, kg·m²/m
 * @param heaveFrequencyHz f_h, Hz
 * @param torsionFrequencyHz f_α, Hz
 * @param densityKgM3 ρ, kg/m³
 * @param widthM deck width B, m
 * @returns U_F in m/s, or null
 */
export function selbergSpeed(
  massKgPerM: number,
  inertiaKgM2PerM: number,
  heaveFrequencyHz: number,
  torsionFrequencyHz: number,
  densityKgM3: number,
  widthM: number,
): number | null {
  if (!(torsionFrequencyHz > heaveFrequencyHz) || !(densityKgM3 > 0)) return null;
  const ratio = heaveFrequencyHz / torsionFrequencyHz;
  const radicand = (Math.sqrt(massKgPerM * inertiaKgM2PerM) / (densityKgM3 * widthM ** 3)) * (1 - ratio * ratio);
  return 3.71 * torsionFrequencyHz * widthM * Math.sqrt(radicand);
}
