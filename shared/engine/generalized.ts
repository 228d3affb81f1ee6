import { emptyProducts } from "./aero/derivative-products";
import type { AeroModel } from "./aero/types";
import type { ModalSystem } from "./core/modal-system";
import { SECTION_MIN_REDUCED_FREQUENCY } from "./section-system";

/** One still-air mode of the full bridge, sampled at the stations along the deck. */
export interface GeneralizedModeInput {
  readonly id: string;
  /** Natural frequency, Hz. */
  readonly frequencyHz: number;
  /** Structural damping ratio of critical. */
  readonly damping: number;
  /** Vertical shape h_i(x), dimensionless: the deck's heave is h_i(x)·B·ξ_i (m). */
  readonly heave: ArrayLike<number>;
  /** Torsional shape α_i(x), rad per unit ξ_i. */
  readonly torsion: ArrayLike<number>;
}

export interface GeneralizedInput {
  /** Stations along the deck, m, strictly increasing (≥ 2). */
  readonly stationsM: ArrayLike<number>;
  /** Deck width B, m (reference length of the derivatives). */
  readonly widthM: number;
  /** Mass per unit length m, kg/m. */
  readonly massKgPerM: number;
  /** Mass moment of inertia per unit length I, kg·m²/m. */
  readonly inertiaKgM2PerM: number;
  /** Air density ρ, kg/m³. */
  readonly densityKgM3: number;
  readonly modes: readonly GeneralizedModeInput[];
  /** Sectional aerodynamics, the same along the deck. */
  readonly aero: AeroModel;
}

/** The n-mode system with the modal integrals it was built from. */
export interface GeneralizedSystem extends ModalSystem {
  /** Generalized masses M_i = ∫(m B² h_i² + I α_i²) dx, kg·m². */
  readonly generalizedMass: Float64Array;
  /** Modal integrals G_{r_i s_j} = (1/ℓ)∫ r_i s_j dx (n×n row-major), r, s ∈ {h, α}. */
  readonly integrals: { hh: Float64Array; ha: Float64Array; ah: Float64Array; aa: Float64Array };
}

/**
 * Builds the multimode aeroelastic system of a full bridge deck from still-air mode shapes (vertical and
 * torsional components) and sectional flutter derivatives.
 *
 * Method: with h(x,t) = Σ h_i(x) B ξ_i and α(x,t) = Σ α_i(x) ξ_i the generalized forces are
 *   Q_i = ∫(L h_i B + M α_i) dx, giving (ℓ = span of the stations)
 *   K_ae,ij = ½ρU²B²ℓ (K²H4* G_hihj + K²H3* G_hiαj + K²A4* G_αihj + K²A3* G_αiαj),
 *   C_ae,ij = ½ρUB³ℓ  (K H1* G_hihj + K H2* G_hiαj + K A1* G_αihj + K A2* G_αiαj),
 * with G_{r_i s_j} = (1/ℓ)∫ r_i s_j dx by the trapezoidal rule on the stations; structurally
 * M = diag(M_i), C_s = diag(2 M_i ζ_i ω_i), K_s = diag(M_i ω_i²) (still-air modes are mass-orthogonal).
 * Source: Jain, Jones & Scanlan 1996, J. Struct. Eng. 122(7); Chen & Kareem 2006, J. Eng. Mech. 132(10)
 * (docs/conventions.md §Multimode; lateral terms P1*..P6* and H5*, H6*, A5*, A6* are not included yet).
 * Notes: one vertical and one torsional shape with the same sine reproduce the section model exactly.
 * @param input stations, deck properties, modes and aerodynamics (SI units)
 */
export function generalizedSystem(input: GeneralizedInput): GeneralizedSystem {
  const x = input.stationsM;
  const s = x.length;
  if (s < 2) throw new Error("generalized system: need at least 2 stations");
  for (let k = 1; k < s; k++) if (!(x[k] > x[k - 1])) throw new Error("generalized system: stations must increase");
  const n = input.modes.length;
  if (n < 1) throw new Error("generalized system: need at least one mode");
  input.modes.forEach((mode, i) => {
    if (mode.heave.length !== s || mode.torsion.length !== s) {
      throw new Error(`generalized system: mode ${i} (${mode.id}) must have one value per station`);
    }
    if (!(mode.frequencyHz > 0)) throw new Error(`generalized system: mode ${mode.id} needs a positive frequency`);
  });
  const span = x[s - 1] - x[0];
  const b = input.widthM;
  const rho = input.densityKgM3;
  const weights = new Float64Array(s);
  for (let k = 0; k + 1 < s; k++) {
    const dx = x[k + 1] - x[k];
    weights[k] += dx / 2;
    weights[k + 1] += dx / 2;
  }
  const integral = (f: ArrayLike<number>, g: ArrayLike<number>) => {
    let sum = 0;
    for (let k = 0; k < s; k++) sum += weights[k] * f[k] * g[k];
    return sum;
  };
  const hh = new Float64Array(n * n);
  const ha = new Float64Array(n * n);
  const ah = new Float64Array(n * n);
  const aa = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      const mi = input.modes[i];
      const mj = input.modes[j];
      hh[i * n + j] = integral(mi.heave, mj.heave) / span;
      ha[i * n + j] = integral(mi.heave, mj.torsion) / span;
      ah[i * n + j] = integral(mi.torsion, mj.heave) / span;
      aa[i * n + j] = integral(mi.torsion, mj.torsion) / span;
    }
  }
  const generalizedMass = new Float64Array(n);
  const mass = new Float64Array(n * n);
  const damping = new Float64Array(n * n);
  const stiffness = new Float64Array(n * n);
  input.modes.forEach((mode, i) => {
    const mi = span * (input.massKgPerM * b * b * hh[i * n + i] + input.inertiaKgM2PerM * aa[i * n + i]);
    if (!(mi > 0)) throw new Error(`generalized system: mode ${mode.id} has a zero shape`);
    const omega = 2 * Math.PI * mode.frequencyHz;
    generalizedMass[i] = mi;
    mass[i * n + i] = mi;
    damping[i * n + i] = 2 * mi * mode.damping * omega;
    stiffness[i * n + i] = mi * omega * omega;
  });
  const p = emptyProducts();
  return {
    size: n,
    mass,
    damping,
    stiffness,
    referenceLengthM: b,
    minReducedFrequency: SECTION_MIN_REDUCED_FREQUENCY,
    hasAero: rho > 0,
    generalizedMass,
    integrals: { hh, ha, ah, aa },
    aero(speed, k, kae, cae) {
      input.aero.products(k, p);
      const q = 0.5 * rho * speed * speed * b * b * span;
      const c = 0.5 * rho * speed * b * b * b * span;
      for (let i = 0; i < n * n; i++) {
        kae[i] = q * (p.k2H4 * hh[i] + p.k2H3 * ha[i] + p.k2A4 * ah[i] + p.k2A3 * aa[i]);
        cae[i] = c * (p.kH1 * hh[i] + p.kH2 * ha[i] + p.kA1 * ah[i] + p.kA2 * aa[i]);
      }
    },
    isExtrapolated: (k) => input.aero.isExtrapolated(k),
    reducedFrequencyKnots: input.aero.reducedVelocityKnots?.map((ur) => (2 * Math.PI) / ur),
  };
}
