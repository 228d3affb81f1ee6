import { derivativesFromProducts, emptyProducts } from "./derivative-products";
import type { AeroModel, DerivativeProducts } from "./types";

/** Static aerodynamic coefficients of a section (coefficients on ½ρU²B and ½ρU²B², slopes per radian). */
export interface QuasiSteadyCoefficients {
  /** dC_L/dα per radian, lift positive up. */
  liftSlope: number;
  /** C_D on B. */
  dragCoefficient: number;
  /** dC_M/dα per radian, moment nose-up, on ½ρU²B². */
  momentSlope: number;
}

/**
 * The simplest quasi-steady model: the section responds to the effective angle α + ḣ/U (a deck moving down
 * sees the wind from below) with its static coefficients.
 *
 * Method: L_up = ½ρU²B [C_L′ α + (C_L′ + C_D) ḣ/U], M = ½ρU²B² C_M′ (α + ḣ/U); in the study convention
 * (h and L downward) this is K·H1* = −(C_L′ + C_D), K²H3* = −C_L′, K·A1* = C_M′, K²A3* = C_M′ and
 * H2* = A2* = H4* = A4* = 0, the same products at every K.
 * Source: Den Hartog's quasi-steady argument (J. P. Den Hartog, Mechanical Vibrations, 4th ed., 1956, the
 * galloping section — §7.7 from memory); Simiu & Scanlan, Wind Effects on Structures (quasi-steady
 * self-excited forces); docs/conventions.md §Quasi-steady derivatives.
 *
 * Notes: heave aerodynamic damping −½ρUB·K·H1* is negative exactly when C_L′ + C_D < 0 (Den Hartog's galloping
 * criterion). With A2* = 0 the torsional mode gets no aerodynamic damping, so coupled flutter speeds from this
 * model can be far too low; it is meant for galloping and high reduced velocities (common practice). With
 * C_L′ = 2π, C_D = 0, C_M′ = π/2 it reproduces the flat plate's steady limits.
 *
 * @param coefficients - C_L′ (1/rad), C_D (–), C_M′ (1/rad), all finite
 */
export function createQuasiSteadyModel(coefficients: QuasiSteadyCoefficients): AeroModel {
  const { liftSlope, dragCoefficient, momentSlope } = coefficients;
  for (const [name, value] of Object.entries({ liftSlope, dragCoefficient, momentSlope })) {
    if (!Number.isFinite(value)) throw new RangeError(`quasi-steady ${name} must be a finite number (got ${value})`);
  }
  const kH1 = -(liftSlope + dragCoefficient);
  const k2H3 = -liftSlope;

  function products(K: number, out: DerivativeProducts = emptyProducts()): DerivativeProducts {
    if (!(K >= 0) || K === Infinity) throw new RangeError(`reduced frequency K must be finite and ≥ 0 (got ${K})`);
    out.kH1 = kH1;
    out.kH2 = 0;
    out.k2H3 = k2H3;
    out.k2H4 = 0;
    out.kA1 = momentSlope;
    out.kA2 = 0;
    out.k2A3 = momentSlope;
    out.k2A4 = 0;
    return out;
  }

  return {
    kind: "quasi-steady",
    products,
    derivatives: (K) => derivativesFromProducts(K, products(K)),
    isExtrapolated: () => false,
    staticMomentSlope: momentSlope,
    reducedVelocityRange: null,
  };
}
