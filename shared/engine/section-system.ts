import type { StudyDocument } from "../schemas/study";
import type { ModalSystem } from "./core/modal-system";
import { emptyProducts } from "./aero/derivative-products";
import type { AeroModel } from "./aero/types";

/**
 * Reduced-frequency floor of the section model, 1e-3 (Ur ≈ 6 300): the frequency of static branches is zero,
 * and K = Bω/U is evaluated here instead. It equals the thin plate's own floor of its logarithmic term, so
 * the two agree; tabulated data are held at their last row long before it.
 */
export const SECTION_MIN_REDUCED_FREQUENCY = 1e-3;

/**
 * Maps a 2-DOF section-model study onto the n-mode core: coordinates in the order of `structure.modes`
 * (heave h in m, positive down; rotation α in rad, nose-up).
 *
 * Method: M = diag(m, I), C_s = diag(2 m ζ_h ω_h, 2 I ζ_α ω_α), K_s = diag(m ω_h², I ω_α²), and with the
 * products of the aerodynamic model (docs/conventions.md §Self-excited forces, Scanlan's form on the full width B)
 *   K_ae = ½ρU² [[K²H4*, B K²H3*], [B K²A4*, B² K²A3*]],
 *   C_ae = ½ρUB [[K H1*, B K H2*], [B K A1*, B² K A2*]]    (rows/columns h, α; permuted to the input order).
 * Source: Jain, Jones & Scanlan 1996, J. Struct. Eng. 122(7) (force form); Scanlan & Tomko 1971.
 * Notes: SI units throughout; density 0 turns the aerodynamic forces off (still-air check).
 * @param study a validated study document
 * @param aero the study's aerodynamic model (`createAeroModel(study.aerodynamics)`)
 */
export function sectionSystem(study: StudyDocument, aero: AeroModel): ModalSystem {
  const modes = study.structure.modes;
  const n = modes.length;
  const h = modes.findIndex((m) => m.dof === "heave");
  const a = modes.findIndex((m) => m.dof === "torsion");
  if (n !== 2 || h < 0 || a < 0) throw new Error("section model: needs exactly one heave and one torsion mode");
  const { mass: m, inertia: inertia } = study.structure;
  const rho = study.air.density;
  const b = study.deck.width;
  const massDiag = [0, 0];
  massDiag[h] = m;
  massDiag[a] = inertia;
  const mass = new Float64Array(4);
  const damping = new Float64Array(4);
  const stiffness = new Float64Array(4);
  modes.forEach((mode, i) => {
    const omega = 2 * Math.PI * mode.frequency;
    mass[i * 2 + i] = massDiag[i];
    damping[i * 2 + i] = 2 * massDiag[i] * mode.damping * omega;
    stiffness[i * 2 + i] = massDiag[i] * omega * omega;
  });
  const p = emptyProducts();
  const hh = h * 2 + h, ha = h * 2 + a, ah = a * 2 + h, aa = a * 2 + a;
  return {
    size: 2,
    mass,
    damping,
    stiffness,
    referenceLengthM: b,
    minReducedFrequency: SECTION_MIN_REDUCED_FREQUENCY,
    hasAero: rho > 0,
    aero(speed, k, kae, cae) {
      aero.products(k, p);
      const q = 0.5 * rho * speed * speed;
      const c = 0.5 * rho * speed * b;
      kae[hh] = q * p.k2H4;
      kae[ha] = q * b * p.k2H3;
      kae[ah] = q * b * p.k2A4;
      kae[aa] = q * b * b * p.k2A3;
      cae[hh] = c * p.kH1;
      cae[ha] = c * b * p.kH2;
      cae[ah] = c * b * p.kA1;
      cae[aa] = c * b * b * p.kA2;
    },
    isExtrapolated: (k) => aero.isExtrapolated(k),
    reducedFrequencyKnots: aero.reducedVelocityKnots?.map((ur) => (2 * Math.PI) / ur),
  };
}
