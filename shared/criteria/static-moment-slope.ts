import type { StudyAerodynamics } from "../schemas/study";

export interface MomentSlope {
  /** dC_M/dα per radian, moment on ½ρU²B². */
  value: number;
  /** Where the slope comes from, for the assumptions list. */
  origin: string;
}

/**
 * Static moment slope S = dC_M/dα of a study's aerodynamics, in the order of docs/conventions.md §Divergence.
 *
 * **Method**: π/2 for the flat plate (Theodorsen's steady limit), the quasi-steady model's momentSlope, a
 * tabulated set's staticMomentSlope, or K²A3* at the table's largest reduced velocity (K = 2π/Ur) — the order the
 * engine's aerodynamic models follow (shared/engine/aero), so the origin named here is the engine's.
 *
 * **Notes**: K²A3* at finite Ur only approximates the static slope (the K → 0 limit); the origin says so.
 *
 * @param aerodynamics - the study's aerodynamic model
 * @returns the slope with its origin, or null when none can be found
 */
export function staticMomentSlope(aerodynamics: StudyAerodynamics): MomentSlope | null {
  switch (aerodynamics.model) {
    case "flat-plate":
      return { value: Math.PI / 2, origin: "flat plate: π/2 (steady limit of Theodorsen's theory)" };
    case "quasi-steady":
      return { value: aerodynamics.momentSlope, origin: "quasi-steady data set: momentSlope" };
    case "tabulated": {
      if (aerodynamics.staticMomentSlope !== undefined) {
        return { value: aerodynamics.staticMomentSlope, origin: "tabulated data set: staticMomentSlope" };
      }
      const ur = aerodynamics.reducedVelocity;
      const a3 = aerodynamics.A3;
      if (!a3 || a3.length !== ur.length || ur.length === 0) return null;
      const last = ur.length - 1;
      const k = (2 * Math.PI) / ur[last];
      return {
        value: k * k * a3[last],
        origin: `tabulated data set: K²A3* at the largest reduced velocity Ur = ${ur[last]} (an approximation of the static slope)`,
      };
    }
  }
}
