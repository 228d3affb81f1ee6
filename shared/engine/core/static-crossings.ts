import { EigenvalueDecomposition, Matrix, solve } from "ml-matrix";
import { MAX_STATE_ENTRY } from "./all-poles";
import { factorComplexLu, solveComplexLu } from "./complex-lu";
import { determinantSign } from "./determinant-sign";
import type { CriticalPoint } from "./locate-critical";
import { modalAssurance } from "./mac";
import type { ModalSystem } from "./modal-system";
import { normalizeModeVector } from "./mode-vector";
import type { TrackResult, TrackedStep } from "./track-poles";
import { aeroPerUnitSpeed, assertScanlanScaling } from "./unit-speed-aero";

/** |Im ν| below this fraction of |ν| counts as a real eigenvalue of K_s⁻¹K̂. */
const REAL_TOLERANCE = 1e-9;
/** Half-width of the bracket (relative) in which a root must change the determinant's sign. */
const SIGN_BRACKET = 1e-6;

/**
 * Every wind speed U > 0 at which the quasi-static stiffness det(K_s − K_ae(U, K_floor)) changes sign: the speeds
 * where a real (static) root of the p-k problem crosses zero, whatever the grid.
 *
 * Method: a real pole λ = 0 has ω = 0, so it is evaluated at the reduced-frequency floor, where K_ae = U²·K̂
 * (`aeroPerUnitSpeed`). det(K_s − μK̂) = 0 with μ = U² is the generalized eigenproblem K_s⁻¹K̂ x = (1/μ) x, solved
 * once (ml-matrix EigenvalueDecomposition); each real positive eigenvalue ν gives U = 1/√ν, which is polished by
 * bisection on the sign of the determinant (`determinantSign`) inside ±1e-6·U and kept only when the sign changes
 * there (a double root touches zero without crossing; docs/method-and-validation.md §3).
 * Notes: empty when the system has no aerodynamic forces. Exact to rounding: no sampling of U is involved.
 * @param system the n-mode system
 * @param upToMps crossings above this speed are left out (default: none)
 * @returns the crossing speeds, m/s, increasing
 */
export function staticCrossingSpeeds(system: ModalSystem, upToMps = Number.POSITIVE_INFINITY): number[] {
  if (!system.hasAero) return [];
  assertScanlanScaling(system);
  const n = system.size;
  const kae = new Float64Array(n * n);
  const cae = new Float64Array(n * n);
  aeroPerUnitSpeed(system, system.minReducedFrequency, kae, cae);
  const rows = (a: Float64Array) => Array.from({ length: n }, (_, i) => Array.from(a.subarray(i * n, i * n + n)));
  const reduced = solve(new Matrix(rows(system.stiffness)), new Matrix(rows(kae)));
  for (const x of reduced.to1DArray()) {
    if (!(Math.abs(x) <= MAX_STATE_ENTRY)) throw new RangeError(`static stiffness: the aerodynamic stiffness has an entry of ${x}, outside any physical range`);
  }
  const evd = new EigenvalueDecomposition(reduced, { assumeSymmetric: false });
  const work = new Float64Array(n * n);
  const sign = (u: number) => {
    for (let i = 0; i < n * n; i++) work[i] = system.stiffness[i] - u * u * kae[i];
    return determinantSign(n, work);
  };
  const speeds: number[] = [];
  evd.realEigenvalues.forEach((nu, k) => {
    if (!(nu > 0) || Math.abs(evd.imaginaryEigenvalues[k]) > REAL_TOLERANCE * nu) return;
    const guess = 1 / Math.sqrt(nu);
    if (guess * (1 - SIGN_BRACKET) > upToMps) return;
    let lo = guess * (1 - SIGN_BRACKET);
    let hi = guess * (1 + SIGN_BRACKET);
    const sLo = sign(lo);
    if (sLo === 0 || sLo === sign(hi)) return;
    for (let it = 0; it < 60 && hi - lo > 4 * Number.EPSILON * hi; it++) {
      const mid = 0.5 * (lo + hi);
      if (sign(mid) === sLo) lo = mid;
      else hi = mid;
    }
    speeds.push(0.5 * (lo + hi));
  });
  return speeds.sort((a, b) => a - b);
}

/**
 * Every static crossing of the sweep, lowest first: static instability (divergence as the sweep sees it, with every
 * aerodynamic coupling term included).
 *
 * Method: the crossings are the sign changes of the quasi-static stiffness (`staticCrossingSpeeds`), a property of
 * the system, not of a branch — so no grid step can lose one. Those inside [first, last speed] are listed; an odd
 * number below the first speed means the deck is already statically unstable there (`atStart`, at the first
 * speed). Each crossing is named after the tracked branch that holds its real root: among the branches that are
 * static next to it (else all), the one whose eigenvector correlates best (mass-weighted MAC) with the null vector
 * of K_s − K_ae at the crossing.
 * @param system the n-mode system that was tracked
 * @param track the tracker's branches
 * @returns the crossings sorted by speed (empty when none)
 */
export function locateStaticCrossings(system: ModalSystem, track: TrackResult): CriticalPoint[] {
  const steps = track.branches[0];
  if (!steps || steps.length === 0) return [];
  const from = steps[0].speedMps;
  const to = steps[steps.length - 1].speedMps;
  const roots = staticCrossingSpeeds(system, to);
  const found: CriticalPoint[] = [];
  const below = roots.filter((u) => u < from).length;
  if (below % 2 === 1) found.push(crossingAt(system, track, from, true));
  for (const u of roots) if (u >= from && u <= to) found.push(crossingAt(system, track, u, false));
  return found;
}

/** The lowest of `locateStaticCrossings`, or null. */
export function locateStaticCrossing(system: ModalSystem, track: TrackResult): CriticalPoint | null {
  return locateStaticCrossings(system, track)[0] ?? null;
}

function crossingAt(system: ModalSystem, track: TrackResult, speed: number, atStart: boolean): CriticalPoint {
  const n = system.size;
  const vecRe = nullVector(system, speed);
  const vecIm = new Float64Array(n);
  normalizeModeVector(n, system.mass, vecRe, vecIm);
  const speeds = track.branches[0];
  let b = speeds.findIndex((s) => s.speedMps > speed);
  if (b < 0) b = speeds.length - 1;
  const a = Math.max(0, b - 1);
  const isStatic = (j: number) => track.branches[j][a].im === 0 || track.branches[j][b].im === 0;
  const candidates = track.branches.map((_, j) => j).filter(isStatic);
  let branch = -1;
  let best = -1;
  for (const j of candidates.length > 0 ? candidates : track.branches.map((_, j) => j)) {
    const s = track.branches[j][b];
    const mac = modalAssurance(n, system.mass, vecRe, vecIm, s.vecRe, s.vecIm);
    if (mac > best) {
      best = mac;
      branch = j;
    }
  }
  const step: TrackedStep = {
    speedMps: speed,
    re: 0,
    im: 0,
    vecRe,
    vecIm,
    reducedFrequency: system.minReducedFrequency,
    mac: Number.NaN,
    confidence: Number.NaN,
    converged: true,
    extrapolated: system.isExtrapolated?.(system.minReducedFrequency) ?? false,
  };
  return { branch, speedMps: speed, step, atStart };
}

/** Null vector of K_s − U²K̂ at a crossing, by one step of inverse iteration (real). */
function nullVector(system: ModalSystem, speed: number): Float64Array {
  const n = system.size;
  const kae = new Float64Array(n * n);
  const cae = new Float64Array(n * n);
  aeroPerUnitSpeed(system, system.minReducedFrequency, kae, cae);
  const re = new Float64Array(n * n);
  const im = new Float64Array(n * n);
  const pivots = new Int32Array(n);
  const x = new Float64Array(n).fill(1);
  const xi = new Float64Array(n);
  for (let attempt = 0; attempt < 4; attempt++) {
    const u = speed * (1 + attempt * 1e-12);
    for (let i = 0; i < n * n; i++) re[i] = system.stiffness[i] - u * u * kae[i];
    im.fill(0);
    if (!factorComplexLu(n, re, im, pivots)) continue;
    for (let it = 0; it < 2; it++) {
      solveComplexLu(n, re, im, pivots, x, xi);
      const norm = Math.max(...Array.from(x, Math.abs));
      if (!(norm > 0) || !Number.isFinite(norm)) break;
      for (let i = 0; i < n; i++) x[i] /= norm;
      xi.fill(0);
    }
    return x;
  }
  return x;
}
