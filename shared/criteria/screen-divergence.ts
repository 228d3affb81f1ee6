import type { ScreeningOptions, ScreeningStudy } from "../schemas/criteria";
import { divergenceSpeed } from "./divergence-speed";
import type { CriticalSpeed } from "./margins";
import { SOURCES } from "./sources";
import { staticMomentSlope } from "./static-moment-slope";

export interface DivergenceScreening {
  speedMps: number | null;
  momentSlope: { value: number; origin: string } | null;
  torsionalStiffnessNmPerM: number;
  /** null when there is no torsion mode or no moment slope (not evaluated). */
  critical: CriticalSpeed | null;
  assumptions: string[];
  sources: string[];
}

/**
 * Torsional divergence screening by the closed form, not capped to any sweep range.
 *
 * **Method**: v_div = [2 k_Θ / (ρ B² dc_M/dΘ)]^0.5, k_Θ = I ω_α²; dc_M/dΘ from {@link staticMomentSlope}.
 *
 * **Notes**: EN 1991-1-4:2005 E.4.3, Expr. (E.24); "none" when the slope is ≤ 0. Needs ρ > 0.
 *
 * @param study - deck B (m), inertia (kg·m²/m), torsion mode (Hz), air density (kg/m³), aerodynamics
 * @param options - a static moment slope given with the request, per radian
 * @returns v_div (m/s) with the slope, the stiffness and the critical speed for the margins
 */
export function screenDivergence(study: ScreeningStudy, options: Pick<ScreeningOptions, "momentSlope"> = {}): DivergenceScreening {
  const B = study.deck.width;
  const inertia = study.structure.inertia;
  const torsion = study.structure.modes.find((mode) => mode.dof === "torsion") ?? null;
  const slope = staticMomentSlope(study.aerodynamics, options.momentSlope);
  const omega = torsion ? 2 * Math.PI * torsion.frequency : 0;
  const stiffness = inertia * omega * omega;
  const speed = torsion && slope ? divergenceSpeed(inertia, torsion.frequency, study.air.density, B, slope.value) : null;
  const critical: CriticalSpeed | null =
    !torsion || !slope
      ? null
      : speed === null
        ? { kind: "none", reason: `static moment slope dC_M/dα = ${slope.value.toFixed(2)} per rad ≤ 0.` }
        : { kind: "speed", speedMps: speed };
  return {
    speedMps: speed,
    momentSlope: slope,
    torsionalStiffnessNmPerM: stiffness,
    critical,
    assumptions: [
      `k_Θ = I ω_α² = ${stiffness.toExponential(4)} N·m/rad per m from I and the torsional frequency; b = B = ${B} m.`,
      slope ? `dC_M/dα = ${slope.value.toFixed(4)} per rad: ${slope.origin}.` : "No static moment slope available: divergence not evaluated.",
      "Compare with the engine's divergence speed and any static-instability warning of the sweep.",
    ],
    sources: [SOURCES.divergence, SOURCES.divergenceCriterion],
  };
}
