import type { ModalSystem } from "./modal-system";

/** Relative tolerance of the U², U scaling check. */
const SCALING_TOLERANCE = 1e-9;

/**
 * The aerodynamic stiffness and damping of a system per unit wind speed at a fixed reduced frequency:
 * K̂(K) = K_ae(U, K)/U² and Ĉ(K) = C_ae(U, K)/U, evaluated at U = 1 m/s.
 *
 * Method: Scanlan's self-excited forces are ½ρU² times functions of K alone (docs/method-and-validation.md §1),
 * so at fixed K the stiffness matrix scales with U² and the damping matrix with U. Callers check that once per
 * system with `assertScanlanScaling`.
 * @param system the n-mode system (with `hasAero`)
 * @param k reduced frequency K (> 0)
 * @param kae receives K̂ (n×n), N/m per (m/s)²
 * @param cae receives Ĉ (n×n), N·s/m per m/s
 */
export function aeroPerUnitSpeed(system: ModalSystem, k: number, kae: Float64Array, cae: Float64Array): void {
  system.aero(1, k, kae, cae);
}

/**
 * Checks the scaling `aeroPerUnitSpeed` relies on at two speeds (1 and 37 m/s) and two reduced frequencies (the
 * floor and 0.5); throws a plain Error naming the offending entry when a system breaks it.
 * @param system the n-mode system
 */
export function assertScanlanScaling(system: ModalSystem): void {
  if (!system.hasAero) return;
  const nn = system.size * system.size;
  const [k1, c1, k2, c2] = [0, 0, 0, 0].map(() => new Float64Array(nn));
  const speed = 37;
  for (const k of [system.minReducedFrequency, 0.5]) {
    system.aero(1, k, k1, c1);
    system.aero(speed, k, k2, c2);
    for (let i = 0; i < nn; i++) {
      const stiff = Math.abs(k2[i] - speed * speed * k1[i]);
      const damp = Math.abs(c2[i] - speed * c1[i]);
      if (stiff > SCALING_TOLERANCE * Math.abs(k2[i]) + 1e-300 || damp > SCALING_TOLERANCE * Math.abs(c2[i]) + 1e-300) {
        throw new Error(
          `modal system: at K = ${k} the aerodynamic stiffness must scale with U² and the damping with U (Scanlan's form); entry ${i} does not`,
        );
      }
    }
  }
}
