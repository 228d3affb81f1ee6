/**
 * The general aeroelastic system of n structural degrees of freedom solved by the p-k core.
 *
 * Equation of motion (per unit span for a section model, per generalized coordinate for a bridge):
 *   M ẍ + (C_s − C_ae(U, K)) ẋ + (K_s − K_ae(U, K)) x = 0,   K = L_ref ω / U,
 * with the self-excited forces F = K_ae x + C_ae ẋ on the right-hand side. The state matrix is
 *   A = [[0, I], [−M⁻¹(K_s − K_ae), −M⁻¹(C_s − C_ae)]];
 * a pole λ gives the frequency Im λ / 2π and the damping ratio ζ = −Re λ / |λ|.
 * Matrices are n×n, row-major, in consistent SI units (kg, N·s/m, N/m or their generalized equivalents).
 * The self-excited forces have Scanlan's form: at fixed K, K_ae scales with U² and C_ae with U (the static and the
 * harmonic determinants rely on it; `aeroPerUnitSpeed` checks it).
 */
export interface ModalSystem {
  /** Number of structural degrees of freedom n. */
  readonly size: number;
  /** Mass matrix M (n×n row-major). Symmetric positive definite. */
  readonly mass: Float64Array;
  /** Structural viscous damping C_s (n×n). */
  readonly damping: Float64Array;
  /** Structural stiffness K_s (n×n). */
  readonly stiffness: Float64Array;
  /** Reference length L_ref of the reduced frequency K = L_ref ω / U, m (the deck width B). */
  readonly referenceLengthM: number;
  /**
   * Smallest reduced frequency passed to `aero` (the floor: static branches and very high speeds are evaluated
   * there). Dimensionless, > 0.
   */
  readonly minReducedFrequency: number;
  /**
   * Fills the aerodynamic stiffness K_ae and damping C_ae (n×n row-major, same units as K_s and C_s) at wind
   * speed U (m/s, > 0) and reduced frequency K (> 0). Not called when `hasAero` is false.
   */
  aero(speedMps: number, reducedFrequency: number, stiffnessOut: Float64Array, dampingOut: Float64Array): void;
  /** False when the aerodynamic forces vanish identically (still air, density 0). */
  readonly hasAero: boolean;
  /** True when the aerodynamic data at K are held from the end of a table (extrapolated). Optional. */
  isExtrapolated?(reducedFrequency: number): boolean;
  /**
   * Reduced frequencies K at which the aerodynamic data change character (the rows of a table); the tracker visits
   * the speed at which each branch passes each of them. Optional (none for closed-form models).
   */
  readonly reducedFrequencyKnots?: readonly number[];
}

/**
 * Largest reduced frequency used in the iteration (10⁶). When L_ref ω / U would exceed it (U → 0, in particular
 * U = 0), the forces are evaluated at the effective speed U = L_ref ω / 10⁶ (of the order of 10⁻⁵ m/s) instead:
 * the thin plate then gives its added mass and inertia (finite as U → 0), while forces that vanish with U
 * (tabulated and quasi-steady data, the plate's circulatory terms) are ~10⁻⁶ of their value at 1 m/s.
 */
export const MAX_REDUCED_FREQUENCY = 1e6;

/** Checks the shape and finiteness of a system at the public entry; throws with a plain message. */
export function assertModalSystem(system: ModalSystem): void {
  const n = system.size;
  if (!Number.isInteger(n) || n < 1) throw new Error(`modal system: size must be a positive integer, got ${n}`);
  for (const [name, m] of [
    ["mass", system.mass],
    ["damping", system.damping],
    ["stiffness", system.stiffness],
  ] as const) {
    if (m.length !== n * n) throw new Error(`modal system: ${name} must hold ${n * n} entries, got ${m.length}`);
    for (let i = 0; i < m.length; i++) {
      if (!Number.isFinite(m[i])) throw new Error(`modal system: ${name}[${i}] is not a finite number`);
    }
  }
  for (let i = 0; i < n; i++) {
    if (!(system.mass[i * n + i] > 0)) throw new Error(`modal system: mass[${i}][${i}] must be positive`);
  }
  if (!(system.referenceLengthM > 0)) throw new Error("modal system: the reference length must be positive");
  if (!(system.minReducedFrequency > 0)) throw new Error("modal system: the reduced-frequency floor must be positive");
}
