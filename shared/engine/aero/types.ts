/**
 * The contract between the aerodynamic models (flat plate, quasi-steady, tabulated test data) and the
 * p-k solver. Conventions of the study format: Scanlan's forces on the full deck width B, K = Bω/U,
 * Ur = U/(fB) = 2π/K, h and L downward, α and M nose-up.
 */

/** Flutter derivatives H1*..H4*, A1*..A4* (dimensionless, our normalisation) at one reduced frequency. */
export interface FlutterDerivatives {
  H1: number;
  H2: number;
  H3: number;
  H4: number;
  A1: number;
  A2: number;
  A3: number;
  A4: number;
}

/**
 * The products the solver needs, finite as K → 0 for tabulated and quasi-steady data:
 * K·H1*, K·H2*, K²·H3*, K²·H4*, K·A1*, K·A2*, K²·A3*, K²·A4*.
 */
export interface DerivativeProducts {
  kH1: number;
  kH2: number;
  k2H3: number;
  k2H4: number;
  kA1: number;
  kA2: number;
  k2A3: number;
  k2A4: number;
}

/** An aerodynamic model evaluated by the solver at each p-k iteration. */
export interface AeroModel {
  readonly kind: "tabulated" | "flat-plate" | "quasi-steady";
  /** Derivative products at reduced frequency K = Bω/U (K > 0). Writes into `out` when given. */
  products(K: number, out?: DerivativeProducts): DerivativeProducts;
  /** The derivatives themselves at K (for plots and tables). */
  derivatives(K: number): FlutterDerivatives;
  /** True when K lies outside the data's reduced-velocity range (values held from the nearest end). */
  isExtrapolated(K: number): boolean;
  /**
   * Static moment slope S = dC_M/dα per radian (moment on ½ρU²B²), the K → 0 limit of K²A3*,
   * used by the divergence closed form; null when the model cannot supply one.
   */
  readonly staticMomentSlope: number | null;
  /** Reduced-velocity range [min, max] of tabulated data; null for theoretical models. */
  readonly reducedVelocityRange: [number, number] | null;
  /** Reduced velocities at which the model changes character (a table's rows); absent for closed-form models. */
  readonly reducedVelocityKnots?: readonly number[];
}
