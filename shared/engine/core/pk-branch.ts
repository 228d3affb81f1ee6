import type { ModalSystem } from "./modal-system";
import { normalizeModeVector } from "./mode-vector";
import { assembleQuadratic, type PoleWorkspace } from "./quadratic-operator";
import { refinePole, type Pole } from "./refine-pole";

/** Relative frequency change at which the p-k iteration stops. */
export const PK_TOLERANCE = 1e-9;
/** Iteration cap of the p-k loop; hitting it is reported as `no-convergence`. */
export const PK_MAX_ITERATIONS = 60;
/** From this iteration on, a bracketed p-k iteration bisects (guaranteed progress where g(ω) has kinks). */
const BISECT_AFTER = 12;
/** |Im λ| below this fraction of |λ| counts as a real pole (static branch). */
export const STATIC_IM_TOLERANCE = 1e-10;

/** Outcome of one branch's p-k iteration at one speed. */
export interface PkOutcome {
  /** Converged pole (rad/s) with its eigenvector normalised to unit kinetic norm. */
  readonly pole: Pole;
  /** Reduced frequency K = Bω/U the pole was computed at (after floor/ceiling). */
  reducedFrequency: number;
  iterations: number;
  converged: boolean;
}

/** Picks this branch's pole among all poles of the eigenproblem at the current iterate (robust mode). */
export type PoleSelector = (poles: Pole[]) => Pole;

/** Allocates a reusable outcome record for n degrees of freedom. */
export function createPkOutcome(n: number): PkOutcome {
  return {
    pole: { re: 0, im: 0, vecRe: new Float64Array(n), vecIm: new Float64Array(n) },
    reducedFrequency: 0,
    iterations: 0,
    converged: false,
  };
}

/**
 * p-k iteration of one branch at one wind speed: frequency → K → aerodynamic matrices → this branch's pole →
 * new frequency, until the relative change of the frequency is below 1e-9.
 *
 * Method: the fixed point ω = Im λ(K(ω)) of the p-k method (Hassig 1971, "An approximate true damping solution
 * of the flutter equation by determinant iteration", J. Aircraft 8(11)), accelerated by the secant method on
 * g(ω) = Im λ(ω) − ω once two iterates exist (falling back to the plain fixed-point update when the secant step is
 * implausible); once iterates on both sides of g = 0 exist the update stays inside that bracket (regula falsi)
 * and, from the 12th iteration, bisects it — so kinks of g (table ends, interpolation knots) cannot make the
 * iteration cycle. Each iterate's pole comes either from a warm-started Newton
 * refinement (`refinePole`, fast path) or from a full decomposition filtered by `select` (robust path).
 * Notes: the iteration stops when |Δω| ≤ 1e-9·|λ| (|λ| keeps the test meaningful on static branches, where
 * ω → 0 and K sits at the floor); after 60 iterations `converged` is false.
 * @param system the n-mode system
 * @param mass M (n×n)
 * @param work workspace
 * @param speedMps wind speed U, m/s
 * @param guess starting pole and eigenvector (previous speed or predictor)
 * @param out receives the converged pole
 * @param select when given, the pole of the first iterate is chosen by it from `allPoles` (later iterates,
 *   whose K changes little, follow that pole by Newton refinement)
 * @param allPolesOf full decomposition routine (robust path only)
 */
export function solveBranchPk(
  system: ModalSystem,
  work: PoleWorkspace,
  speedMps: number,
  guess: Pole,
  out: PkOutcome,
  select?: PoleSelector,
  allPolesOf?: () => Pole[],
): PkOutcome {
  const n = system.size;
  const pole = out.pole;
  let lr = guess.re;
  let li = guess.im;
  pole.vecRe.set(guess.vecRe);
  pole.vecIm.set(guess.vecIm);
  let omega = Math.abs(li);
  let prevOmega = Number.NaN;
  let prevG = Number.NaN;
  // the latest frequencies with g = Im λ − ω above and below zero (a bracket of the fixed point once both exist)
  let lowOmega = Number.NaN;
  let lowG = Number.NaN;
  let highOmega = Number.NaN;
  let highG = Number.NaN;
  out.converged = false;
  work.factored = false; // Jacobian factors from another branch or speed are not reused
  let it: number;
  let k = 0;
  for (it = 1; it <= PK_MAX_ITERATIONS; it++) {
    k = assembleQuadratic(system, speedMps, omega, work);
    if (select && allPolesOf && it === 1) {
      // robust path: the branch's pole is chosen among all poles once; later iterates follow it by Newton
      const chosen = select(allPolesOf());
      lr = chosen.re;
      li = chosen.im;
      pole.vecRe.set(chosen.vecRe);
      pole.vecIm.set(chosen.vecIm);
    } else {
      const startRe = lr;
      const startIm = li;
      if (!refinePole(system.mass, work, lr, li, pole.vecRe, pole.vecIm, pole)) {
        // Newton failed (e.g. a diverging iterate): keep the last good pole and report no convergence
        out.converged = false;
        pole.re = startRe;
        pole.im = startIm;
        break;
      }
      lr = pole.re;
      li = pole.im;
    }
    const omegaNew = Math.abs(li);
    const g = omegaNew - omega;
    if (Math.abs(g) <= PK_TOLERANCE * Math.max(Math.hypot(lr, li), 1e-300)) {
      out.converged = true;
      break;
    }
    if (g > 0) {
      lowOmega = omega;
      lowG = g;
    } else {
      highOmega = omega;
      highG = g;
    }
    let next = omegaNew;
    if (Number.isFinite(prevG) && g !== prevG) {
      const secant = omega - (g * (omega - prevOmega)) / (g - prevG);
      if (secant > 0 && Math.abs(secant - omegaNew) <= 0.5 * Math.max(omegaNew, omega)) next = secant;
    }
    if (Number.isFinite(lowOmega) && Number.isFinite(highOmega)) {
      // a sign change of g is bracketed: stay inside it (regula falsi), and bisect once the secant lingers
      const a = Math.min(lowOmega, highOmega);
      const b = Math.max(lowOmega, highOmega);
      if (it >= BISECT_AFTER) next = 0.5 * (a + b);
      else if (!(next > a && next < b)) next = lowOmega - (lowG * (highOmega - lowOmega)) / (highG - lowG);
    }
    prevOmega = omega;
    prevG = g;
    omega = next;
  }
  // a pole within rounding of the real axis is real (a static branch): snap it so that callers can test im === 0
  if (Math.abs(li) <= STATIC_IM_TOLERANCE * Math.hypot(lr, li)) li = 0;
  if (li < 0) {
    // the conjugate of a pole of a real system is a pole: keep the upper half-plane member
    li = -li;
    for (let i = 0; i < n; i++) pole.vecIm[i] = -pole.vecIm[i];
  }
  pole.re = lr;
  pole.im = li;
  normalizeModeVector(n, system.mass, pole.vecRe, pole.vecIm);
  out.reducedFrequency = k;
  out.iterations = Math.min(it, PK_MAX_ITERATIONS);
  return out;
}
