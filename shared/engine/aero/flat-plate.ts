import { theodorsen } from "./theodorsen";
import { derivativesFromProducts, emptyProducts } from "./derivative-products";
import type { AeroModel, DerivativeProducts } from "./types";

/**
 * Reduced frequency below which the logarithmically growing term G/K of K·H2* and K·A2* is held at its value
 * here (G/K ≈ −3.85 at 1e-3; −2.66 at 1e-2; −7.31 at 1e-6). Ur = 2π/K ≈ 6 300.
 */
export const FLAT_PLATE_LOG_TERM_FLOOR_K = 1e-3;

/**
 * Theodorsen's thin flat plate (axis at mid-chord) as flutter derivatives in the study convention.
 *
 * Method: with C(k) = F + iG at k = K/2 (`theodorsen`), the closed forms of docs/conventions.md §Flat plate written as
 * the products the solver uses:
 *   K·H1* = −2πF,   K·H2* = −(π/2)(1 + F + 4G/K),   K²H3* = −2π(F − KG/4),   K²H4* = (π/2)(K² + 4KG),
 *   K·A1* = πF/2,   K·A2* = −(π/8)(1 − F − 4G/K),  K²A3* = (π/2)(K²/32 + F − KG/4), K²A4* = −πKG/2.
 * Source: Theodorsen, NACA Report 496 (1935); lift and moment as in Bisplinghoff, Ashley & Halfman,
 * Aeroelasticity (1955), turned into Scanlan's form on the full width B with h and L downward (L = −L_up),
 * α and M nose-up; the derivative form follows Scanlan & Tomko (1971) / Simiu & Scanlan, rescaled to B.
 *
 * Notes:
 * - As K → 0 (steady flow) K·H1* → −2π, K²H3* → −2π, K·A1* → π/2, K²A3* → π/2 and K²H4*, K²A4* → 0, and
 *   these are evaluated exactly down to K = 0. Only G/K in K·H2* and K·A2* grows (like ln K): it is evaluated
 *   at max(K, FLAT_PLATE_LOG_TERM_FLOOR_K). Oscillatory branches of real decks stay far above the floor
 *   (B = 10–60 m, f ≥ 0.05 Hz, U ≤ 300 m/s give K > 0.01); only near-static poles reach it, and the choice
 *   barely matters there because the growth is logarithmic and the term multiplies the pole's small rate.
 * - As K → ∞ (U → 0) K²H4* and K²A3* grow like K²: the apparent mass πρB²/4 and apparent inertia πρB⁴/128
 *   of the plate, which stay in ½ρU²K²(…) = finite forces in still air. This is physical, not an error:
 *   flat-plate poles at U → 0 sit slightly below the structural ones (by the added mass), unless ρ = 0.
 */
export function createFlatPlateModel(): AeroModel {
  const fg = new Float64Array(2);
  const work = new Float64Array(4);
  const floorK = FLAT_PLATE_LOG_TERM_FLOOR_K;
  const fourGOverKAtFloor = (4 * theodorsen(0.5 * floorK, fg, work)[1]) / floorK;

  function products(K: number, out: DerivativeProducts = emptyProducts()): DerivativeProducts {
    if (!(K >= 0) || K === Infinity) throw new RangeError(`reduced frequency K must be finite and ≥ 0 (got ${K})`);
    theodorsen(0.5 * K, fg, work);
    const F = fg[0];
    const G = fg[1];
    const kG = K * G;
    const logTerm = K >= FLAT_PLATE_LOG_TERM_FLOOR_K ? (4 * G) / K : fourGOverKAtFloor;
    out.kH1 = -2 * Math.PI * F;
    out.kH2 = -0.5 * Math.PI * (1 + F + logTerm);
    out.k2H3 = -2 * Math.PI * (F - 0.25 * kG);
    out.k2H4 = 0.5 * Math.PI * (K * K + 4 * kG);
    out.kA1 = 0.5 * Math.PI * F;
    out.kA2 = -0.125 * Math.PI * (1 - F - logTerm);
    out.k2A3 = 0.5 * Math.PI * ((K * K) / 32 + F - 0.25 * kG);
    out.k2A4 = -0.5 * Math.PI * kG;
    return out;
  }

  return {
    kind: "flat-plate",
    products,
    derivatives: (K) => derivativesFromProducts(K, products(K)),
    isExtrapolated: () => false,
    staticMomentSlope: Math.PI / 2,
    reducedVelocityRange: null,
  };
}
